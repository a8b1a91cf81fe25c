import { checkPairedSamples } from "./check-paired-samples.js";

/**
 * Share of the k highest-scoring items by one score that are also among the k highest by the
 * other (common practice for comparing shortlists). Ties at the cut are broken by index, so the
 * result is deterministic.
 * @param exact - reference scores (higher is better), finite.
 * @param estimate - paired estimated scores, finite, same length.
 * @param k - shortlist length, integer in [1, n].
 * @returns |top_k(exact) ∩ top_k(estimate)| / k, in [0, 1].
 */
export function topKOverlap(exact: readonly number[], estimate: readonly number[], k: number): number {
  checkPairedSamples("topKOverlap", exact, estimate);
  if (!Number.isInteger(k) || k < 1 || k > exact.length) {
    throw new RangeError(`topKOverlap: k must be an integer in [1, ${exact.length}], got ${k}`);
  }
  const top = (v: readonly number[]): Set<number> =>
    new Set(
      v
        .map((_, i) => i)
        .sort((a, b) => v[b]! - v[a]! || a - b)
        .slice(0, k),
    );
  const a = top(exact);
  let shared = 0;
  for (const i of top(estimate)) if (a.has(i)) shared++;
  return shared / k;
}
