import type { Surrogate } from "@floorcast/surrogate";
import type { Variable } from "@floorcast/sampler";
import type { Design } from "../optimize/optimization-problem.js";
import { designRow } from "./design-row.js";

/**
 * What a surrogate predicted at a design that was then evaluated exactly: per output, the
 * predicted mean, its sd (null when the model gives none), the exact value and exact − mean.
 */
export interface SurrogateAtOptimum {
  readonly mean: Readonly<Record<string, number>>;
  readonly sd: Readonly<Record<string, number>> | null;
  readonly exact: Readonly<Record<string, number>>;
  /** exact − mean, per output: positive when the surrogate under-predicted. */
  readonly difference: Readonly<Record<string, number>>;
}

/**
 * The surrogate's prediction at an exactly evaluated design, beside the exact values of the
 * problem's outputs (objectives and constrained outputs) and their differences.
 * @param model - the surrogate the optimizer ran on.
 * @param variables - its input variables, in order.
 * @param design - the design.
 * @param exact - the design's exact outputs.
 * @param outputs - the outputs to report (each a target of the model).
 * @returns mean, sd, exact and exact − mean per output.
 */
export function surrogateAtOptimum(
  model: Surrogate,
  variables: readonly Variable[],
  design: Design,
  exact: Readonly<Record<string, number>>,
  outputs: readonly string[],
): SurrogateAtOptimum {
  const p = model.predict([designRow(variables, design)]);
  const column = (k: string): number => model.targets.indexOf(k);
  const pick = (row: readonly number[]) => Object.fromEntries(outputs.map((k) => [k, row[column(k)]!]));
  const mean = pick(p.mean[0]!);
  const sd = p.sd ? pick(p.sd[0]!) : null;
  const exactValues = Object.fromEntries(outputs.map((k) => [k, exact[k]!]));
  const difference = Object.fromEntries(outputs.map((k) => [k, exact[k]! - mean[k]!]));
  return { mean, sd, exact: exactValues, difference };
}
