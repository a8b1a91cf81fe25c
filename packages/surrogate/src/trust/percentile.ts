/**
 * Percentile of a sample by linear interpolation between order statistics: with the values sorted,
 * h = (n − 1)·q and the result is x[⌊h⌋] + (h − ⌊h⌋)(x[⌊h⌋+1] − x[⌊h⌋]). This is Hyndman & Fan's
 * definition 7, numpy.percentile's default ("linear").
 * @param values - finite numbers (not modified); must not be empty.
 * @param q - probability in [0, 1].
 * @returns the q-quantile.
 */
export function percentile(values: readonly number[], q: number): number {
  if (!Array.isArray(values)) throw new TypeError("percentile: values must be an array");
  if (values.length === 0) throw new RangeError("percentile: values must not be empty");
  if (!(q >= 0 && q <= 1)) throw new RangeError(`percentile: q must be in [0, 1], got ${q}`);
  const s = Float64Array.from(values).sort();
  if (Number.isNaN(s[s.length - 1]!)) throw new RangeError("percentile: values must not contain NaN");
  const h = (s.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, s.length - 1);
  const f = h - lo;
  return f === 0 ? s[lo]! : s[lo]! + f * (s[hi]! - s[lo]!);
}
