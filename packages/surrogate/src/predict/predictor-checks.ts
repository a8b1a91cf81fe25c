/**
 * Checks that `v` is an array of `length` finite numbers (any length when `length` is undefined).
 * @returns the values as a Float64Array.
 * @throws TypeError / RangeError naming `label`.
 */
export function finiteVector(fn: string, label: string, v: unknown, length?: number): Float64Array {
  if (!Array.isArray(v)) throw new TypeError(`${fn}: ${label} must be an array of numbers`);
  if (length !== undefined && v.length !== length) {
    throw new RangeError(`${fn}: ${label} must have ${length} values, got ${v.length}`);
  }
  const out = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) {
    const x: unknown = v[i];
    if (typeof x !== "number" || !Number.isFinite(x)) {
      throw new RangeError(`${fn}: ${label}[${i}] must be a finite number, got ${String(x)}`);
    }
    out[i] = x;
  }
  return out;
}

/**
 * Checks a batch of rows to predict and copies it row-major into a Float64Array.
 * @throws TypeError / RangeError naming `x[row][col]`.
 */
export function packRows(fn: string, x: readonly (readonly number[])[], width: number): Float64Array {
  if (!Array.isArray(x)) throw new TypeError(`${fn}: x must be an array of rows`);
  const out = new Float64Array(x.length * width);
  for (let i = 0; i < x.length; i++) {
    const row = x[i];
    if (!Array.isArray(row)) throw new TypeError(`${fn}: x[${i}] must be an array`);
    if (row.length !== width) throw new RangeError(`${fn}: x[${i}] must have ${width} values, got ${row.length}`);
    for (let j = 0; j < width; j++) {
      const v: unknown = row[j];
      if (typeof v !== "number" || !Number.isFinite(v)) {
        throw new RangeError(`${fn}: x[${i}][${j}] must be a finite number, got ${String(v)}`);
      }
      out[i * width + j] = v;
    }
  }
  return out;
}

/** Splits a row-major rows × width buffer into nested arrays. */
export function unpackRows(buf: Float64Array, rows: number, width: number): number[][] {
  const out: number[][] = new Array(rows);
  for (let i = 0; i < rows; i++) {
    const row = new Array<number>(width);
    for (let j = 0; j < width; j++) row[j] = buf[i * width + j]!;
    out[i] = row;
  }
  return out;
}

/** Reads a plain object, or throws a TypeError naming `label`. */
export function objectField(fn: string, label: string, v: unknown): Record<string, unknown> {
  if (typeof v !== "object" || v === null || Array.isArray(v)) throw new TypeError(`${fn}: ${label} must be an object`);
  return v as Record<string, unknown>;
}
