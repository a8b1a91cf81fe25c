import { clipHalfPlanes } from "./clip-half-planes.js";
import { collapseVanishedEdges } from "./collapse-vanished-edges.js";
import { edgeHalfPlanes } from "./edge-half-planes.js";
import { exactClip } from "./exact-clip.js";
import { ringArena } from "./ring-arena.js";
import { simplePolygonProblem } from "./simple-polygon-problem.js";

let planes = new Float64Array(96);
let out = new Float64Array(128);
let scratch = new Float64Array(128);

/**
 * Uniform inward offset of every edge of a counter-clockwise simple ring by δ with mitred corners
 * (each offset corner where the two moved edge lines meet): the ring less the band each edge sweeps
 * moving δ inward and, at each re-entrant corner, the kite between the two moved edges' ends and
 * their lines' crossing (the mitre). A convex ring is clipped by its edges' half-planes moved δ
 * inward (the same set: inside a convex polygon the distance to the boundary is the least distance to
 * an edge line). Otherwise the raw offset ring (the moved lines' consecutive crossings) is the answer
 * when it is simple, inside the ring and has every edge pointing its original way (no edge has
 * vanished), or, when edges vanished between convex corners only, the ring without them
 * (collapseVanishedEdges) under the same checks; else the bands and kites are subtracted with
 * Clipper2 (exactClip).
 * @param ring - interleaved counter-clockwise simple ring without repeated vertices.
 * @param convex - whether the ring is convex.
 * @param delta - inward distance, ≥ 0.
 * @param extent - largest |coordinate| of the ring, > 0.
 * @param result - receives the offset's piece(s).
 */
export function mitreInset(
  ring: Float64Array,
  convex: boolean,
  delta: number,
  extent: number,
  result: Float64Array[],
): void {
  const m = ring.length >> 1;
  if (planes.length < 3 * m) planes = new Float64Array(6 * m);
  if (out.length < 4 * m + 8) {
    out = new Float64Array(8 * m + 16);
    scratch = new Float64Array(8 * m + 16);
  }
  if (convex) {
    const k = edgeHalfPlanes(ring, m, delta, planes, 0);
    const count = clipHalfPlanes(ring, m, planes, k, out, scratch);
    if (count >= 3) {
      const piece = ringArena.take(2 * count);
      piece.set(out.subarray(0, 2 * count));
      result.push(piece);
    }
    return;
  }
  // Moved lines: a·x + b·y = c + δ with (a, b) edge i's inward unit normal.
  for (let i = 0; i < m; i++) {
    const j = i + 1 === m ? 0 : i + 1;
    const px = ring[2 * i]!;
    const py = ring[2 * i + 1]!;
    const dx = ring[2 * j]! - px;
    const dy = ring[2 * j + 1]! - py;
    const l = Math.sqrt(dx * dx + dy * dy);
    planes[3 * i] = -dy / l;
    planes[3 * i + 1] = dx / l;
    planes[3 * i + 2] = (-dy * px + dx * py) / l + delta;
  }
  const raw = ringArena.take(2 * m);
  for (let j = 0; j < m; j++) {
    const i = j === 0 ? m - 1 : j - 1;
    const a1 = planes[3 * i]!;
    const b1 = planes[3 * i + 1]!;
    const c1 = planes[3 * i + 2]!;
    const a2 = planes[3 * j]!;
    const b2 = planes[3 * j + 1]!;
    const c2 = planes[3 * j + 2]!;
    const det = a1 * b2 - b1 * a2;
    if (Math.abs(det) < 1e-12) {
      // Straight corner: the vertex moved along the normal.
      raw[2 * j] = ring[2 * j]! + delta * a2;
      raw[2 * j + 1] = ring[2 * j + 1]! + delta * b2;
    } else {
      raw[2 * j] = (c1 * b2 - b1 * c2) / det;
      raw[2 * j + 1] = (a1 * c2 - c1 * a2) / det;
    }
  }
  let intact = true;
  for (let i = 0; i < m && intact; i++) {
    const j = i + 1 === m ? 0 : i + 1;
    const ox = ring[2 * j]! - ring[2 * i]!;
    const oy = ring[2 * j + 1]! - ring[2 * i + 1]!;
    const rx = raw[2 * j]! - raw[2 * i]!;
    const ry = raw[2 * j + 1]! - raw[2 * i + 1]!;
    if (!(ox * rx + oy * ry > 0)) intact = false;
  }
  if (intact && simplePolygonProblem(raw, m) === null && ringInside(raw, ring)) {
    result.push(raw);
    return;
  }
  if (!intact) {
    // Edges that vanished between convex corners: their neighbours' moved lines meet directly.
    const collapsed = collapseVanishedEdges(planes, m);
    if (collapsed !== null && simplePolygonProblem(collapsed, collapsed.length >> 1) === null && ringInside(collapsed, ring)) {
      result.push(collapsed);
      return;
    }
  }
  // The band every edge sweeps moving δ inward, and at each re-entrant corner the mitre's kite
  // (corner, the two moved edge ends, the moved lines' crossing), all counter-clockwise.
  const clips: Float64Array[] = [];
  let reach = extent;
  for (let i = 0; i < m; i++) {
    const j = i + 1 === m ? 0 : i + 1;
    const a = planes[3 * i]! * delta;
    const b = planes[3 * i + 1]! * delta;
    clips.push(
      new Float64Array([ring[2 * i]!, ring[2 * i + 1]!, ring[2 * j]!, ring[2 * j + 1]!, ring[2 * j]! + a, ring[2 * j + 1]! + b, ring[2 * i]! + a, ring[2 * i + 1]! + b]),
    );
    // Corner j, from edge i to edge j: re-entrant when it turns right.
    const k = j + 1 === m ? 0 : j + 1;
    const ex = ring[2 * j]! - ring[2 * i]!;
    const ey = ring[2 * j + 1]! - ring[2 * i + 1]!;
    const fx = ring[2 * k]! - ring[2 * j]!;
    const fy = ring[2 * k + 1]! - ring[2 * j + 1]!;
    if (ex * fy - ey * fx < -1e-12 * Math.hypot(ex, ey) * Math.hypot(fx, fy)) {
      const vx = ring[2 * j]!;
      const vy = ring[2 * j + 1]!;
      const mx = raw[2 * j]!;
      const my = raw[2 * j + 1]!;
      reach = Math.max(reach, Math.abs(mx), Math.abs(my));
      // Corner, end of moved edge j, crossing, end of moved edge i: counter-clockwise at a right turn.
      clips.push(new Float64Array([vx, vy, vx + planes[3 * j]! * delta, vy + planes[3 * j + 1]! * delta, mx, my, vx + a, vy + b]));
    }
  }
  for (const p of exactClip("difference", [ring], clips, reach + delta)) result.push(p);
}

/** Whether ring `inner` lies inside ring `outer`: no two edges meet, and inner's first vertex is inside outer (crossing number). */
function ringInside(inner: Float64Array, outer: Float64Array): boolean {
  const m = inner.length >> 1;
  const n = outer.length >> 1;
  for (let i = 0; i < m; i++) {
    const i2 = i + 1 === m ? 0 : i + 1;
    const ax = inner[2 * i]!;
    const ay = inner[2 * i + 1]!;
    const bx = inner[2 * i2]!;
    const by = inner[2 * i2 + 1]!;
    for (let j = 0; j < n; j++) {
      const j2 = j + 1 === n ? 0 : j + 1;
      const cx = outer[2 * j]!;
      const cy = outer[2 * j + 1]!;
      const dx = outer[2 * j2]!;
      const dy = outer[2 * j2 + 1]!;
      const o1 = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
      const o2 = (bx - ax) * (dy - ay) - (by - ay) * (dx - ax);
      const o3 = (dx - cx) * (ay - cy) - (dy - cy) * (ax - cx);
      const o4 = (dx - cx) * (by - cy) - (dy - cy) * (bx - cx);
      if (o1 * o2 <= 0 && o3 * o4 <= 0) return false;
    }
  }
  const px = inner[0]!;
  const py = inner[1]!;
  let inside = false;
  for (let j = 0, k = n - 1; j < n; k = j++) {
    const yj = outer[2 * j + 1]!;
    const yk = outer[2 * k + 1]!;
    if (yj > py !== yk > py) {
      const x = outer[2 * j]! + ((py - yj) * (outer[2 * k]! - outer[2 * j]!)) / (yk - yj);
      if (px < x) inside = !inside;
    }
  }
  return inside;
}
