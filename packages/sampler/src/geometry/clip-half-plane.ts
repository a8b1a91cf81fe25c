/**
 * Clips a convex polygon to the closed half-plane a·x + b·y ≥ c (one Sutherland–Hodgman step;
 * Sutherland & Hodgman 1974, "Reentrant polygon clipping"). The result of clipping a convex
 * polygon is convex and keeps its orientation; it has at most n + 1 vertices.
 * @param src - interleaved coordinates of the input polygon.
 * @param n - number of input vertices.
 * @param a - x coefficient of the half-plane.
 * @param b - y coefficient of the half-plane.
 * @param c - offset of the half-plane.
 * @param dst - output buffer (must not alias `src`), capacity ≥ 2 (n + 1).
 * @returns the number of output vertices (fewer than 3 means the clipped polygon is empty).
 */
export function clipHalfPlane(
  src: Float64Array,
  n: number,
  a: number,
  b: number,
  c: number,
  dst: Float64Array,
): number {
  if (n === 0) return 0;
  let m = 0;
  let px = src[2 * n - 2]!;
  let py = src[2 * n - 1]!;
  let pd = a * px + b * py - c;
  for (let i = 0; i < n; i++) {
    const qx = src[2 * i]!;
    const qy = src[2 * i + 1]!;
    const qd = a * qx + b * qy - c;
    if ((pd > 0 && qd < 0) || (pd < 0 && qd > 0)) {
      const t = pd / (pd - qd);
      dst[2 * m] = px + t * (qx - px);
      dst[2 * m + 1] = py + t * (qy - py);
      m++;
    }
    if (qd >= 0) {
      dst[2 * m] = qx;
      dst[2 * m + 1] = qy;
      m++;
    }
    px = qx;
    py = qy;
    pd = qd;
  }
  return m;
}
