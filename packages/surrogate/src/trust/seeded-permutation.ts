import seedrandom from "seedrandom";

/**
 * A uniformly random permutation of 0…n−1 by the Fisher–Yates shuffle (Knuth, TAOCP vol. 2,
 * Algorithm P), drawing from seedrandom seeded with `String(seed)`.
 * @param n - length, a non-negative integer.
 * @param seed - explicit seed.
 * @returns the permutation.
 */
export function seededPermutation(n: number, seed: number): number[] {
  const rng = seedrandom(String(seed));
  const p = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rng() * (i + 1));
    const t = p[i]!;
    p[i] = p[j]!;
    p[j] = t;
  }
  return p;
}
