/**
 * Validates a numeric vector at a public entry point.
 * @param fn - name of the calling function, for the message.
 * @param field - name of the argument, for the message.
 * @param v - the value to check.
 * @param n - required length, when known.
 * @param finite - whether every element must be finite.
 * @returns v, typed.
 */
export function checkVector(fn: string, field: string, v: unknown, n?: number, finite = true): readonly number[] {
  if (!Array.isArray(v) && !ArrayBuffer.isView(v)) throw new TypeError(`${fn}: ${field} must be an array of numbers`);
  const a = v as readonly unknown[];
  if (n !== undefined && a.length !== n) {
    throw new RangeError(`${fn}: ${field} must have length ${n}, got ${a.length}`);
  }
  for (let i = 0; i < a.length; i++) {
    const x = a[i];
    if (typeof x !== "number") throw new TypeError(`${fn}: ${field}[${i}] must be a number, got ${typeof x}`);
    if (finite && !Number.isFinite(x)) throw new RangeError(`${fn}: ${field}[${i}] must be finite, got ${x}`);
  }
  return a as readonly number[];
}
