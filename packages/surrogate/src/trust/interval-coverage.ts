import { checkVector } from "./check-vector.js";

/** Empirical coverage of given prediction intervals (e.g. split-conformal) against their stated coverage. */
export interface IntervalCoverage {
  readonly n: number;
  /** Coverage the intervals claim, e.g. 0.9. */
  readonly nominal: number;
  /** Fraction of rows with lower ≤ y ≤ upper. */
  readonly empirical: number;
  /** Mean width upper − lower (units of y). */
  readonly meanWidth: number;
}

/**
 * Empirical coverage of prediction intervals: the fraction of observations inside [lower, upper]
 * (for split-conformal intervals it is at least the nominal level in expectation: Lei et al. 2018, Thm 2.1).
 * @param yTrue - observations (finite, non-empty).
 * @param lower - interval lower bounds, same length.
 * @param upper - interval upper bounds, same length, each ≥ lower.
 * @param nominal - stated coverage in (0, 1).
 * @returns coverage and mean width.
 */
export function intervalCoverage(
  yTrue: readonly number[],
  lower: readonly number[],
  upper: readonly number[],
  nominal: number,
): IntervalCoverage {
  const fn = "intervalCoverage";
  const y = checkVector(fn, "yTrue", yTrue);
  const lo = checkVector(fn, "lower", lower, y.length, false);
  const hi = checkVector(fn, "upper", upper, y.length, false);
  if (y.length === 0) throw new RangeError(`${fn}: yTrue must not be empty`);
  if (typeof nominal !== "number" || !(nominal > 0 && nominal < 1)) throw new RangeError(`${fn}: nominal must be in (0, 1), got ${nominal}`);
  let inside = 0;
  let width = 0;
  for (let i = 0; i < y.length; i++) {
    if (Number.isNaN(lo[i]!) || Number.isNaN(hi[i]!) || hi[i]! < lo[i]!) {
      throw new RangeError(`${fn}: interval ${i} must have lower ≤ upper, got [${lo[i]}, ${hi[i]}]`);
    }
    if (lo[i]! <= y[i]! && y[i]! <= hi[i]!) inside++;
    width += hi[i]! - lo[i]!;
  }
  return { n: y.length, nominal, empirical: inside / y.length, meanWidth: width / y.length };
}
