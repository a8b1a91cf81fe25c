/**
 * Writes, for every edge of a counter-clockwise convex polygon, the inward half-plane of the
 * points at perpendicular distance ≥ `offset` from the edge's line: a·x + b·y ≥ c with (a, b) the
 * unit inward normal. Edges shorter than `minLength` have no reliable direction and are skipped.
 * @param xy - interleaved coordinates of a counter-clockwise polygon.
 * @param n - number of vertices.
 * @param offset - distance the edges move inward.
 * @param planes - output triples `[a, b, c, …]`, capacity ≥ 3 n.
 * @param minLength - edges of this length or shorter are skipped.
 * @returns the number of half-planes written.
 */
export function edgeHalfPlanes(
  xy: Float64Array,
  n: number,
  offset: number,
  planes: Float64Array,
  minLength: number,
): number {
  let k = 0;
  let px = xy[2 * n - 2]!;
  let py = xy[2 * n - 1]!;
  for (let i = 0; i < n; i++) {
    const qx = xy[2 * i]!;
    const qy = xy[2 * i + 1]!;
    const dx = qx - px;
    const dy = qy - py;
    const len = Math.sqrt(dx * dx + dy * dy);
    if (len > minLength) {
      const a = -dy / len;
      const b = dx / len;
      planes[3 * k] = a;
      planes[3 * k + 1] = b;
      planes[3 * k + 2] = a * px + b * py + offset;
      k++;
    }
    px = qx;
    py = qy;
  }
  return k;
}
