let ts = new Float64Array(32);
let order: number[] = [];

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
  const arcs: number[][] = [];
  let cur: number[] | null = null;
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
      cur = [];
      if (qd > eps) {
        const t = pd / (pd - qd);
        cur.push(px + t * (qx - px), py + t * (qy - py));
      }
      cur.push(qx, qy);
    } else if (pin && qin) {
      cur!.push(qx, qy);
    } else if (pin && !qin) {
      if (pd > eps) {
        const t = pd / (pd - qd);
        cur!.push(px + t * (qx - px), py + t * (qy - py));
      }
      // An arc that never leaves the line has no area.
      let deep = false;
      for (let k = 0; k < cur!.length && !deep; k += 2) deep = a * cur![k]! + b * cur![k + 1]! - c > eps;
      if (deep) arcs.push(cur!);
      cur = null;
    }
    px = qx;
    py = qy;
    pd = qd;
  }
  const k = arcs.length;
  if (k === 0) return true;
  if (k === 1) {
    out.push(Float64Array.from(arcs[0]!));
    return true;
  }
  // Positions along the line: entry of arc j at 2j, exit at 2j + 1.
  if (ts.length < 2 * k) ts = new Float64Array(4 * k);
  order = [];
  for (let j = 0; j < k; j++) {
    const arc = arcs[j]!;
    ts[2 * j] = b * arc[0]! - a * arc[1]!;
    ts[2 * j + 1] = b * arc[arc.length - 2]! - a * arc[arc.length - 1]!;
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
    const pts: number[] = [];
    let arc = j;
    while (used[arc] === 0) {
      used[arc] = 1;
      for (const v of arcs[arc]!) pts.push(v);
      arc = next[arc]!;
    }
    if (arc !== j) return false;
    pieces.push(Float64Array.from(pts));
  }
  for (const p of pieces) out.push(p);
  return true;
}
