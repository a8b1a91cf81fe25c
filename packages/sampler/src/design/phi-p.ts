import { checkPoints } from "./check-design-args.js";

/**
 * The Morris–Mitchell (1995, J. Stat. Plan. Inference 43) space-filling criterion
 * φp = (Σ_{i<j} d_ij^(−p))^(1/p), d_ij the Minkowski q-distance; smaller is better and φp → 1/min d as
 * p → ∞. Computed as (1/d_min)·(Σ (d_min/d_ij)^p)^(1/p) so no term overflows.
 * @param points - rows of finite coordinates, all of one length.
 * @param p - exponent, a finite number > 0 (default 50).
 * @param q - distance norm, ≥ 1 (default 2, Euclidean).
 * @returns φp; Infinity when two points coincide; 0 for fewer than two points (an empty sum).
 * @throws TypeError/RangeError for bad points, p or q.
 */
export function phiP(points: readonly (readonly number[])[], p = 50, q = 2): number {
  const fn = "phiP";
  checkPoints(fn, points, false);
  if (typeof p !== "number" || typeof q !== "number") throw new TypeError(`${fn}: p and q must be numbers`);
  if (!(p > 0) || !Number.isFinite(p)) throw new RangeError(`${fn}: p must be a finite number > 0, got ${p}`);
  if (!(q >= 1) || !Number.isFinite(q)) throw new RangeError(`${fn}: q must be a finite number ≥ 1, got ${q}`);
  const n = points.length;
  const dist: number[] = [];
  let dmin = Infinity;
  for (let i = 0; i < n; i++) {
    const a = points[i] as readonly number[];
    for (let j = i + 1; j < n; j++) {
      const b = points[j] as readonly number[];
      let s = 0;
      for (let k = 0; k < a.length; k++) s += Math.abs((a[k] as number) - (b[k] as number)) ** q;
      const dij = q === 2 ? Math.sqrt(s) : s ** (1 / q);
      dist.push(dij);
      if (dij < dmin) dmin = dij;
    }
  }
  if (dist.length === 0) return 0;
  if (dmin === 0) return Infinity;
  let sum = 0;
  for (const dij of dist) sum += (dmin / dij) ** p;
  return sum ** (1 / p) / dmin;
}
