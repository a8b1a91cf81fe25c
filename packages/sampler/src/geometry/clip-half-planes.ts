import { clipHalfPlane } from "./clip-half-plane.js";

/**
 * Intersects a convex polygon with k half-planes a·x + b·y ≥ c, given as triples
 * `[a0, b0, c0, a1, b1, c1, …]`, by repeated Sutherland–Hodgman clipping.
 * @param src - interleaved coordinates of the input polygon (may be the same buffer as `out`).
 * @param n - number of input vertices.
 * @param planes - half-plane triples.
 * @param k - number of half-planes to apply.
 * @param out - buffer receiving the result, capacity ≥ 2 (n + k).
 * @param scratch - work buffer distinct from `src` and `out`, capacity ≥ 2 (n + k).
 * @returns the number of result vertices in `out` (fewer than 3: empty).
 */
export function clipHalfPlanes(
  src: Float64Array,
  n: number,
  planes: Float64Array,
  k: number,
  out: Float64Array,
  scratch: Float64Array,
): number {
  let cur = src;
  let m = n;
  for (let j = 0; j < k && m >= 3; j++) {
    const next = cur === scratch ? out : scratch;
    m = clipHalfPlane(cur, m, planes[3 * j]!, planes[3 * j + 1]!, planes[3 * j + 2]!, next);
    cur = next;
  }
  if (m < 3) return 0;
  if (cur !== out) out.set(cur.subarray(0, 2 * m));
  return m;
}
