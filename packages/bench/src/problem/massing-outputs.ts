import type { MassingResult } from "@floorcast/sampler";
import type { Outputs } from "../optimise/optimisation-problem.js";

/** The numeric MassingResult fields a problem may optimise or constrain. */
export const MASSING_OUTPUTS = [
  "lotArea",
  "buildableArea",
  "footprintArea",
  "floors",
  "height",
  "gfa",
  "far",
  "coverage",
  "openSpace",
  "facadeLength",
] as const;

/**
 * The numeric outputs of a massing result (every {@link MASSING_OUTPUTS} field), or all NaN when
 * there is no result (the design could not be evaluated).
 * @param result - the exact result, or null.
 */
export function massingOutputs(result: MassingResult | null): Outputs {
  return Object.fromEntries(MASSING_OUTPUTS.map((k) => [k, result ? result[k] : Number.NaN]));
}
