/** Affine map of each input column to the unit cube: `u = (x − lower) / (upper − lower)`. */
export interface InputScaling {
  readonly lower: readonly number[];
  readonly upper: readonly number[];
}

/**
 * Builds the unit-cube input scaling, from declared bounds when given, otherwise from the data's range.
 * A column whose range is zero keeps a span of 1 when scaled (see {@link scaleInputs}).
 * @param x - training rows × inputs (already validated finite).
 * @param bounds - optional declared `{ lower, upper }` per input.
 * @returns the scaling to store with the model (common practice: min–max scaling).
 */
export function createInputScaling(
  x: readonly (readonly number[])[],
  bounds?: { readonly lower: readonly number[]; readonly upper: readonly number[] },
): InputScaling {
  const d = x[0]?.length ?? bounds?.lower.length ?? 0;
  if (bounds) {
    if (bounds.lower.length !== d || bounds.upper.length !== d) {
      throw new RangeError(`createInputScaling: bounds must have ${d} entries per side`);
    }
    for (let k = 0; k < d; k++) {
      const lo = bounds.lower[k]!;
      const hi = bounds.upper[k]!;
      if (!Number.isFinite(lo) || !Number.isFinite(hi) || hi < lo) {
        throw new RangeError(`createInputScaling: bounds[${k}] must be finite with lower ≤ upper, got [${lo}, ${hi}]`);
      }
    }
    return { lower: [...bounds.lower], upper: [...bounds.upper] };
  }
  const lower = new Array<number>(d).fill(Infinity);
  const upper = new Array<number>(d).fill(-Infinity);
  for (const row of x) {
    for (let k = 0; k < d; k++) {
      const v = row[k]!;
      if (v < lower[k]!) lower[k] = v;
      if (v > upper[k]!) upper[k] = v;
    }
  }
  return { lower, upper };
}

/**
 * Maps rows to the unit cube of a scaling into a flat row-major Float64Array (rows × d).
 * A zero-width column is divided by 1 instead of 0 (so constant inputs stay finite).
 * @param scaling - from {@link createInputScaling}.
 * @param x - rows × inputs.
 * @returns flat scaled rows.
 */
export function scaleInputs(scaling: InputScaling, x: readonly (readonly number[])[]): Float64Array {
  const d = scaling.lower.length;
  const out = new Float64Array(x.length * d);
  for (let i = 0; i < x.length; i++) {
    const row = x[i]!;
    for (let k = 0; k < d; k++) {
      out[i * d + k] = (row[k]! - scaling.lower[k]!) / inputSpan(scaling, k);
    }
  }
  return out;
}

/**
 * The divisor used for input column k: `upper − lower`, or 1 when that is zero.
 * @param scaling - the input scaling.
 * @param k - column index.
 * @returns the positive span.
 */
export function inputSpan(scaling: InputScaling, k: number): number {
  const span = scaling.upper[k]! - scaling.lower[k]!;
  return span > 0 ? span : 1;
}
