/**
 * The split-conformal quantile of conformity scores (Lei et al. 2018, §2.2): the k-th smallest score
 * with k = ⌈(n + 1)(1 − α)⌉, which gives coverage ≥ 1 − α for exchangeable data; null when k > n
 * (too few calibration points: the interval is unbounded).
 * @param scores - n ≥ 1 finite scores ≥ 0.
 * @param coverage - 1 − α in (0, 1).
 * @returns the quantile, or null.
 */
export function conformalQuantile(scores: readonly number[], coverage: number): number | null {
  const n = scores.length;
  // The 1e-9 guards against (n + 1)(1 − α) landing a rounding error above an integer (e.g. 1000 × 0.9).
  const k = Math.ceil((n + 1) * coverage - 1e-9);
  if (k > n) return null;
  const sorted = Float64Array.from(scores).sort();
  return sorted[Math.max(k, 1) - 1]!;
}
