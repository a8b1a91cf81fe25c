import type { SeededRandom } from "./check-design-args.js";
import { stratumIndex } from "./stratum-index.js";

/**
 * A Latin hypercube (McKay, Beckman & Conover 1979, Technometrics 21(2)): each column is an independent
 * random permutation of the n strata [k/n, (k+1)/n); the point sits at a uniform random place inside its
 * stratum, or at the stratum's centre (k + ½)/n when `centred`.
 * @param n - number of points (and strata). @param d - dimensions. @param rng - seeded generator.
 * @returns n rows of d coordinates in [0, 1), exactly one per stratum in each dimension.
 */
export function latinHypercube(n: number, d: number, rng: SeededRandom, centred: boolean): number[][] {
  const rows: number[][] = Array.from({ length: n }, () => new Array<number>(d));
  const perm = new Int32Array(n);
  for (let k = 0; k < d; k++) {
    for (let i = 0; i < n; i++) perm[i] = i;
    for (let i = n - 1; i > 0; i--) {
      const j = Math.floor(rng() * (i + 1));
      const t = perm[i] as number;
      perm[i] = perm[j] as number;
      perm[j] = t;
    }
    for (let i = 0; i < n; i++) {
      const s = perm[i] as number;
      (rows[i] as number[])[k] = centred ? (s + 0.5) / n : pointInStratum(s, rng(), n);
    }
  }
  return rows;
}

/** (s + u)/n, nudged down when rounding would carry it into stratum s + 1. */
function pointInStratum(s: number, u: number, n: number): number {
  let x = (s + u) / n;
  while (stratumIndex(x, n) > s) x -= Number.EPSILON * Math.max(x, Number.MIN_VALUE);
  return x;
}
