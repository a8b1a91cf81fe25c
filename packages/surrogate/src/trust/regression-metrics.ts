import { checkVector } from "./check-vector.js";
import { percentile } from "./percentile.js";

/** Error metrics of predictions against true values (one target). */
export interface RegressionMetrics {
  /** Number of rows. */
  readonly n: number;
  /** Root mean squared error √(Σ(y − ŷ)²/n). */
  readonly rmse: number;
  /** Mean absolute error Σ|y − ŷ|/n. */
  readonly mae: number;
  /** Largest absolute error max|y − ŷ|. */
  readonly maxAbsError: number;
  /**
   * Coefficient of determination 1 − Σ(y − ŷ)²/Σ(y − ȳ)². NaN (null in JSON) when the target is
   * constant, because the ratio is then undefined (scikit-learn's `force_finite=False` gives NaN for
   * a perfect fit and −Infinity otherwise; we give NaN for both and say so in the report).
   */
  readonly r2: number;
  /** Mean error Σ(ŷ − y)/n: positive when the model over-predicts. */
  readonly bias: number;
  /** Median of |y − ŷ|/|y| over rows with y ≠ 0; NaN when every y is 0. */
  readonly medianRelError: number;
  /** 95th percentile (linear interpolation) of |y − ŷ|/|y| over rows with y ≠ 0; NaN when every y is 0. */
  readonly p95RelError: number;
  /** Number of rows with y ≠ 0 used by the relative errors. */
  readonly nRelative: number;
}

/**
 * Computes RMSE, MAE, max abs error, R², bias and relative errors of predictions.
 * Definitions as in scikit-learn 1.2 (mean_squared_error, mean_absolute_error, max_error, r2_score);
 * bias and relative errors are common practice. Sums run on values divided by a power of two near the largest
 * magnitude (exact in binary floating point), so values near 1e308, whose squares overflow, still give finite
 * metrics wherever the metric itself is representable.
 * @param yTrue - true values, finite, non-empty.
 * @param yPred - predictions, same length, finite.
 * @returns the metrics.
 */
export function regressionMetrics(yTrue: readonly number[], yPred: readonly number[]): RegressionMetrics {
  const y = checkVector("regressionMetrics", "yTrue", yTrue);
  const p = checkVector("regressionMetrics", "yPred", yPred, y.length);
  const n = y.length;
  if (n === 0) throw new RangeError("regressionMetrics: yTrue must not be empty");
  let largest = 0;
  for (let i = 0; i < n; i++) largest = Math.max(largest, Math.abs(y[i]!), Math.abs(p[i]!));
  // s = 2^k ≤ largest < 2^(k+1): dividing by it is exact and keeps every scaled value in [−1, 1].
  const s = largest > 0 ? 2 ** Math.floor(Math.log2(largest)) : 1;
  let sse = 0;
  let sae = 0;
  let maxAbs = 0;
  let sum = 0;
  let sumErr = 0;
  const rel: number[] = [];
  for (let i = 0; i < n; i++) {
    const e = p[i]! / s - y[i]! / s;
    sse += e * e;
    sae += Math.abs(e);
    if (Math.abs(e) > maxAbs) maxAbs = Math.abs(e);
    sum += y[i]! / s;
    sumErr += e;
    if (y[i] !== 0) rel.push(Math.abs(e) / Math.abs(y[i]! / s));
  }
  const mean = sum / n;
  let sst = 0;
  let constant = true;
  for (let i = 0; i < n; i++) {
    sst += (y[i]! / s - mean) ** 2;
    if (y[i] !== y[0]) constant = false;
  }
  return {
    n,
    rmse: Math.sqrt(sse / n) * s,
    mae: (sae / n) * s,
    maxAbsError: maxAbs * s,
    r2: constant ? NaN : 1 - sse / sst,
    bias: (sumErr / n) * s,
    medianRelError: rel.length === 0 ? NaN : percentile(rel, 0.5),
    p95RelError: rel.length === 0 ? NaN : percentile(rel, 0.95),
    nRelative: rel.length,
  };
}
