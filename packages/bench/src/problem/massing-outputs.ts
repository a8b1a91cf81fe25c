import { MASSING_OUTPUT_COLUMNS } from "@floorcast/sampler";
import type { MassingResult } from "@floorcast/sampler";
import type { Outputs } from "../optimise/optimisation-problem.js";

/** A numeric field of MassingResult. */
type NumericMassingOutput = Exclude<(typeof MASSING_OUTPUT_COLUMNS)[number], "limitedBy" | "coverageCapped">;

/**
 * The numeric MassingResult fields a problem may optimise or constrain: the sampler's dataset
 * columns without the categorical `limitedBy` and the flag `coverageCapped`.
 */
export const MASSING_OUTPUTS: readonly NumericMassingOutput[] = MASSING_OUTPUT_COLUMNS.filter(
  (c): c is NumericMassingOutput => c !== "limitedBy" && c !== "coverageCapped",
);

/**
 * The numeric outputs of a massing result (every {@link MASSING_OUTPUTS} field), or all NaN when
 * there is no result (the design could not be evaluated).
 * @param result - the exact result, or null.
 */
export function massingOutputs(result: MassingResult | null): Outputs {
  return Object.fromEntries(MASSING_OUTPUTS.map((k) => [k, result ? result[k] : Number.NaN]));
}
