import { clipHalfPlanes } from "./clip-half-planes.js";
import { edgeHalfPlanes } from "./edge-half-planes.js";

/**
 * Inner parallel polygon of a counter-clockwise convex polygon: every edge moved inward by `d`,
 * i.e. the polygon clipped by each edge's inward half-plane at distance d. For a convex polygon this
 * is the inset {p : dist(p, boundary) ≥ d} (CGAL's inset definition). Its area, while no edge has
 * vanished, is A − P·d + d²·Σ cot(θᵢ/2) (derived).
 * @param src - interleaved coordinates of a counter-clockwise convex polygon.
 * @param n - number of vertices.
 * @param d - inward distance, ≥ 0.
 * @param out - result buffer (distinct from `src`), capacity ≥ 4 n.
 * @param scratch - work buffer, capacity ≥ 4 n.
 * @param planes - work buffer for half-planes, capacity ≥ 3 n.
 * @returns the number of result vertices in `out` (0: empty).
 */
export function innerParallelPolygon(
  src: Float64Array,
  n: number,
  d: number,
  out: Float64Array,
  scratch: Float64Array,
  planes: Float64Array,
): number {
  if (n < 3) return 0;
  const k = edgeHalfPlanes(src, n, d, planes, 0);
  return clipHalfPlanes(src, n, planes, k, out, scratch);
}
