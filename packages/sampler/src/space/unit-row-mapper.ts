import type { DesignSpace } from "./design-space.js";
import { validateDesignSpace } from "./validate-design-space.js";
import { levelMapper } from "./level-mapper.js";

/**
 * Checks unit-cube rows against a design space and returns a function that maps row i to its parameter record on
 * demand (the rule of mapUnitToSpace, which uses it). The per-column facts a row needs (whether an integer or
 * categorical column is Latin, each point's stratum, the stratum-0 offset) are computed once here, so records need
 * not all be held at once: a dataset of a million rows keeps only the unit rows.
 * @param space - the design space (validated).
 * @param unitRows - rows of coordinates in [0, 1], each as long as the parameter list; kept and read by the mapper.
 * @param fn - calling function named in messages.
 * @returns `(i) => record` for 0 ≤ i < unitRows.length, keyed by parameter name in parameter order.
 * @throws TypeError/RangeError for a bad space or rows (wrong length, non-finite or outside [0, 1]).
 */
export function createUnitRowMapper(
  space: DesignSpace,
  unitRows: readonly (readonly number[])[],
  fn = "createUnitRowMapper",
): (i: number) => Record<string, number | string> {
  validateDesignSpace(space, fn);
  if (!Array.isArray(unitRows)) throw new TypeError(`${fn}: unitRows must be an array of rows`);
  const d = space.parameters.length;
  unitRows.forEach((row, i) => {
    if (!Array.isArray(row)) throw new TypeError(`${fn}: unitRows[${i}] must be an array`);
    if (row.length !== d) {
      throw new RangeError(`${fn}: unitRows[${i}] must have ${d} coordinates (one per parameter), got ${row.length}`);
    }
    row.forEach((x, j) => {
      if (typeof x !== "number" || !(x >= 0 && x <= 1)) {
        throw new RangeError(`${fn}: unitRows[${i}][${j}] (${space.parameters[j]?.name}) must be in [0, 1], got ${x}`);
      }
    });
  });
  const n = unitRows.length;
  const mappers = space.parameters.map((p, j) => levelMapper(p, () => unitRows.map((row) => row[j] as number), n));
  const names = space.parameters.map((p) => p.name);
  return (i) => {
    const row = unitRows[i] as readonly number[];
    const record: Record<string, number | string> = {};
    for (let j = 0; j < d; j++) record[names[j] as string] = (mappers[j] as (x: number, i: number) => number | string)(row[j] as number, i);
    return record;
  };
}
