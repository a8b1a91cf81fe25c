import seedrandom from "seedrandom";
import { shuffleInPlace } from "../seeded-shuffle.js";

/**
 * A uniformly random permutation of 0…n−1 (Fisher–Yates, Knuth TAOCP vol. 2, Algorithm P), drawing
 * from seedrandom seeded with `String(seed)`.
 * @param n - length, a non-negative integer.
 * @param seed - explicit seed.
 * @returns the permutation.
 */
export function seededPermutation(n: number, seed: number): number[] {
  const p = Array.from({ length: n }, (_, i) => i);
  shuffleInPlace(p, seedrandom(String(seed)));
  return p;
}
