/**
 * Perimeter of a closed polygon stored as interleaved coordinates `[x0, y0, x1, y1, …]`.
 * @param xy - interleaved vertex coordinates.
 * @param n - number of vertices to read.
 * @returns the sum of the edge lengths, closing edge included (0 for fewer than 2 vertices).
 */
export function polygonPerimeter(xy: Float64Array, n: number): number {
  if (n < 2) return 0;
  let p = 0;
  let px = xy[2 * n - 2]!;
  let py = xy[2 * n - 1]!;
  for (let i = 0; i < n; i++) {
    const qx = xy[2 * i]!;
    const qy = xy[2 * i + 1]!;
    const dx = qx - px;
    const dy = qy - py;
    p += Math.sqrt(dx * dx + dy * dy);
    px = qx;
    py = qy;
  }
  return p;
}
