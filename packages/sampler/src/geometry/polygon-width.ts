/**
 * Width of a convex polygon: the least distance between two parallel lines enclosing it. For a
 * convex polygon the minimum is reached with one line through an edge (the rotating-calipers
 * theorem; Houle & Toussaint 1988), so this takes, over every edge direction, the largest
 * perpendicular extent of the vertices, and returns the least of those.
 * @param xy - interleaved coordinates of a convex polygon (either orientation).
 * @param n - number of vertices.
 * @returns the width (0 for fewer than 3 vertices).
 */
export function polygonWidth(xy: Float64Array, n: number): number {
  if (n < 3) return 0;
  let best = Infinity;
  let px = xy[2 * n - 2]!;
  let py = xy[2 * n - 1]!;
  for (let i = 0; i < n; i++) {
    const qx = xy[2 * i]!;
    const qy = xy[2 * i + 1]!;
    const dx = qx - px;
    const dy = qy - py;
    const len = Math.sqrt(dx * dx + dy * dy);
    if (len > 0) {
      const a = -dy / len;
      const b = dx / len;
      const c = a * px + b * py;
      let lo = 0;
      let hi = 0;
      for (let j = 0; j < n; j++) {
        const t = a * xy[2 * j]! + b * xy[2 * j + 1]! - c;
        if (t > hi) hi = t;
        else if (t < lo) lo = t;
      }
      const extent = hi - lo;
      if (extent < best) best = extent;
    }
    px = qx;
    py = qy;
  }
  return best === Infinity ? 0 : best;
}
