import { ringArena } from "../geometry/ring-arena.js";
import type { LotLine } from "./massing-types.js";

/**
 * A simple lot prepared for the yard rule: counter-clockwise vertices near the origin, each edge's
 * kind, unit direction, inward unit normal and line offset, and which of its ends are re-entrant.
 */
export interface LotFrame {
  /** Interleaved counter-clockwise vertices. */
  readonly xy: Float64Array;
  readonly n: number;
  /** Kind of counter-clockwise edge i (from vertex i to vertex i + 1). */
  readonly kinds: readonly LotLine[];
  /** Unit direction (ux, uy) of edge i. */
  readonly ux: Float64Array;
  readonly uy: Float64Array;
  /** Length of edge i. */
  readonly len: Float64Array;
  /** Inward unit normal (nx, ny) = (−uy, ux) and offset c = n·P of edge i's line. */
  readonly nx: Float64Array;
  readonly ny: Float64Array;
  readonly c: Float64Array;
  /** 1 when the start (end) vertex of edge i is re-entrant (interior angle above 180°). */
  readonly reflexStart: Uint8Array;
  readonly reflexEnd: Uint8Array;
  /** Whether the whole lot lies on edge i's inner side (no vertex beyond its line). */
  readonly inner: readonly boolean[];
  /** Largest |coordinate| of the lot, and a length tolerance (1e-12 of its diameter). */
  readonly extent: number;
  readonly eps: number;
  /** Bounding box of the lot. */
  readonly minX: number;
  readonly minY: number;
  readonly maxX: number;
  readonly maxY: number;
}

/** Relative tolerance under which a turn counts as straight (neither convex nor re-entrant). */
const STRAIGHT = 1e-12;

type FrameBuffers = Pick<LotFrame, "ux" | "uy" | "len" | "nx" | "ny" | "c" | "reflexStart" | "reflexEnd">;

/** Per-edge arrays by vertex count, reused from one evaluation to the next (one evaluation at a time). */
const buffers = new Map<number, FrameBuffers>();

function buffersFor(n: number): FrameBuffers {
  let b = buffers.get(n);
  if (b === undefined) {
    b = {
      ux: new Float64Array(n),
      uy: new Float64Array(n),
      len: new Float64Array(n),
      nx: new Float64Array(n),
      ny: new Float64Array(n),
      c: new Float64Array(n),
      reflexStart: new Uint8Array(n),
      reflexEnd: new Uint8Array(n),
    };
    // Lots of up to 64 vertices keep their arrays; larger ones are rare and allocate each time.
    if (n <= 64) buffers.set(n, b);
  }
  return b;
}

/**
 * Builds the frame of a simple lot. The per-edge arrays are shared by every frame of the same vertex
 * count: a frame is valid until the next call with that count (the evaluator uses one at a time).
 * @param xy - interleaved vertices (either orientation), already checked simple.
 * @param n - number of vertices.
 * @param lotLines - kind of edge i, in the order of `xy`.
 * @param ccw - whether `xy` is counter-clockwise; if not, the frame reverses it and remaps the kinds.
 * @returns the frame.
 */
export function lotFrame(xy: Float64Array, n: number, lotLines: readonly LotLine[], ccw: boolean): LotFrame {
  const b = buffersFor(n);
  const v = ringArena.take(2 * n);
  const kinds: LotLine[] = new Array<LotLine>(n);
  for (let j = 0; j < n; j++) {
    const src = ccw ? j : n - 1 - j;
    v[2 * j] = xy[2 * src]!;
    v[2 * j + 1] = xy[2 * src + 1]!;
    // Reversed: new edge j runs from old vertex n−1−j to old vertex n−2−j, i.e. old edge n−2−j.
    kinds[j] = lotLines[ccw ? j : (2 * n - 2 - j) % n]!;
  }
  const { ux, uy, len, nx, ny, c, reflexStart, reflexEnd } = b;
  let extent = 0;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const px = v[2 * i]!;
    const py = v[2 * i + 1]!;
    const dx = v[2 * j]! - px;
    const dy = v[2 * j + 1]! - py;
    const l = Math.sqrt(dx * dx + dy * dy);
    ux[i] = dx / l;
    uy[i] = dy / l;
    len[i] = l;
    nx[i] = -dy / l;
    ny[i] = dx / l;
    c[i] = nx[i]! * px + ny[i]! * py;
    extent = Math.max(extent, Math.abs(px), Math.abs(py));
    minX = Math.min(minX, px);
    maxX = Math.max(maxX, px);
    minY = Math.min(minY, py);
    maxY = Math.max(maxY, py);
  }
  reflexStart.fill(0);
  reflexEnd.fill(0);
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    // Turn at vertex j from edge i to edge j: negative on a counter-clockwise ring = re-entrant.
    const cross = ux[i]! * uy[j]! - uy[i]! * ux[j]!;
    if (cross < -STRAIGHT) {
      reflexEnd[i] = 1;
      reflexStart[j] = 1;
    }
  }
  const eps = 1e-12 * Math.hypot(maxX - minX, maxY - minY);
  const inner: boolean[] = [];
  for (let i = 0; i < n; i++) {
    let all = true;
    for (let j = 0; j < n && all; j++) all = nx[i]! * v[2 * j]! + ny[i]! * v[2 * j + 1]! - c[i]! >= -eps;
    inner.push(all);
  }
  return { xy: v, n, kinds, ux, uy, len, nx, ny, c, reflexStart, reflexEnd, inner, extent, eps, minX, minY, maxX, maxY };
}
