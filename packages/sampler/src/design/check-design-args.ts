import seedrandom from "seedrandom";

/** A seeded uniform generator on [0, 1) with 32-bit integer draws. */
export interface SeededRandom {
  (): number;
  int32(): number;
}

/**
 * Checks a count (n, dims, m) passed to a public design function.
 * @throws TypeError when not a number; RangeError when not an integer ≥ min (NaN, ±Infinity, fractions).
 */
export function checkCount(caller: string, field: string, value: unknown, min = 1): number {
  if (typeof value !== "number") throw new TypeError(`${caller}: ${field} must be a number, got ${typeof value}`);
  if (!Number.isInteger(value) || value < min) {
    throw new RangeError(`${caller}: ${field} must be an integer ≥ ${min}, got ${value}`);
  }
  return value;
}

/**
 * Makes the seeded generator for a public design function (every draw goes through seedrandom).
 * @param seed - a finite number or a string.
 * @throws TypeError/RangeError for a missing or non-finite seed.
 */
export function seededRandom(caller: string, seed: unknown): SeededRandom {
  if (typeof seed === "number") {
    if (!Number.isFinite(seed)) throw new RangeError(`${caller}: seed must be finite, got ${seed}`);
  } else if (typeof seed !== "string") {
    throw new TypeError(`${caller}: seed must be a number or a string, got ${typeof seed}`);
  }
  return seedrandom(String(seed)) as unknown as SeededRandom;
}

/**
 * Checks points given to a public metric or design function: an array of equally long rows of finite numbers.
 * @param unitCube - also require every coordinate in [0, 1].
 * @returns the number of dimensions (0 for no points).
 */
export function checkPoints(
  caller: string,
  points: unknown,
  unitCube: boolean,
): number {
  if (!Array.isArray(points)) throw new TypeError(`${caller}: points must be an array of rows`);
  let d = -1;
  points.forEach((row: unknown, i) => {
    if (!Array.isArray(row)) throw new TypeError(`${caller}: points[${i}] must be an array`);
    if (d === -1) d = row.length;
    if (row.length !== d) {
      throw new RangeError(`${caller}: points[${i}] has ${row.length} coordinates, points[0] has ${d}`);
    }
    if (d === 0) throw new RangeError(`${caller}: points[${i}] must have at least one coordinate`);
    row.forEach((x: unknown, j) => {
      if (typeof x !== "number") throw new TypeError(`${caller}: points[${i}][${j}] must be a number`);
      if (!Number.isFinite(x)) throw new RangeError(`${caller}: points[${i}][${j}] must be finite, got ${x}`);
      if (unitCube && !(x >= 0 && x <= 1)) {
        throw new RangeError(`${caller}: points[${i}][${j}] must be in [0, 1], got ${x}`);
      }
    });
  });
  return Math.max(d, 0);
}
