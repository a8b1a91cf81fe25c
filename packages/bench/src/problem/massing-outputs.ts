import { MASSING_OUTPUT_COLUMNS, massingOutputs } from "@floorcast/sampler";
import type { MassingResult } from "@floorcast/sampler";
import type { Outputs } from "../optimize/optimization-problem.js";

/** A numeric field of MassingResult. */
type NumericMassingOutput = Exclude<(typeof MASSING_OUTPUT_COLUMNS)[number], "limitedBy" | "coverageCapped">;

/**
 * The numeric MassingResult fields a problem may optimize or constrain: the sampler's dataset
 * columns without the categorical `limitedBy` and the flag `coverageCapped`.
 */
export const MASSING_OUTPUTS: readonly NumericMassingOutput[] = MASSING_OUTPUT_COLUMNS.filter(
  (c): c is NumericMassingOutput => c !== "limitedBy" && c !== "coverageCapped",
);

/**
 * A problem's outputs of a massing result: the {@link MASSING_OUTPUTS} columns of the sampler's one massing
 * adapter (massingOutputs, the columns `sample` writes), or all NaN when there is no result (the design could not
 * be evaluated).
 * @param result - the exact result, or null.
 * @returns output name → value.
 */
export function problemMassingOutputs(result: MassingResult | null): Outputs {
  const columns = result ? massingOutputs(result) : undefined;
  return Object.fromEntries(MASSING_OUTPUTS.map((k) => [k, columns ? (columns[k] as number) : Number.NaN]));
}
