/**
 * Number of legal values of a stepped range: min + k·step for k = 0 … ⌊(max − min)/step⌋ (derived; the 1e-9
 * absorbs rounding when max − min is a whole number of steps, e.g. (45 − 25)/0.1).
 * @param min - lower bound.
 * @param max - upper bound (≥ min).
 * @param step - the step (> 0).
 * @returns the count (≥ 1).
 */
export function latticeCount(min: number, max: number, step: number): number {
  return Math.floor((max - min) / step + 1e-9) + 1;
}
