import { checkPairedSamples } from "./check-paired-samples.js";

/**
 * Kendall's tau-b: (concordant − discordant) / √((n₀ − n₁)(n₀ − n₂)), where n₀ = n(n−1)/2 and
 * n₁, n₂ count pairs tied in x and in y (Kendall 1945; the default variant of scipy.stats.kendalltau).
 * O(n²) pair count, fine for the few hundred sites a ranking compares.
 * @param x - first sample, finite.
 * @param y - paired second sample, finite, same length (≥ 2).
 * @returns tau-b in [−1, 1]; NaN when either sample is constant.
 */
export function kendallTau(x: readonly number[], y: readonly number[]): number {
  checkPairedSamples("kendallTau", x, y);
  const n = x.length;
  let concordant = 0;
  let discordant = 0;
  let tiesX = 0;
  let tiesY = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const dx = x[i]! - x[j]!;
      const dy = y[i]! - y[j]!;
      if (dx === 0) tiesX++;
      if (dy === 0) tiesY++;
      if (dx === 0 || dy === 0) continue;
      if (dx > 0 === dy > 0) concordant++;
      else discordant++;
    }
  }
  const n0 = (n * (n - 1)) / 2;
  const denominator = Math.sqrt((n0 - tiesX) * (n0 - tiesY));
  if (denominator === 0) return Number.NaN;
  return Math.max(-1, Math.min(1, (concordant - discordant) / denominator));
}
