/** Smallest sd used to normalise scores, so a zero sd never divides by zero (common practice). */
export const SD_FLOOR = 1e-12;

/**
 * Split-conformal interval around a base prediction (Lei et al. 2018, §2.2): μ ± q for "absolute"
 * scores, μ ± q·max(σ, 1e-12) for "normalised" scores; a null quantile gives an unbounded interval.
 * @param mean - rows × targets base means.
 * @param sd - rows × targets base sds (required for "normalised").
 * @param quantiles - one calibrated quantile per target.
 * @param score - which conformity score the quantiles were calibrated on.
 */
export function conformalInterval(
  mean: readonly (readonly number[])[],
  sd: readonly (readonly number[])[] | undefined,
  quantiles: readonly (number | null)[],
  score: "absolute" | "normalised",
): { lower: number[][]; upper: number[][] } {
  const lower: number[][] = [];
  const upper: number[][] = [];
  mean.forEach((row, i) => {
    const lo: number[] = [];
    const hi: number[] = [];
    row.forEach((mu, j) => {
      const q = quantiles[j];
      const half = q === null || q === undefined ? Infinity : score === "normalised" ? q * Math.max(sd![i]![j]!, SD_FLOOR) : q;
      lo.push(mu - half);
      hi.push(mu + half);
    });
    lower.push(lo);
    upper.push(hi);
  });
  return { lower, upper };
}
