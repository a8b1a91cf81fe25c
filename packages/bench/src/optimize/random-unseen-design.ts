import type { VariableCodec } from "@floorcast/sampler";
import { unitSamples, type Rng } from "./unit-samples.js";

/**
 * The fallback of Bayesian optimization when the acquisition finds nothing to gain: the first of 64 random legal
 * designs that has not been evaluated yet (one draw of 64 points from the optimizer's generator).
 * @param codec - the problem's variable codec.
 * @param rng - the optimizer's seeded generator.
 * @param seen - coded designs already evaluated, as `x.join(",")`.
 * @returns a coded design, or undefined when all 64 were seen (a small design space is then exhausted).
 */
export function randomUnseenDesign(codec: VariableCodec, rng: Rng, seen: ReadonlySet<string>): number[] | undefined {
  return unitSamples(64, codec.dims, "random", rng).map((u) => codec.fromUnit(u)).find((c) => !seen.has(c.join(",")));
}
