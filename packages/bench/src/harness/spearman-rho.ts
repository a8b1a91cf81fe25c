import { averageRanks } from "./average-ranks.js";
import { checkPairedSamples } from "./check-paired-samples.js";

/**
 * Spearman's rank correlation: Pearson's correlation of the average ranks (ties share their mean
 * rank), as in scipy.stats.spearmanr (Spearman 1904; Kendall & Gibbons, Rank Correlation Methods).
 * @param x - first sample, finite.
 * @param y - paired second sample, finite, same length (≥ 2).
 * @returns rho in [−1, 1]; NaN when either sample is constant (no ranking to correlate).
 */
export function spearmanRho(x: readonly number[], y: readonly number[]): number {
  checkPairedSamples("spearmanRho", x, y);
  const rx = averageRanks(x);
  const ry = averageRanks(y);
  const n = rx.length;
  const mean = (n + 1) / 2;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = rx[i]! - mean;
    const dy = ry[i]! - mean;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  if (sxx === 0 || syy === 0) return Number.NaN;
  return Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
}
