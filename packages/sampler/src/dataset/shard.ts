/** Shard k of N (1-based) of a design of n rows. */
export interface Shard {
  /** 1-based shard number k. */
  readonly index: number;
  /** Number of shards N. */
  readonly count: number;
}

/**
 * Parses `"k/N"` (1 ≤ k ≤ N) into a shard.
 * @param text - e.g. "2/8".
 * @returns the shard.
 * @throws RangeError `parseShard: shard must look like k/N with 1 ≤ k ≤ N, got …`.
 */
export function parseShard(text: string): Shard {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(String(text));
  const index = m ? Number(m[1]) : NaN;
  const count = m ? Number(m[2]) : NaN;
  if (!(index >= 1 && index <= count && Number.isSafeInteger(count))) {
    throw new RangeError(`parseShard: shard must look like k/N with 1 ≤ k ≤ N, got ${JSON.stringify(text)}`);
  }
  return { index, count };
}
