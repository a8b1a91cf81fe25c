import { ringArena } from "./ring-arena.js";

let ts = new Float64Array(32);
let order: number[] = [];
/** Arc coordinates, one arc after another (reused from call to call). */
let pts = new Float64Array(64);
/** Start and end (exclusive) of arc j in `pts`: arcAt[2j], arcAt[2j + 1]. */
let arcAt = new Int32Array(32);

/**
 * Intersects a counter-clockwise simple ring with the closed half-plane a·x + b·y ≥ c and returns the
 * pieces separately (Sutherland–Hodgman would join them by zero-width bridges). The ring's boundary
 * inside the half-plane falls into arcs, each entering and leaving on the line; along the line
 * (direction (b, −a), which keeps the half-plane on the left) the ring's inside alternates, so sorted
 * by position the crossings pair up as (leave, enter), and each pair is a chord of one piece (the
 * even–odd rule on the line; derived). Tracing arc → chord → arc closes each piece.
 * @param ring - interleaved counter-clockwise simple ring.
 * @param a - x coefficient (unit normal).
 * @param b - y coefficient.
 * @param c - offset.
 * @param eps - a vertex with a·x + b·y − c ≥ −eps counts as inside; within eps of the line, on it.
 * @param out - receives the pieces (counter-clockwise).
 * @returns false when the crossings do not pair up cleanly (touching pieces, round-off): the caller
 *   must then use a polygon clipper; nothing is written to `out` in that case.
 */
export function splitByHalfPlane(ring: Float64Array, a: number, b: number, c: number, eps: number, out: Float64Array[]): boolean {
  const m = ring.length >> 1;
  let start = -1;
  let inside = 0;
  for (let i = 0; i < m; i++) {
    if (a * ring[2 * i]! + b * ring[2 * i + 1]! - c >= -eps) inside++;
    else if (start < 0) start = i;
  }
  if (inside === m) {
    out.push(ring);
    return true;
  }
  if (inside === 0) return true;
  // Every vertex once, plus at most two crossings per arc (at most m arcs).
  if (pts.length < 6 * m) pts = new Float64Array(12 * m);
  if (arcAt.length < 2 * m) arcAt = new Int32Array(4 * m);
  let k = 0;
  let w = 0;
  let arcStart = -1;
  let pi = start;
  let px = ring[2 * pi]!;
  let py = ring[2 * pi + 1]!;
  let pd = a * px + b * py - c;
  for (let step = 1; step <= m; step++) {
    const i = (start + step) % m;
    const qx = ring[2 * i]!;
    const qy = ring[2 * i + 1]!;
    const qd = a * qx + b * qy - c;
    const pin = pd >= -eps;
    const qin = qd >= -eps;
    if (!pin && qin) {
      arcStart = w;
      if (qd > eps) {
        const t = pd / (pd - qd);
        pts[w++] = px + t * (qx - px);
        pts[w++] = py + t * (qy - py);
      }
      pts[w++] = qx;
      pts[w++] = qy;
    } else if (pin && qin) {
      pts[w++] = qx;
      pts[w++] = qy;
    } else if (pin && !qin) {
      if (pd > eps) {
        const t = pd / (pd - qd);
        pts[w++] = px + t * (qx - px);
        pts[w++] = py + t * (qy - py);
      }
      // An arc that never leaves the line has no area.
      let deep = false;
      for (let v = arcStart; v < w && !deep; v += 2) deep = a * pts[v]! + b * pts[v + 1]! - c > eps;
      if (deep) {
        arcAt[2 * k] = arcStart;
        arcAt[2 * k + 1] = w;
        k++;
      } else w = arcStart;
    }
    px = qx;
    py = qy;
    pd = qd;
  }
  if (k === 0) return true;
  if (k === 1) {
    const piece = ringArena.take(arcAt[1]! - arcAt[0]!);
    piece.set(pts.subarray(arcAt[0]!, arcAt[1]!));
    out.push(piece);
    return true;
  }
  // Positions along the line: entry of arc j at 2j, exit at 2j + 1.
  if (ts.length < 2 * k) ts = new Float64Array(4 * k);
  order = [];
  for (let j = 0; j < k; j++) {
    const s0 = arcAt[2 * j]!;
    const s1 = arcAt[2 * j + 1]!;
    ts[2 * j] = b * pts[s0]! - a * pts[s0 + 1]!;
    ts[2 * j + 1] = b * pts[s1 - 2]! - a * pts[s1 - 1]!;
    order.push(2 * j, 2 * j + 1);
  }
  order.sort((p, q) => ts[p]! - ts[q]!);
  const next = new Int32Array(k);
  for (let s = 0; s < 2 * k; s += 2) {
    const exit = order[s]!;
    const entry = order[s + 1]!;
    if ((exit & 1) !== 1 || (entry & 1) !== 0 || !(ts[entry]! > ts[exit]!)) return false;
    next[exit >> 1] = entry >> 1;
  }
  const used = new Uint8Array(k);
  const pieces: Float64Array[] = [];
  for (let j = 0; j < k; j++) {
    if (used[j] === 1) continue;
    let size = 0;
    let arc = j;
    while (used[arc] === 0) {
      used[arc] = 1;
      size += arcAt[2 * arc + 1]! - arcAt[2 * arc]!;
      arc = next[arc]!;
    }
    if (arc !== j) return false;
    const piece = ringArena.take(size);
    let o = 0;
    arc = j;
    do {
      piece.set(pts.subarray(arcAt[2 * arc]!, arcAt[2 * arc + 1]!), o);
      o += arcAt[2 * arc + 1]! - arcAt[2 * arc]!;
      arc = next[arc]!;
    } while (arc !== j);
    pieces.push(piece);
  }
  for (const p of pieces) out.push(p);
  return true;
}
