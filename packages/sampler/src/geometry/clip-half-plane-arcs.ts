/** Arcs counted by the last call of clipHalfPlaneArcs. */
let lastArcs = 0;

/**
 * Clips any simple polygon to the closed half-plane a·x + b·y ≥ c (Sutherland–Hodgman; Sutherland &
 * Hodgman 1974) and counts the arcs of its boundary inside the half-plane. The result is exact when
 * the count is at most 1: the inside of a simple polygon met by a convex set along one boundary arc is
 * one piece, bounded by that arc and a chord (derived: each piece of the intersection holds at least
 * one arc). With 2 or more arcs the pieces may be joined by zero-width bridges and must be rebuilt
 * by a polygon clipper. Read the count with {@link clippedArcs}.
 * @param src - interleaved coordinates.
 * @param n - number of vertices.
 * @param a - x coefficient (unit normal).
 * @param b - y coefficient.
 * @param c - offset.
 * @param eps - a vertex with a·x + b·y − c ≥ −eps counts as inside.
 * @param dst - output buffer (not `src`), capacity ≥ 2 (n + n/2 + 1).
 * @returns the number of output vertices (< 3: empty).
 */
export function clipHalfPlaneArcs(
  src: Float64Array,
  n: number,
  a: number,
  b: number,
  c: number,
  eps: number,
  dst: Float64Array,
): number {
  lastArcs = 0;
  if (n === 0) return 0;
  let m = 0;
  let px = src[2 * n - 2]!;
  let py = src[2 * n - 1]!;
  let pd = a * px + b * py - c;
  let pin = pd >= -eps;
  let outside = 0;
  for (let i = 0; i < n; i++) {
    const qx = src[2 * i]!;
    const qy = src[2 * i + 1]!;
    const qd = a * qx + b * qy - c;
    const qin = qd >= -eps;
    if (pin !== qin) {
      if (qin) lastArcs++;
      // The crossing with the line itself, unless the inside end is already on it.
      const onLine = qin ? qd <= eps : pd <= eps;
      if (!onLine) {
        const t = pd / (pd - qd);
        dst[2 * m] = px + t * (qx - px);
        dst[2 * m + 1] = py + t * (qy - py);
        m++;
      }
    }
    if (qin) {
      dst[2 * m] = qx;
      dst[2 * m + 1] = qy;
      m++;
    } else outside++;
    px = qx;
    py = qy;
    pd = qd;
    pin = qin;
  }
  if (outside === 0) lastArcs = 1;
  return m;
}

/** Arcs inside the half-plane in the last call of {@link clipHalfPlaneArcs} (0: empty). */
export function clippedArcs(): number {
  return lastArcs;
}
