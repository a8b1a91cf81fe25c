import type { Parameter } from "./parameter.js";
import { latinStrata, stratumIndex } from "../design/stratum-index.js";
import { latticeCount } from "./lattice-count.js";

/**
 * The map from a unit coordinate (and its row index) to a parameter's value: continuous parameters scale linearly
 * (or logarithmically with `log`); integer and categorical ones take level ⌊x · levels⌋ (stratumIndex), except that
 * when the whole `column` is given and is Latin, levels follow the strata so each level gets ⌊n/levels⌋ or
 * ⌈n/levels⌉ rows (derived). Without `column` (streamed designs) the per-point rule applies.
 * @param p - the parameter. @param column - the design's whole column, when held. @param n - rows of the design.
 * @returns `(x, i) => value`.
 */
export function levelMapper(p: Parameter, column: (() => readonly number[]) | undefined, n: number): (x: number, i: number) => number | string {
  switch (p.kind) {
    case "continuous": {
      if (p.step !== undefined) {
        const step = p.step;
        const index = levelIndexer(column?.(), n, latticeCount(p.min, p.max, step));
        return (x, i) => p.min + index(x, i) * step;
      }
      if (p.log === true) {
        const a = Math.log(p.min);
        const b = Math.log(p.max);
        return (x) => (x === 0 ? p.min : x === 1 ? p.max : Math.min(p.max, Math.max(p.min, Math.exp(a + x * (b - a)))));
      }
      return (x) => (x === 1 ? p.max : p.min + x * (p.max - p.min));
    }
    case "integer": {
      const index = levelIndexer(column?.(), n, p.max - p.min + 1);
      return (x, i) => p.min + index(x, i);
    }
    case "categorical": {
      const index = levelIndexer(column?.(), n, p.levels.length);
      return (x, i) => p.levels[index(x, i)] as string | number;
    }
  }
}

function levelIndexer(column: readonly number[] | undefined, n: number, levels: number): (x: number, i: number) => number {
  const strata = column === undefined ? undefined : latinStrata(column);
  if (strata !== undefined) {
    const first = strata.indexOf(0);
    const c = Math.min(Math.max((column![first] as number) * n, 0), 1 - Number.EPSILON);
    return (_x, i) => Math.min(levels - 1, Math.floor((((strata[i] as number) + c) * levels) / n));
  }
  return (x) => stratumIndex(x, levels);
}
