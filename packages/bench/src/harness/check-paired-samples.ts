/**
 * Validates two paired samples for a rank statistic: arrays of equal length ≥ 2 with finite entries.
 * @param fn - name of the calling function, for the message.
 * @throws TypeError when either is not an array of numbers; RangeError on a length mismatch,
 *   fewer than two pairs, or a non-finite entry.
 */
export function checkPairedSamples(fn: string, x: readonly number[], y: readonly number[]): void {
  if (!Array.isArray(x) || !Array.isArray(y)) throw new TypeError(`${fn}: x and y must be arrays`);
  if (x.length !== y.length) {
    throw new RangeError(`${fn}: x and y must have the same length, got ${x.length} and ${y.length}`);
  }
  if (x.length < 2) throw new RangeError(`${fn}: need at least 2 pairs, got ${x.length}`);
  for (const [name, v] of [["x", x], ["y", y]] as const) {
    for (let i = 0; i < v.length; i++) {
      if (typeof v[i] !== "number") throw new TypeError(`${fn}: ${name}[${i}] must be a number`);
      if (!Number.isFinite(v[i])) throw new RangeError(`${fn}: ${name}[${i}] must be finite, got ${v[i]}`);
    }
  }
}
