/**
 * Signed area of a polygon stored as interleaved coordinates `[x0, y0, x1, y1, …]` (shoelace formula).
 * Positive for counter-clockwise vertex order, negative for clockwise.
 * @param xy - interleaved vertex coordinates (at least `2 * n` entries).
 * @param n - number of vertices to read.
 * @returns the signed area (0 for fewer than 3 vertices).
 */
export function signedArea(xy: Float64Array, n: number): number {
  if (n < 3) return 0;
  // Shoelace formula relative to the first vertex (smaller round-off far from the origin).
  const ox = xy[0]!;
  const oy = xy[1]!;
  let s = 0;
  let px = xy[2]! - ox;
  let py = xy[3]! - oy;
  for (let i = 2; i < n; i++) {
    const qx = xy[2 * i]! - ox;
    const qy = xy[2 * i + 1]! - oy;
    s += px * qy - py * qx;
    px = qx;
    py = qy;
  }
  return s / 2;
}
