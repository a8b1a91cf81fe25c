/**
 * Median of evaluations-to-target counts over seeds, a run that never reached the target counting
 * as worse than every other.
 * @param v - per seed, the count or null (not reached).
 * @returns the median, or null when it falls on a run that never reached the target.
 */
export function medianEvaluations(v: readonly (number | null)[]): number | null {
  const sorted = [...v].map((x) => x ?? Infinity).sort((a, b) => a - b);
  const m = sorted.length % 2 === 1 ? sorted[(sorted.length - 1) / 2]! : (sorted[sorted.length / 2 - 1]! + sorted[sorted.length / 2]!) / 2;
  return Number.isFinite(m) ? m : null;
}
