import { ringArea } from "./ring-metrics.js";

/** Crossings of the ring with the region's boundary: plane index (position along the chain) and place on its line. */
let keyPlane = new Int32Array(32);
let keyT = new Float64Array(32);
/** For crossing 2a (arc a's start, leaving the region) and 2a + 1 (arc a's end, entering it). */
let order: number[] = [];
let arcPts: number[] = [];
let arcAt = new Int32Array(32);

function lineCrossing(planes: Float64Array, p: number, q: number, out: number[]): void {
  const a1 = planes[3 * p]!;
  const b1 = planes[3 * p + 1]!;
  const c1 = planes[3 * p + 2]!;
  const a2 = planes[3 * q]!;
  const b2 = planes[3 * q + 1]!;
  const c2 = planes[3 * q + 2]!;
  const det = a1 * b2 - b1 * a2;
  out.push((c1 * b2 - b1 * c2) / det, (a1 * c2 - c1 * a2) / det);
}

function pushPoint(out: number[], x: number, y: number, tol: number): void {
  const n = out.length;
  if (n >= 2 && Math.abs(out[n - 2]! - x) <= tol && Math.abs(out[n - 1]! - y) <= tol) return;
  out.push(x, y);
}

/**
 * The part of a counter-clockwise simple ring outside a convex region S = {a_j·x + b_j·y ≥ c_j}, as
 * separate counter-clockwise pieces, without a polygon clipper. Each edge's stretch inside S comes
 * from clipping its parameter against every half-plane (Cyrus and Beck 1978); the ring's boundary
 * outside S falls into arcs, each leaving S at its start and entering it at its end. The pieces'
 * boundaries are those arcs joined along S's boundary, walked clockwise (S on the right) from an
 * arc's end to the nearest crossing before it, which must be an arc's start (the even–odd rule along
 * S's boundary inside the ring, as splitByHalfPlane along a line; derived). Points within `eps` of a
 * half-plane count as on it (inside S).
 * @param ring - interleaved counter-clockwise simple ring.
 * @param planes - the half-planes as triples [a, b, c] ((a, b) a unit normal pointing into S), in
 *   counter-clockwise order along S's boundary; plane j and plane j + 1 meet at a corner of S.
 * @param k - number of half-planes (≥ 2).
 * @param closed - whether plane k − 1 and plane 0 meet too (S bounded); otherwise S's boundary runs
 *   from infinity along plane 0, …, plane k − 1 back to infinity.
 * @param eps - length tolerance (≥ 0).
 * @param out - receives the pieces.
 * @returns false when the crossings do not pair up cleanly (round-off, touching): nothing is then
 *   written to `out` and the caller must use a polygon clipper.
 */
export function subtractConvexRegion(
  ring: Float64Array,
  planes: Float64Array,
  k: number,
  closed: boolean,
  eps: number,
  out: Float64Array[],
): boolean {
  const m = ring.length >> 1;
  // A vertex beyond some half-plane by more than eps is outside S: start the walk there.
  let start = -1;
  for (let v = 0; v < m && start < 0; v++) {
    const x = ring[2 * v]!;
    const y = ring[2 * v + 1]!;
    for (let j = 0; j < k; j++) {
      if (planes[3 * j]! * x + planes[3 * j + 1]! * y - planes[3 * j + 2]! < -eps) {
        start = v;
        break;
      }
    }
  }
  if (start < 0) return true; // the whole ring is in S
  if (keyPlane.length < 2 * m + 2) {
    keyPlane = new Int32Array(4 * m + 4);
    keyT = new Float64Array(4 * m + 4);
    arcAt = new Int32Array(4 * m + 4);
  }
  arcPts = [];
  let arcs = 0;
  let firstEnd = -1; // length of arcPts when the first arc (which began before `start`) entered S
  let open = true; // currently outside S, on an arc
  let touch = -1; // the vertex where the last arc entered S, until the walk moves on inside S
  const tol = 1e3 * eps;
  for (let e = 0; e < m; e++) {
    const ip = (start + e) % m;
    const iq = ip + 1 === m ? 0 : ip + 1;
    const px = ring[2 * ip]!;
    const py = ring[2 * ip + 1]!;
    const dx = ring[2 * iq]! - px;
    const dy = ring[2 * iq + 1]! - py;
    let tin = 0;
    let tout = 1;
    let jin = -1;
    let jout = -1;
    let empty = false;
    let along = false;
    for (let j = 0; j < k && !empty; j++) {
      const a = planes[3 * j]!;
      const b = planes[3 * j + 1]!;
      const c = planes[3 * j + 2]!;
      const dp = a * px + b * py - c;
      const dq = a * (px + dx) + b * (py + dy) - c;
      const pin = dp >= -eps;
      const qin = dq >= -eps;
      // Along S's boundary with S on the ring's outer side.
      if (pin && qin && dp <= eps && dq <= eps && a * dy - b * dx > 0) along = true;
      if (pin && qin) continue;
      if (!pin && !qin) empty = true;
      else if (!pin) {
        // A crossing within eps of an end stays on the edge (dq may be slightly negative).
        const t = Math.min(1, dp / (dp - dq));
        if (t > tin) {
          tin = t;
          jin = j;
        }
      } else {
        const t = Math.max(0, dp / (dp - dq));
        if (t < tout) {
          tout = t;
          jout = j;
        }
      }
    }
    const len = Math.hypot(dx, dy);
    // A stretch inside S shorter than eps between two outside ends (a graze) may pinch a piece; a
    // longer one along S's boundary with S outside the ring is a contact without area, which the walk
    // would turn into a slit. Both are left to the clipper.
    if (!empty && jin >= 0 && jout >= 0 && (tout - tin) * len <= eps) return false;
    if (along && !empty && (tout - tin) * len > eps) return false;
    if (empty || tin > tout) {
      if (!open) return false; // from inside S to outside without a crossing: round-off
      arcPts.push(ring[2 * iq]!, ring[2 * iq + 1]!);
      continue;
    }
    if (jin >= 0) {
      // Enters S at tin: the current arc ends.
      if (!open) return false;
      const snap = (1 - tin) * len <= eps;
      const x = snap ? px + dx : px + tin * dx;
      const y = snap ? py + dy : py + tin * dy;
      pushPoint(arcPts, x, y, tol);
      keyPlane[2 * arcs + 1] = jin;
      keyT[2 * arcs + 1] = planes[3 * jin + 1]! * x - planes[3 * jin]! * y;
      if (arcs === 0) firstEnd = arcPts.length;
      arcAt[2 * arcs + 1] = arcPts.length;
      arcs++;
      open = false;
      touch = snap && jout < 0 ? iq : -1;
      if (jout < 0) continue;
      touch = -1;
    } else if (open) return false; // on an arc, yet this edge starts inside S: round-off
    if (jout >= 0) {
      // Leaves S at tout: a new arc starts.
      const snap = tout * len <= eps;
      // Touching S at a single vertex: S's boundary through it may pinch a piece there.
      if (snap && touch === ip) return false;
      const x = snap ? px : px + tout * dx;
      const y = snap ? py : py + tout * dy;
      arcAt[2 * arcs] = arcPts.length;
      arcPts.push(x, y);
      keyPlane[2 * arcs] = jout;
      keyT[2 * arcs] = planes[3 * jout + 1]! * x - planes[3 * jout]! * y;
      pushPoint(arcPts, ring[2 * iq]!, ring[2 * iq + 1]!, tol);
      open = true;
    }
    touch = -1;
  }
  if (arcs === 0) {
    if (!open) return false;
    out.push(ring);
    return true;
  }
  if (!open) return false; // the walk began outside S, so it must end there
  // The arc still open continues into arc 0 (which began before `start`): it becomes arc 0's head.
  const tail = arcPts.slice(arcAt[2 * arcs]!);
  const head = arcPts.slice(0, firstEnd);
  keyPlane[0] = keyPlane[2 * arcs]!;
  keyT[0] = keyT[2 * arcs]!;
  const arc0 = tail.concat(head);
  // Order the 2·arcs crossings along S's boundary.
  order = [];
  for (let s = 0; s < 2 * arcs; s++) order.push(s);
  order.sort((p, q) => keyPlane[p]! - keyPlane[q]! || keyT[p]! - keyT[q]!);
  const next = new Int32Array(arcs);
  for (let r = 0; r < 2 * arcs; r++) {
    const s = order[r]!;
    if ((s & 1) === 0) continue;
    // Arc s >> 1 ends here; walking clockwise (down the order) the next crossing must be an arc's start.
    if (r === 0 && !closed) return false;
    const prev = order[r === 0 ? 2 * arcs - 1 : r - 1]!;
    if ((prev & 1) !== 0) return false;
    next[s >> 1] = prev >> 1;
  }
  const used = new Uint8Array(arcs);
  const pieces: Float64Array[] = [];
  for (let a0 = 0; a0 < arcs; a0++) {
    if (used[a0] === 1) continue;
    const pts: number[] = [];
    let a = a0;
    while (used[a] === 0) {
      used[a] = 1;
      const src = a === 0 ? arc0 : arcPts.slice(arcAt[2 * a]!, arcAt[2 * a + 1]!);
      for (let i = 0; i < src.length; i += 2) pushPoint(pts, src[i]!, src[i + 1]!, tol);
      const b = next[a]!;
      // Corners of S passed walking back from plane keyPlane[end of a] to plane keyPlane[start of b].
      const pe = keyPlane[2 * a + 1]!;
      const ps = keyPlane[2 * b]!;
      let count = pe - ps;
      if (count < 0 || (count === 0 && keyT[2 * b]! > keyT[2 * a + 1]!)) {
        if (!closed) return false;
        count += k;
      }
      const corner: number[] = [];
      for (let r = 0, j = pe; r < count; r++) {
        const i = j === 0 ? k - 1 : j - 1;
        corner.length = 0;
        lineCrossing(planes, i, j, corner);
        pushPoint(pts, corner[0]!, corner[1]!, tol);
        j = i;
      }
      a = b;
    }
    if (a !== a0) return false;
    // Closing vertex equal to the first.
    while (pts.length >= 4 && Math.abs(pts[0]! - pts[pts.length - 2]!) <= tol && Math.abs(pts[1]! - pts[pts.length - 1]!) <= tol) {
      pts.length -= 2;
    }
    if (pts.length < 6) return false;
    const piece = Float64Array.from(pts);
    if (!(ringArea(piece) > 0)) return false;
    pieces.push(piece);
  }
  for (const p of pieces) out.push(p);
  return true;
}
