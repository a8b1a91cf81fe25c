import { Clipper64, ClipType, FillRule } from "clipper2-ts";
import type { Path64, Point64 } from "clipper2-ts";

/** The Boolean operations {@link exactClip} offers. */
export type ExactClipOp = "intersection" | "difference" | "union-positive";

/**
 * Integer grid of {@link exactClip}: coordinates are scaled by a power of two so that the largest
 * |coordinate| maps to at most 2^25 grid units; differences stay below 9e7, where clipper2-ts 2.0.1
 * forms its cross products exactly in doubles (`crossProductSign`; derived).
 */
const GRID_UNITS = 33_554_432;

let fx = new Float64Array(1024);
let fy = new Float64Array(1024);
let count = 1;
let inv = 1;
let lastGrid = 0;
const clipper = new Clipper64();

function grow(): void {
  const nx = new Float64Array(fx.length * 2);
  const ny = new Float64Array(fy.length * 2);
  nx.set(fx);
  ny.set(fy);
  fx = nx;
  fy = ny;
}

function store(x: number, y: number): number {
  if (count >= fx.length) grow();
  fx[count] = x;
  fy[count] = y;
  return count++;
}

/**
 * Float position of an intersection Clipper reports: the crossing of the two input edges' lines,
 * computed from their float end points (z holds the id of each end point). When the lines are
 * nearly parallel or the result strays from Clipper's grid point, the grid point is kept.
 */
function onIntersection(b1: Point64, t1: Point64, b2: Point64, t2: Point64, ip: Point64): void {
  const z = ip.z ?? 0;
  if (z !== 0) return; // an input vertex: its own float position is known
  const i1 = b1.z ?? 0;
  const j1 = t1.z ?? 0;
  const i2 = b2.z ?? 0;
  const j2 = t2.z ?? 0;
  const gx = ip.x * inv;
  const gy = ip.y * inv;
  if (i1 === 0 || j1 === 0 || i2 === 0 || j2 === 0) {
    ip.z = store(gx, gy);
    return;
  }
  const ax = fx[i1]!;
  const ay = fy[i1]!;
  const dx1 = fx[j1]! - ax;
  const dy1 = fy[j1]! - ay;
  const bx = fx[i2]!;
  const by = fy[i2]!;
  const dx2 = fx[j2]! - bx;
  const dy2 = fy[j2]! - by;
  const den = dx1 * dy2 - dy1 * dx2;
  let x = NaN;
  let y = NaN;
  // Clipper's crossing comes from rounded end points, so it may sit (grid / sin θ) away from the
  // float crossing along the edges: accept the float crossing within that reach.
  let reach = 4 * inv;
  const sin = Math.abs(den) / Math.sqrt((dx1 * dx1 + dy1 * dy1) * (dx2 * dx2 + dy2 * dy2));
  if (sin > 1e-9) {
    const t = ((bx - ax) * dy2 - (by - ay) * dx2) / den;
    x = ax + t * dx1;
    y = ay + t * dy1;
    reach += (4 * inv) / sin;
  }
  // Nearly collinear edges (boundaries that coincide in the float geometry): the crossing is
  // ill-conditioned, so the grid point is projected onto the first edge's float line instead.
  if (!(Math.abs(x - gx) <= reach && Math.abs(y - gy) <= reach)) {
    const l2 = dx1 * dx1 + dy1 * dy1;
    const t = l2 > 0 ? ((gx - ax) * dx1 + (gy - ay) * dy1) / l2 : 0;
    x = ax + t * dx1;
    y = ay + t * dy1;
    if (!(Math.abs(x - gx) <= 4 * inv && Math.abs(y - gy) <= 4 * inv)) {
      x = gx;
      y = gy;
    }
  }
  ip.z = store(x, y);
}

/** Whether b is a zero-width spike between a and c (or a repeated vertex); see dropSpikes. */
function isSpike(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, tol: number): boolean {
  const ex = bx - ax;
  const ey = by - ay;
  const fx2 = cx - bx;
  const fy2 = cy - by;
  if ((ex === 0 && ey === 0) || (fx2 === 0 && fy2 === 0)) return true;
  if (ex * fx2 + ey * fy2 >= 0) return false;
  // Distance from the shorter edge's far end to the longer edge's line.
  const le = Math.hypot(ex, ey);
  const lf = Math.hypot(fx2, fy2);
  const dist = le <= lf ? Math.abs(fx2 * (ay - by) - fy2 * (ax - bx)) / lf : Math.abs(ex * (cy - by) - ey * (cx - bx)) / le;
  return dist <= tol;
}

/**
 * Removes the rounding's zero-width spikes from a ring: a vertex where the ring folds back on itself
 * (its two edges opposite, the shorter one's far end within `tol` of the longer one's line), and repeated
 * vertices. Such spikes are the trace of a sliver thinner than the grid between two boundaries that
 * coincide in the float geometry.
 */
function dropSpikes(ring: Float64Array, tol: number): Float64Array {
  const m = ring.length >> 1;
  // Usually there is none: no removal can start unless some cyclic triple of the ring is a spike.
  let any = false;
  for (let i = 0; i < m && !any; i++) {
    const a = i === 0 ? m - 1 : i - 1;
    const b = i + 1 === m ? 0 : i + 1;
    any = isSpike(ring[2 * a]!, ring[2 * a + 1]!, ring[2 * i]!, ring[2 * i + 1]!, ring[2 * b]!, ring[2 * b + 1]!, tol);
  }
  if (!any) return ring;
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < m; i++) {
    xs.push(ring[2 * i]!);
    ys.push(ring[2 * i + 1]!);
    let k = xs.length;
    while (k >= 3 && isSpike(xs[k - 3]!, ys[k - 3]!, xs[k - 2]!, ys[k - 2]!, xs[k - 1]!, ys[k - 1]!, tol)) {
      xs.splice(k - 2, 1);
      ys.splice(k - 2, 1);
      k--;
    }
  }
  // Around the closing vertex.
  let changed = true;
  while (changed && xs.length >= 3) {
    changed = false;
    const k = xs.length;
    if (isSpike(xs[k - 2]!, ys[k - 2]!, xs[k - 1]!, ys[k - 1]!, xs[0]!, ys[0]!, tol)) {
      xs.pop();
      ys.pop();
      changed = true;
    } else if (isSpike(xs[k - 1]!, ys[k - 1]!, xs[0]!, ys[0]!, xs[1]!, ys[1]!, tol)) {
      xs.shift();
      ys.shift();
      changed = true;
    }
  }
  const outRing = new Float64Array(2 * xs.length);
  for (let i = 0; i < xs.length; i++) {
    outRing[2 * i] = xs[i]!;
    outRing[2 * i + 1] = ys[i]!;
  }
  return outRing;
}

function toPath(ring: Float64Array, scale: number): Path64 {
  const m = ring.length >> 1;
  const path: Path64 = new Array<Point64>(m);
  for (let i = 0; i < m; i++) {
    const x = ring[2 * i]!;
    const y = ring[2 * i + 1]!;
    path[i] = { x: Math.round(x * scale), y: Math.round(y * scale), z: store(x, y) };
  }
  return path;
}

/**
 * Polygon Boolean operation on float rings through Clipper2 (clipper2-ts 2.0.1, Vatti's sweep on an
 * integer grid; Vatti 1992), returning float rings whose vertices are the exact float inputs or the
 * float crossings of two input edges: Clipper2 decides the topology on the grid, and every output
 * vertex is then put back where the float geometry has it (the grid's rounding, about 1e-7 of the
 * lot's size, does not reach the areas).
 * @param op - "intersection" (subjects ∩ clips), "difference" (subjects − clips), or
 *   "union-positive" (the region of positive winding number of the subjects; clips ignored).
 * @param subjects - closed rings, interleaved `[x0, y0, x1, y1, …]`, coordinates near the origin.
 * @param clips - closed rings (NonZero fill).
 * @param extent - the largest |coordinate| of any input, > 0.
 * @returns the result's rings, counter-clockwise outer rings (holes, if any, clockwise).
 */
export function exactClip(
  op: ExactClipOp,
  subjects: readonly Float64Array[],
  clips: readonly Float64Array[],
  extent: number,
): Float64Array[] {
  const scale = 2 ** Math.floor(Math.log2(GRID_UNITS / extent));
  inv = 1 / scale;
  lastGrid = inv;
  count = 1;
  clipper.clear();
  clipper.zCallback = onIntersection;
  clipper.addSubject(subjects.map((r) => toPath(r, scale)));
  if (op !== "union-positive") clipper.addClip(clips.map((r) => toPath(r, scale)));
  const out: Path64[] = [];
  const type = op === "intersection" ? ClipType.Intersection : op === "difference" ? ClipType.Difference : ClipType.Union;
  const fill = op === "union-positive" ? FillRule.Positive : FillRule.NonZero;
  clipper.execute(type, fill, out);
  const rings: Float64Array[] = [];
  for (const path of out) {
    const m = path.length;
    if (m < 3) continue;
    const ring = new Float64Array(2 * m);
    for (let i = 0; i < m; i++) {
      const p = path[i]!;
      const z = p.z ?? 0;
      if (z > 0 && z < count) {
        ring[2 * i] = fx[z]!;
        ring[2 * i + 1] = fy[z]!;
      } else {
        ring[2 * i] = p.x * inv;
        ring[2 * i + 1] = p.y * inv;
      }
    }
    const clean = dropSpikes(ring, 4 * inv);
    if (clean.length >= 6) rings.push(clean);
  }
  return rings;
}

/** Grid spacing (metres) of the last {@link exactClip} call: the size of the rounding it may leave. */
export function exactClipGrid(): number {
  return lastGrid;
}
