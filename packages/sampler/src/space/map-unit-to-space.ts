import type { DesignSpace } from "./design-space.js";
import type { Parameter } from "./parameter.js";
import { validateDesignSpace } from "./validate-design-space.js";
import { latinStrata, stratumIndex } from "../design/stratum-index.js";

/**
 * Turns unit-cube rows (one coordinate per parameter, in order) into parameter records.
 *
 * - continuous: min + x·(max − min); with `log`, exp(ln min + x·(ln max − ln min)).
 * - integer (L = max − min + 1 levels) and categorical (L levels): when the column is Latin (one point in
 *   each of the n strata, as every LHS column is), the point in stratum k gets level ⌊(k + c)·L/n⌋, where
 *   c ∈ [0, 1) is the offset n·x of the point in stratum 0 (½ for centred designs; x·L itself when n = 1).
 *   Each level then holds ⌊n/L⌋ or ⌈n/L⌉ points (derived: level ℓ gets the integers k in
 *   [ℓn/L − c, (ℓ+1)n/L − c), an interval of length n/L). Otherwise the level is ⌊x·L⌋ (x = 1 goes to the
 *   last level), which is balanced for Sobol' nets whose size is a multiple of L.
 * @param space - the design space (validated).
 * @param unitRows - rows of coordinates in [0, 1], each as long as the parameter list.
 * @returns one record per row, keyed by parameter name.
 * @throws TypeError/RangeError for a bad space or rows (wrong length, non-finite or outside [0, 1]).
 */
export function mapUnitToSpace(
  space: DesignSpace,
  unitRows: readonly (readonly number[])[],
): Record<string, number | string>[] {
  const fn = "mapUnitToSpace";
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
  const records: Record<string, number | string>[] = unitRows.map(() => ({}));
  space.parameters.forEach((p, j) => {
    const column = unitRows.map((row) => row[j] as number);
    const levelsOf = levelMapper(p, column, n);
    for (let i = 0; i < n; i++) {
      (records[i] as Record<string, number | string>)[p.name] = levelsOf(column[i] as number, i);
    }
  });
  return records;
}

function levelMapper(p: Parameter, column: readonly number[], n: number): (x: number, i: number) => number | string {
  switch (p.kind) {
    case "continuous": {
      if (p.log === true) {
        const a = Math.log(p.min);
        const b = Math.log(p.max);
        return (x) => (x === 0 ? p.min : x === 1 ? p.max : Math.min(p.max, Math.max(p.min, Math.exp(a + x * (b - a)))));
      }
      return (x) => (x === 1 ? p.max : p.min + x * (p.max - p.min));
    }
    case "integer": {
      const index = levelIndexer(column, n, p.max - p.min + 1);
      return (x, i) => p.min + index(x, i);
    }
    case "categorical": {
      const index = levelIndexer(column, n, p.levels.length);
      return (x, i) => p.levels[index(x, i)] as string | number;
    }
  }
}

function levelIndexer(column: readonly number[], n: number, levels: number): (x: number, i: number) => number {
  const strata = latinStrata(column);
  if (strata !== undefined) {
    const first = strata.indexOf(0);
    const c = Math.min(Math.max((column[first] as number) * n, 0), 1 - Number.EPSILON);
    return (_x, i) => Math.min(levels - 1, Math.floor((((strata[i] as number) + c) * levels) / n));
  }
  return (x) => stratumIndex(x, levels);
}
