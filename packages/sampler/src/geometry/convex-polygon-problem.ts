/** Relative tolerance under which a turn counts as straight (collinear consecutive edges). */
const STRAIGHT = 1e-12;

function distinctVertexCount(xy: Float64Array, n: number): number {
  let count = 0;
  for (let i = 0; i < n; i++) {
    let seen = false;
    for (let j = 0; j < i && !seen; j++) {
      seen = xy[2 * i] === xy[2 * j] && xy[2 * i + 1] === xy[2 * j + 1];
    }
    if (!seen) count++;
  }
  return count;
}

/**
 * Checks that a polygon is simple and convex, in either orientation, with collinear consecutive
 * vertices allowed: no zero-length edge, every turn the same way (or straight, never doubling
 * back), and a total turning of exactly one full circle (a star polygon turns one way but winds
 * more than once, so it intersects itself).
 * @param xy - interleaved vertex coordinates (finite numbers).
 * @param n - number of vertices.
 * @returns null when the polygon is a valid convex polygon, otherwise a short description of
 *   the problem that reads after a field name ("has a zero-length edge 2 …").
 */
export function convexPolygonProblem(xy: Float64Array, n: number): string | null {
  if (n < 3) return `must have at least 3 vertices, got ${n}`;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const x = xy[2 * i]!;
    const y = xy[2 * i + 1]!;
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  const scale = Math.hypot(maxX - minX, maxY - minY);
  let sign = 0;
  let turning = 0;
  let px = xy[2 * n - 2]! - xy[2 * n - 4]!;
  let py = xy[2 * n - 1]! - xy[2 * n - 3]!;
  for (let i = 0; i < n; i++) {
    const prev = i === 0 ? n - 1 : i - 1;
    const qx = xy[2 * i]! - xy[2 * prev]!;
    const qy = xy[2 * i + 1]! - xy[2 * prev + 1]!;
    const len = Math.sqrt(qx * qx + qy * qy);
    if (!(len > STRAIGHT * scale)) {
      if (distinctVertexCount(xy, n) < 3) return `must have at least 3 distinct vertices`;
      return `has a zero-length edge ${prev} (vertex ${prev} to vertex ${i})`;
    }
    // Turn at vertex prev, from edge (prev−1 → prev) to edge (prev → i).
    const cross = px * qy - py * qx;
    const dot = px * qx + py * qy;
    if (Math.abs(cross) <= STRAIGHT * Math.sqrt(px * px + py * py) * len) {
      if (dot < 0) {
        if (distinctVertexCount(xy, n) < 3) return `must have at least 3 distinct vertices`;
        return `is not convex: it doubles back at vertex ${prev}`;
      }
    } else {
      const s = cross > 0 ? 1 : -1;
      if (sign !== 0 && s !== sign) return `is not convex: it turns the other way at vertex ${prev}`;
      sign = s;
      turning += Math.atan2(cross, dot);
    }
    px = qx;
    py = qy;
  }
  if (sign === 0) return `has zero area: all vertices lie on one line`;
  if (Math.abs(turning) > 3 * Math.PI) {
    return `intersects itself: it winds ${Math.round(Math.abs(turning) / (2 * Math.PI))} times around`;
  }
  return null;
}
