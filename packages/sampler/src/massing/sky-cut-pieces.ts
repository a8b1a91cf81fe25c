import { exactClip } from "../geometry/exact-clip.js";
import { splitByHalfPlane } from "../geometry/split-by-half-plane.js";
import type { LotFrame } from "./lot-frame.js";
import { subtractStrip } from "./subtract-strip.js";
import { yardPieces } from "./yard-pieces.js";

const yardScratch: Float64Array[] = [];

/** Whether the street yard of edge i at depth d is the whole common part of the lot and its strip. */
function yardIsWholeStrip(f: LotFrame, i: number, d: number): boolean {
  yardScratch.length = 0;
  const common = yardPieces(f, i, d, yardScratch);
  return common === yardScratch.length;
}

/**
 * The plate of a storey above the sky exposure plane's start: the base plate less the yards of the
 * street lot lines (front and street) at depth d, built by the yard rule (see yardPieces). A base
 * piece wholly at least d behind a street line keeps that line's cut out of the work; a piece wholly
 * on the lot's side of the line and inside the strip's end bounds, when that yard is the whole common
 * part of the lot and the strip, is cut by the half-plane at depth d (splitByHalfPlane); anything else
 * is base − yards (see fullCut).
 * @param f - the lot frame.
 * @param base - the base plate's pieces (counter-clockwise).
 * @param streets - indices of the street lot lines.
 * @param d - depth of the cut, (z − startHeight) / ratio.
 * @returns the plate's pieces.
 */
export function skyCutPieces(f: LotFrame, base: readonly Float64Array[], streets: readonly number[], d: number): Float64Array[] {
  let pieces: Float64Array[] = base.slice();
  for (const i of streets) {
    const nx = f.nx[i]!;
    const ny = f.ny[i]!;
    const c = f.c[i]!;
    const ux = f.ux[i]!;
    const uy = f.uy[i]!;
    const t0 = ux * f.xy[2 * i]! + uy * f.xy[2 * i + 1]!;
    const t1 = t0 + f.len[i]!;
    const next: Float64Array[] = [];
    let wholeStrip: boolean | undefined;
    for (const ring of pieces) {
      const m = ring.length >> 1;
      let minDepth = Infinity;
      let minT = Infinity;
      let maxT = -Infinity;
      for (let v = 0; v < m; v++) {
        const x = ring[2 * v]!;
        const y = ring[2 * v + 1]!;
        minDepth = Math.min(minDepth, nx * x + ny * y - c);
        const t = ux * x + uy * y;
        minT = Math.min(minT, t);
        maxT = Math.max(maxT, t);
      }
      if (minDepth >= d - f.eps) {
        next.push(ring);
        continue;
      }
      const inBounds =
        minDepth >= -f.eps && (f.reflexStart[i] === 0 || minT >= t0 - f.eps) && (f.reflexEnd[i] === 0 || maxT <= t1 + f.eps);
      wholeStrip ??= inBounds && yardIsWholeStrip(f, i, d);
      if (!inBounds || !wholeStrip) return fullCut(f, base, streets, d);
      if (!splitByHalfPlane(ring, nx, ny, c + d, f.eps, next)) return fullCut(f, base, streets, d);
    }
    pieces = next;
  }
  return pieces;
}

/** Whether every vertex of `ring` is at least d − eps behind every street line (no street yard at depth d reaches inside it). */
function behindEveryStreet(f: LotFrame, ring: Float64Array, streets: readonly number[], d: number): boolean {
  for (const i of streets) {
    const nx = f.nx[i]!;
    const ny = f.ny[i]!;
    const c = f.c[i]!;
    for (let v = 0; v < ring.length; v += 2) if (nx * ring[v]! + ny * ring[v + 1]! - c < d - f.eps) return false;
  }
  return true;
}

/**
 * base − street yards: each yard subtracted in floating point (subtractStrip), or, when some
 * crossings do not pair up cleanly, all of them through Clipper2, where base pieces wholly at least d
 * behind every street line meet no yard's inside (a yard lies within d of its line) and are kept as
 * they are, out of Clipper's work.
 */
function fullCut(f: LotFrame, base: readonly Float64Array[], streets: readonly number[], d: number): Float64Array[] {
  const yards: Float64Array[] = [];
  let exact: Float64Array[] | null = base.slice();
  for (const i of streets) {
    const before = yards.length;
    const common = yardPieces(f, i, d, yards);
    if (exact === null || common === 0) continue;
    exact = subtractStrip(f, i, d, exact, common === yards.length - before ? undefined : yards.slice(before));
  }
  if (exact !== null) return exact;
  if (yards.length === 0) return base.slice();
  const kept: Float64Array[] = [];
  const cut: Float64Array[] = [];
  for (const ring of base) (behindEveryStreet(f, ring, streets, d) ? kept : cut).push(ring);
  if (cut.length === 0) return kept;
  for (const r of exactClip("difference", cut, yards, f.extent)) kept.push(r);
  return kept;
}
