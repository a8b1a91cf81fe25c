/**
 * Distance from a point to a closed ring's boundary: the least, over the edges, of the distance to the
 * nearest point of the segment (the projection clamped to the segment; common practice).
 * @param ring - interleaved ring.
 * @param x - the point's x.
 * @param y - the point's y.
 * @returns the distance (≥ 0).
 */
export function ringBoundaryDistance(ring: Float64Array, x: number, y: number): number {
  const m = ring.length >> 1;
  let best = Infinity;
  for (let a = 0; a < m; a++) {
    const b = a + 1 === m ? 0 : a + 1;
    const ax = ring[2 * a]!;
    const ay = ring[2 * a + 1]!;
    const dx = ring[2 * b]! - ax;
    const dy = ring[2 * b + 1]! - ay;
    const l2 = dx * dx + dy * dy;
    const t = l2 > 0 ? Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / l2)) : 0;
    best = Math.min(best, Math.hypot(ax + t * dx - x, ay + t * dy - y));
  }
  return best;
}
