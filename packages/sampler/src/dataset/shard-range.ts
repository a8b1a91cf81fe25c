import type { Shard } from "./shard.js";

/**
 * The rows of shard k of N: the contiguous slice [⌊(k−1)·n/N⌋, ⌊k·n/N⌋) of the design's n rows, so the
 * N slices cover 0 … n−1 once each, in order, and differ in size by at most one (derived).
 * @param n - design size, an integer ≥ 1.
 * @param shard - shard k of N (default 1 of 1).
 * @returns start (inclusive) and end (exclusive) row indices.
 * @throws RangeError for a bad n or shard; shard count may not exceed n.
 */
export function shardRange(n: number, shard: Shard = { index: 1, count: 1 }): { start: number; end: number } {
  if (!Number.isSafeInteger(n) || n < 1) throw new RangeError(`shardRange: n must be an integer ≥ 1, got ${n}`);
  const { index, count } = shard;
  if (!Number.isSafeInteger(count) || count < 1 || count > n) {
    throw new RangeError(`shardRange: shard.count must be an integer in [1, n = ${n}], got ${count}`);
  }
  if (!Number.isSafeInteger(index) || index < 1 || index > count) {
    throw new RangeError(`shardRange: shard.index must be an integer in [1, ${count}], got ${index}`);
  }
  return { start: Math.floor(((index - 1) * n) / count), end: Math.floor((index * n) / count) };
}
