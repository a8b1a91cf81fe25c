/**
 * Signed area (shoelace formula; positive counter-clockwise) of a ring stored as a whole
 * interleaved array.
 * @param ring - interleaved coordinates `[x0, y0, x1, y1, …]`.
 * @returns the signed area.
 */
export function ringArea(ring: Float64Array): number {
  const m = ring.length >> 1;
  let s = 0;
  let px = ring[2 * m - 2]!;
  let py = ring[2 * m - 1]!;
  for (let i = 0; i < m; i++) {
    const qx = ring[2 * i]!;
    const qy = ring[2 * i + 1]!;
    s += px * qy - qx * py;
    px = qx;
    py = qy;
  }
  return s / 2;
}

/**
 * Perimeter of a ring stored as a whole interleaved array.
 * @param ring - interleaved coordinates.
 * @returns the sum of its edge lengths.
 */
export function ringPerimeter(ring: Float64Array): number {
  const m = ring.length >> 1;
  let s = 0;
  let px = ring[2 * m - 2]!;
  let py = ring[2 * m - 1]!;
  for (let i = 0; i < m; i++) {
    const qx = ring[2 * i]!;
    const qy = ring[2 * i + 1]!;
    s += Math.hypot(qx - px, qy - py);
    px = qx;
    py = qy;
  }
  return s;
}

/**
 * Whether a counter-clockwise ring is convex (no right turn beyond round-off).
 * @param ring - interleaved coordinates, counter-clockwise.
 * @returns true when every turn is left or straight.
 */
export function ringIsConvex(ring: Float64Array): boolean {
  const m = ring.length >> 1;
  for (let i = 0; i < m; i++) {
    const a = i === 0 ? m - 1 : i - 1;
    const b = i + 1 === m ? 0 : i + 1;
    const ex = ring[2 * i]! - ring[2 * a]!;
    const ey = ring[2 * i + 1]! - ring[2 * a + 1]!;
    const fx = ring[2 * b]! - ring[2 * i]!;
    const fy = ring[2 * b + 1]! - ring[2 * i + 1]!;
    if (ex * fy - ey * fx < -1e-12 * Math.hypot(ex, ey) * Math.hypot(fx, fy)) return false;
  }
  return true;
}
