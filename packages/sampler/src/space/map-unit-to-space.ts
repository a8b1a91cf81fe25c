import type { DesignSpace } from "./design-space.js";
import { createUnitRowMapper } from "./unit-row-mapper.js";

/**
 * Turns unit-cube rows (one coordinate per parameter, in order) into parameter records.
 *
 * - continuous: min + x·(max − min); with `log`, exp(ln min + x·(ln max − ln min)); with `step`, the lattice
 *   min + k·step (k < L = ⌊(max − min)/step⌋ + 1) is treated as L levels, as an integer parameter is.
 * - integer (L = max − min + 1 levels) and categorical (L levels): when the column is Latin (one point in
 *   each of the n strata, as every LHS column is), the point in stratum k gets level ⌊(k + c)·L/n⌋, where
 *   c ∈ [0, 1) is the offset n·x of the point in stratum 0 (½ for centred designs; x·L itself when n = 1).
 *   Each level then holds ⌊n/L⌋ or ⌈n/L⌉ points (derived: level ℓ gets the integers k in
 *   [ℓn/L − c, (ℓ+1)n/L − c), an interval of length n/L). Otherwise the level is ⌊x·L⌋ (x = 1 goes to the
 *   last level), which is balanced for Sobol' nets whose size is a multiple of L.
 * @param space - the design space (validated).
 * @param unitRows - rows of coordinates in [0, 1], each as long as the parameter list.
 * @returns one record per row, keyed by parameter name.
 * @throws TypeError/RangeError for a bad space or rows (wrong length, non-finite or outside [0, 1]).
 */
export function mapUnitToSpace(
  space: DesignSpace,
  unitRows: readonly (readonly number[])[],
): Record<string, number | string>[] {
  const recordOf = createUnitRowMapper(space, unitRows, "mapUnitToSpace");
  return unitRows.map((_, i) => recordOf(i));
}
