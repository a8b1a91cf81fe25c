import type { ModelFamily } from "./model-family.js";
import { gpFamily } from "./gp/gp-family.js";
import { nnFamily } from "./nn/nn-family.js";
import { plateStackFamily } from "./plate-stack/plate-stack-family.js";

/**
 * Every surrogate family, in the order `floorcast fit --help` lists them. Adding a family: one folder under
 * `families/` exporting a {@link ModelFamily}, and one line here; `fit`, `assess` refits and `bench` pick it up.
 */
export const MODEL_FAMILIES: readonly ModelFamily[] = [
  gpFamily,
  nnFamily,
  plateStackFamily,
];

/**
 * The family of a `--model` name.
 * @param name - e.g. "gp".
 * @returns the family, or undefined.
 */
export function modelFamily(name: string): ModelFamily | undefined {
  return MODEL_FAMILIES.find((f) => f.name === name);
}
