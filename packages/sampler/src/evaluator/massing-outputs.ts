import type { MassingResult } from "../massing/massing-types.js";

/** The scalar columns of MassingResult, in the order datasets write them. */
export const MASSING_OUTPUT_COLUMNS = [
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
  "limitedBy",
  "coverageCapped",
] as const;

/**
 * Flattens a massing result into its scalar columns: every number as is, `limitedBy` as its string and
 * `coverageCapped` as 1 (true) or 0 (false), so that numeric CSV readers take it as a number.
 * @param result - the result of evaluateMassing.
 * @returns one value per MASSING_OUTPUT_COLUMNS entry, in that order.
 */
export function massingOutputs(result: MassingResult): Record<string, number | string> {
  return {
    lotArea: result.lotArea,
    buildableArea: result.buildableArea,
    footprintArea: result.footprintArea,
    floors: result.floors,
    height: result.height,
    gfa: result.gfa,
    far: result.far,
    coverage: result.coverage,
    openSpace: result.openSpace,
    facadeLength: result.facadeLength,
    limitedBy: result.limitedBy,
    coverageCapped: result.coverageCapped ? 1 : 0,
  };
}
