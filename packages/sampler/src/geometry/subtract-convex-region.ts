import { pointInRing } from "./point-in-ring.js";
import { ringArena } from "./ring-arena.js";
import { ringMeetsConvexRegion } from "./ring-meets-convex-region.js";
import { ringArea } from "./ring-metrics.js";

/** Crossings of the ring with the region's boundary: plane index (position along the chain) and place on its line. */
let keyPlane = new Int32Array(32);
let keyT = new Float64Array(32);
/** Whether crossing s lies on a vertex of the ring (not inside an edge). */
let keyVertex = new Uint8Array(32);
/** Crossing 2a starts outside arc a (leaving S); crossing 2a + 1 ends it (entering S). */
let order: number[] = [];
const outPts: number[] = [];
let outAt = new Int32Array(32);
/** Inside arc a runs from crossing 2a + 1 to crossing 2(a + 1) (arc 0's start after the last arc). */
const inPts: number[] = [];
let inAt = new Int32Array(32);
let cut = new Uint8Array(16);
let next = new Int32Array(16);
let used = new Uint8Array(16);

/** Appends the corner where the lines of planes p and q meet; false when they are parallel. */
function pushCorner(planes: Float64Array, p: number, q: number, out: number[], tol: number): boolean {
  const det = planes[3 * p]! * planes[3 * q + 1]! - planes[3 * p + 1]! * planes[3 * q]!;
  if (!(Math.abs(det) > 1e-12)) return false;
  const c1 = planes[3 * p + 2]!;
  const c2 = planes[3 * q + 2]!;
  pushPoint(out, (c1 * planes[3 * q + 1]! - planes[3 * p + 1]! * c2) / det, (planes[3 * p]! * c2 - c1 * planes[3 * q]!) / det, tol);
  return true;
}

function pushPoint(out: number[], x: number, y: number, tol: number): void {
  const n = out.length;
  if (n >= 2 && Math.abs(out[n - 2]! - x) <= tol && Math.abs(out[n - 1]! - y) <= tol) return;
  out.push(x, y);
}

/** Whether the corner of planes k − 1 and 0 lies inside the ring. */
function cornerInside(ring: Float64Array, planes: Float64Array, k: number): boolean {
  const corner: number[] = [];
  return pushCorner(planes, k - 1, 0, corner, 0) && pointInRing(ring, corner[0]!, corner[1]!);
}

/**
 * The part of a counter-clockwise simple ring outside a convex region S = {a_j·x + b_j·y ≥ c_j}, as
 * separate counter-clockwise pieces, without a polygon clipper; optionally only the parts of
 * ring ∩ S that `removes` picks are taken away. Each edge's stretch inside S comes from clipping its
 * parameter against every half-plane (Cyrus and Beck 1978), so the ring's boundary falls into arcs
 * outside S, each leaving S at its start and entering it at its end, and arcs inside S between them.
 * The pieces' boundaries are the outside arcs joined along S's boundary, walked clockwise (S on the
 * right) from an arc's end to the nearest crossing before it, which must be an arc's start (the
 * even–odd rule along S's boundary inside the ring, as splitByHalfPlane along a line; derived); an
 * inside arc of a part that stays is followed instead, and its crossings take no part in the pairing
 * (a part of ring ∩ S meets S's boundary only at its own crossings; derived). Points within `eps`
 * of a half-plane count as on it (inside S).
 * @param ring - interleaved counter-clockwise simple ring.
 * @param planes - the half-planes as triples [a, b, c] ((a, b) a unit normal pointing into S), in
 *   counter-clockwise order along S's boundary; plane j and plane j + 1 meet at a corner of S
 *   (a walk that would pass between parallel planes fails).
 * @param k - number of half-planes (≥ 2).
 * @param closed - whether plane k − 1 and plane 0 meet too (S bounded); otherwise S's boundary runs
 *   from infinity along plane 0, …, plane k − 1 back to infinity.
 * @param eps - length tolerance (≥ 0).
 * @param out - receives the pieces.
 * @param removes - for a point where the ring enters or leaves S, whether the part of ring ∩ S there
 *   goes (null: cannot tell); every part goes when omitted.
 * @returns false when the crossings do not pair up cleanly (round-off, touching), S lies inside the
 *   ring (a hole), or `removes` cannot tell: nothing is then written to `out` and the caller must use
 *   a polygon clipper.
 */
export function subtractConvexRegion(
  ring: Float64Array,
  planes: Float64Array,
  k: number,
  closed: boolean,
  eps: number,
  out: Float64Array[],
  removes?: (x: number, y: number) => boolean | null,
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
  if (start < 0) {
    // The whole ring is in S: it goes, unless `removes` keeps it.
    const goes = removes === undefined ? true : removes(ring[0]!, ring[1]!);
    if (goes === false) out.push(ring);
    return goes !== null;
  }
  if (keyPlane.length < 2 * m + 2) {
    keyPlane = new Int32Array(4 * m + 4);
    keyT = new Float64Array(4 * m + 4);
    keyVertex = new Uint8Array(4 * m + 4);
    outAt = new Int32Array(4 * m + 4);
    inAt = new Int32Array(4 * m + 4);
  }
  outPts.length = 0;
  inPts.length = 0;
  let arcs = 0;
  let firstEnd = -1; // length of outPts when the first arc (which began before `start`) entered S
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
    const len = Math.sqrt(dx * dx + dy * dy);
    // A stretch inside S shorter than eps between two outside ends (a graze) may pinch a piece: left to
    // the clipper. A longer one along S's boundary with S outside the ring is a contact without area,
    // which the walk would turn into a slit: the ring stays whole when no edge reaches into S (S then
    // lies on the contact's outer side, so no part of it is inside the ring), else the clipper decides.
    if (!empty && jin >= 0 && jout >= 0 && tout >= tin && (tout - tin) * len <= eps) return false;
    if (along && !empty && (tout - tin) * len > eps) {
      if (ringMeetsConvexRegion(ring, planes, k, eps)) return false;
      out.push(ring);
      return true;
    }
    if (empty || tin > tout) {
      if (!open) return false; // from inside S to outside without a crossing: round-off
      outPts.push(ring[2 * iq]!, ring[2 * iq + 1]!);
      continue;
    }
    if (jin >= 0) {
      // Enters S at tin: outside arc `arcs` ends, inside arc `arcs` starts.
      if (!open) return false;
      const snap = (1 - tin) * len <= eps;
      const x = snap ? px + dx : px + tin * dx;
      const y = snap ? py + dy : py + tin * dy;
      pushPoint(outPts, x, y, tol);
      keyPlane[2 * arcs + 1] = jin;
      keyT[2 * arcs + 1] = planes[3 * jin + 1]! * x - planes[3 * jin]! * y;
      keyVertex[2 * arcs + 1] = snap ? 1 : 0;
      if (arcs === 0) firstEnd = outPts.length;
      outAt[2 * arcs + 1] = outPts.length;
      inAt[2 * arcs] = inPts.length;
      inPts.push(x, y);
      arcs++;
      open = false;
      touch = snap && jout < 0 ? iq : -1;
      if (jout < 0) {
        pushPoint(inPts, ring[2 * iq]!, ring[2 * iq + 1]!, tol);
        continue;
      }
      touch = -1;
    } else if (open) return false; // on an arc, yet this edge starts inside S: round-off
    if (jout < 0) {
      pushPoint(inPts, ring[2 * iq]!, ring[2 * iq + 1]!, tol);
    } else {
      // Leaves S at tout: inside arc `arcs − 1` ends, outside arc `arcs` starts.
      const snap = tout * len <= eps;
      // Touching S at a single vertex: S's boundary through it may pinch a piece there.
      if (snap && touch === ip) return false;
      const x = snap ? px : px + tout * dx;
      const y = snap ? py : py + tout * dy;
      pushPoint(inPts, x, y, tol);
      inAt[2 * arcs - 1] = inPts.length;
      outAt[2 * arcs] = outPts.length;
      outPts.push(x, y);
      keyPlane[2 * arcs] = jout;
      keyT[2 * arcs] = planes[3 * jout + 1]! * x - planes[3 * jout]! * y;
      keyVertex[2 * arcs] = snap ? 1 : 0;
      pushPoint(outPts, ring[2 * iq]!, ring[2 * iq + 1]!, tol);
      open = true;
    }
    touch = -1;
  }
  if (arcs === 0) {
    // No crossing: S is apart from the ring, or (bounded) inside it, which would leave a hole.
    if (!open || (closed && cornerInside(ring, planes, k))) return false;
    out.push(ring);
    return true;
  }
  if (!open) return false; // the walk began outside S, so it must end there
  // The arc still open continues into arc 0 (which began before `start`): its points come first.
  const tailAt = outAt[2 * arcs]!;
  keyPlane[0] = keyPlane[2 * arcs]!;
  keyT[0] = keyT[2 * arcs]!;
  keyVertex[0] = keyVertex[2 * arcs]!;
  if (cut.length < arcs) {
    cut = new Uint8Array(2 * arcs);
    next = new Int32Array(2 * arcs);
    used = new Uint8Array(2 * arcs);
  }
  // Which parts of ring ∩ S go; only their crossings pair up along S's boundary.
  let n2 = 0;
  for (let a = 0; a < arcs; a++) {
    const b = a + 1 === arcs ? 0 : a + 1;
    let goes = true;
    if (removes !== undefined) {
      const atEntry = removes(inPts[inAt[2 * a]!]!, inPts[inAt[2 * a]! + 1]!);
      const atExit = removes(inPts[inAt[2 * a + 1]! - 2]!, inPts[inAt[2 * a + 1]! - 1]!);
      if (atEntry === null || atEntry !== atExit) return false;
      goes = atEntry;
    }
    cut[a] = goes ? 1 : 0;
    used[a] = 0;
    if (!goes) continue;
    order[n2++] = 2 * a + 1;
    order[n2++] = 2 * b;
  }
  if (n2 === 0) {
    out.push(ring);
    return true;
  }
  // Insertion sort along S's boundary (a handful of crossings).
  for (let r = 1; r < n2; r++) {
    const s = order[r]!;
    let q = r - 1;
    while (q >= 0 && (keyPlane[order[q]!]! > keyPlane[s]! || (keyPlane[order[q]!] === keyPlane[s] && keyT[order[q]!]! > keyT[s]!))) {
      order[q + 1] = order[q]!;
      q--;
    }
    order[q + 1] = s;
  }
  for (let r = 0; r < n2; r++) {
    const s = order[r]!;
    if ((s & 1) === 0) continue;
    // Arc s >> 1 ends here; walking clockwise (down the order) the next crossing must be an arc's start.
    if (r === 0 && !closed) return false;
    const prev = order[r === 0 ? n2 - 1 : r - 1]!;
    if ((prev & 1) !== 0) return false;
    next[s >> 1] = prev >> 1;
  }
  const pieces: Float64Array[] = [];
  for (let a0 = 0; a0 < arcs; a0++) {
    if (used[a0] === 1) continue;
    const pts: number[] = [];
    let a = a0;
    while (used[a] === 0) {
      used[a] = 1;
      const prevArc = a === 0 ? arcs - 1 : a - 1;
      // Crossings inside an edge where a part of ring ∩ S stays are not corners: left out.
      const skipFirst = cut[prevArc] === 0 && keyVertex[2 * a] === 0;
      const skipLast = cut[a] === 0 && keyVertex[2 * a + 1] === 0;
      // Arc 0 is the walk's last stretch (from tailAt) followed by its first (to firstEnd).
      const from = a === 0 ? tailAt : outAt[2 * a]!;
      const to = a === 0 ? outPts.length + firstEnd : outAt[2 * a + 1]!;
      const wrap = outPts.length;
      for (let i = skipFirst ? from + 2 : from, end = skipLast ? to - 2 : to; i < end; i += 2) {
        const j = a === 0 && i >= wrap ? i - wrap : i;
        pushPoint(pts, outPts[j]!, outPts[j + 1]!, tol);
      }
      if (cut[a] === 0) {
        for (let i = inAt[2 * a]! + 2; i < inAt[2 * a + 1]! - 2; i += 2) pushPoint(pts, inPts[i]!, inPts[i + 1]!, tol);
        a = a + 1 === arcs ? 0 : a + 1;
        continue;
      }
      const b = next[a]!;
      // Corners of S passed walking back from plane keyPlane[end of a] to plane keyPlane[start of b].
      const pe = keyPlane[2 * a + 1]!;
      const ps = keyPlane[2 * b]!;
      let count = pe - ps;
      if (count < 0 || (count === 0 && keyT[2 * b]! > keyT[2 * a + 1]!)) {
        if (!closed) return false;
        count += k;
      }
      for (let r = 0, j = pe; r < count; r++) {
        const i = j === 0 ? k - 1 : j - 1;
        if (!pushCorner(planes, i, j, pts, tol)) return false;
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
    const piece = ringArena.take(pts.length);
    for (let i = 0; i < pts.length; i++) piece[i] = pts[i]!;
    if (!(ringArea(piece) > 0)) return false;
    pieces.push(piece);
  }
  for (const p of pieces) out.push(p);
  return true;
}
