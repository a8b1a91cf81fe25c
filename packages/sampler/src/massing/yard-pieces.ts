import { clipHalfPlaneArcs, clippedArcs } from "../geometry/clip-half-plane-arcs.js";
import { clipHalfPlanes } from "../geometry/clip-half-planes.js";
import { exactClip, exactClipGrid } from "../geometry/exact-clip.js";
import { ringArena } from "../geometry/ring-arena.js";
import { ringBoundaryDistance } from "../geometry/ring-boundary-distance.js";
import { splitByHalfPlane } from "../geometry/split-by-half-plane.js";
import type { LotFrame } from "./lot-frame.js";

let bufA = new Float64Array(256);
let bufB = new Float64Array(256);
const planes = new Float64Array(12);

/**
 * The strip of edge i at depth s as half-planes a·x + b·y ≥ c: the lot side of the line, within s of
 * it, and, at a re-entrant end, the side of the perpendicular through that corner facing the edge.
 * @returns the number of half-planes written to `planes`.
 */
function stripPlanes(f: LotFrame, i: number, s: number): number {
  const nx = f.nx[i]!;
  const ny = f.ny[i]!;
  const c = f.c[i]!;
  planes[0] = nx;
  planes[1] = ny;
  planes[2] = c;
  planes[3] = -nx;
  planes[4] = -ny;
  planes[5] = -(c + s);
  let k = 2;
  const ux = f.ux[i]!;
  const uy = f.uy[i]!;
  const px = f.xy[2 * i]!;
  const py = f.xy[2 * i + 1]!;
  if (f.reflexStart[i] === 1) {
    planes[3 * k] = ux;
    planes[3 * k + 1] = uy;
    planes[3 * k + 2] = ux * px + uy * py;
    k++;
  }
  if (f.reflexEnd[i] === 1) {
    planes[3 * k] = -ux;
    planes[3 * k + 1] = -uy;
    planes[3 * k + 2] = -(ux * px + uy * py + f.len[i]!);
    k++;
  }
  return k;
}

/** The first `length` doubles of `src` as a ring of the arena. */
function copyRing(src: Float64Array, length: number): Float64Array {
  const ring = ringArena.take(length);
  ring.set(src.subarray(0, length));
  return ring;
}

/**
 * The yard of lot line i at depth s under the yard rule for simple lots: the part of the lot inside
 * the strip between the line and its parallel s inward, bounded at a re-entrant end of the segment by
 * the perpendicular through that corner (unbounded at a convex end), keeping only the piece(s) that
 * touch the segment. The lot is clipped in floating point (one half-plane after another, pieces split
 * apart by splitByHalfPlane); when the crossings do not pair up cleanly, Clipper2 splits the pieces
 * (see exactClip).
 * @param f - the lot frame.
 * @param i - edge index.
 * @param s - depth, > 0.
 * @param out - receives the yard's polygon(s), counter-clockwise.
 * @returns how many pieces the lot and the strip have in common (the yard is the whole common part
 *   when this equals the number of pieces written).
 */
export function yardPieces(f: LotFrame, i: number, s: number, out: Float64Array[]): number {
  const k = stripPlanes(f, i, s);
  const need = 2 * (2 * f.n + 8);
  if (bufA.length < need) {
    bufA = new Float64Array(2 * need);
    bufB = new Float64Array(2 * need);
  }
  let src = f.xy;
  let m = f.n;
  let dst = bufA;
  let j = 0;
  for (; j < k; j++) {
    const count = clipHalfPlaneArcs(src, m, planes[3 * j]!, planes[3 * j + 1]!, planes[3 * j + 2]!, f.eps, dst);
    if (clippedArcs() > 1) break; // src, m: still the input of plane j
    if (count < 3) return 0;
    m = count;
    src = dst;
    dst = dst === bufA ? bufB : bufA;
  }
  if (j === k) {
    out.push(copyRing(src, 2 * m));
    return 1;
  }
  // Several arcs: split the pieces apart, plane by plane from plane j on.
  let pieces: Float64Array[] = [src === f.xy ? f.xy : copyRing(src, 2 * m)];
  let clean = true;
  for (let p = j; p < k && clean; p++) {
    const next: Float64Array[] = [];
    for (const ring of pieces) {
      if (!splitByHalfPlane(ring, planes[3 * p]!, planes[3 * p + 1]!, planes[3 * p + 2]!, f.eps, next)) {
        clean = false;
        break;
      }
    }
    pieces = next;
  }
  if (!clean) pieces = clipperPieces(f, k, s);
  const mx = f.xy[2 * i]! + 0.5 * f.len[i]! * f.ux[i]!;
  const my = f.xy[2 * i + 1]! + 0.5 * f.len[i]! * f.uy[i]!;
  const tol = clean ? 1e3 * f.eps : 8 * exactClipGrid();
  for (const p of pieces) if (ringBoundaryDistance(p, mx, my) <= tol) out.push(p);
  return pieces.length;
}

/** The pieces of lot ∩ strip from Clipper2 (the strip closed by a box around the lot). */
function clipperPieces(f: LotFrame, k: number, s: number): Float64Array[] {
  const pad = Math.hypot(f.maxX - f.minX, f.maxY - f.minY) + s;
  const box = new Float64Array([
    f.minX - pad, f.minY - pad, f.maxX + pad, f.minY - pad, f.maxX + pad, f.maxY + pad, f.minX - pad, f.maxY + pad,
  ]);
  const stripBuf = new Float64Array(2 * (4 + k) + 8);
  const scratch = new Float64Array(2 * (4 + k) + 8);
  const ms = clipHalfPlanes(box, 4, planes, k, stripBuf, scratch);
  if (ms < 3) return [];
  return exactClip("intersection", [f.xy], [stripBuf.slice(0, 2 * ms)], f.extent + pad);
}
