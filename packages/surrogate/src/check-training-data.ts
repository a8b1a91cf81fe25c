import type { TrainingData } from "./surrogate-types.js";

/**
 * Validates training data at a public entry point: names are strings, `x` is rows × inputs and
 * `y` rows × targets of finite numbers, with at least one row.
 * @param fn - the calling function's name, used to start every message.
 * @param data - the data to check.
 * @throws TypeError for a wrong type; RangeError for an empty set, a ragged row or a non-finite cell
 *   (the message names the row and column, e.g. `fitMlp: data.x[3][1] must be finite, got NaN`).
 */
export function checkTrainingData(fn: string, data: TrainingData): void {
  if (typeof data !== "object" || data === null) throw new TypeError(`${fn}: data must be an object`);
  for (const field of ["inputs", "targets"] as const) {
    const names = data[field];
    if (!Array.isArray(names)) throw new TypeError(`${fn}: data.${field} must be an array of names`);
    if (names.length === 0) throw new RangeError(`${fn}: data.${field} must name at least one column`);
    names.forEach((n, i) => {
      if (typeof n !== "string") throw new TypeError(`${fn}: data.${field}[${i}] must be a string`);
    });
  }
  for (const field of ["x", "y"] as const) {
    if (!Array.isArray(data[field])) throw new TypeError(`${fn}: data.${field} must be an array of rows`);
  }
  if (data.x.length === 0) throw new RangeError(`${fn}: data.x must have at least one row, got 0`);
  if (data.y.length !== data.x.length) {
    throw new RangeError(`${fn}: data.y must have ${data.x.length} rows (as data.x), got ${data.y.length}`);
  }
  checkMatrix(fn, "data.x", data.x, data.inputs.length);
  checkMatrix(fn, "data.y", data.y, data.targets.length);
}

/**
 * Checks that `rows` is a list of `width`-long arrays of finite numbers.
 * @throws TypeError / RangeError naming `label[row][col]`.
 */
export function checkMatrix(
  fn: string,
  label: string,
  rows: readonly (readonly number[])[],
  width: number,
): void {
  if (!Array.isArray(rows)) throw new TypeError(`${fn}: ${label} must be an array of rows`);
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    if (!Array.isArray(row)) throw new TypeError(`${fn}: ${label}[${i}] must be an array`);
    if (row.length !== width) {
      throw new RangeError(`${fn}: ${label}[${i}] must have ${width} values, got ${row.length}`);
    }
    for (let j = 0; j < width; j++) {
      const v = row[j];
      if (typeof v !== "number") throw new TypeError(`${fn}: ${label}[${i}][${j}] must be a number`);
      if (!Number.isFinite(v)) throw new RangeError(`${fn}: ${label}[${i}][${j}] must be finite, got ${v}`);
    }
  }
}
