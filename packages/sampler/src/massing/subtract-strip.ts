import { subtractConvexRegion } from "../geometry/subtract-convex-region.js";
import type { LotFrame } from "./lot-frame.js";

const chain = new Float64Array(12);

/**
 * The strip of lot line i at depth s with at least one re-entrant end, as the half-planes of a convex
 * region in counter-clockwise order along its boundary (the order subtractConvexRegion walks): the
 * line itself (n·x ≥ c, running along the edge), the perpendicular through a re-entrant end
 * (−u·x ≥ −(u·P + length)), the parallel at depth s (−n·x ≥ −(c + s)), the perpendicular through a
 * re-entrant start (u·x ≥ u·P); with one end convex the chain starts and ends at infinity, so it
 * begins just after the missing perpendicular.
 * @returns the number of half-planes written to `out` (3, or 4 when both ends are re-entrant).
 */
function stripChain(f: LotFrame, i: number, s: number, out: Float64Array): number {
  const nx = f.nx[i]!;
  const ny = f.ny[i]!;
  const c = f.c[i]!;
  const ux = f.ux[i]!;
  const uy = f.uy[i]!;
  const t0 = ux * f.xy[2 * i]! + uy * f.xy[2 * i + 1]!;
  const t1 = t0 + f.len[i]!;
  const start = f.reflexStart[i] === 1;
  const end = f.reflexEnd[i] === 1;
  // Line, end perpendicular, parallel, start perpendicular (cyclic), starting after a missing one.
  const ring = [nx, ny, c, end ? -ux : NaN, -uy, -t1, -nx, -ny, -(c + s), start ? ux : NaN, uy, t0];
  const first = end ? 0 : 2;
  let k = 0;
  for (let r = 0; r < 4; r++) {
    const j = (first + r) % 4;
    if (Number.isNaN(ring[3 * j]!)) continue;
    out[3 * k] = ring[3 * j]!;
    out[3 * k + 1] = ring[3 * j + 1]!;
    out[3 * k + 2] = ring[3 * j + 2]!;
    k++;
  }
  return k;
}

/**
 * Pieces less the strip of lot line i at depth s bounded by the perpendicular(s) at its re-entrant
 * end(s) (the yard rule's strip; see yardPieces), in floating point by subtractConvexRegion. Equal to
 * the pieces less the yard when the yard is the whole common part of the lot and the strip.
 * @param f - the lot frame.
 * @param i - edge index, with a re-entrant start or end.
 * @param s - depth, > 0.
 * @param pieces - counter-clockwise simple rings inside the lot.
 * @returns the remaining pieces, or null when some crossings do not pair up cleanly (the caller then
 *   uses a polygon clipper).
 */
export function subtractStrip(f: LotFrame, i: number, s: number, pieces: readonly Float64Array[]): Float64Array[] | null {
  const k = stripChain(f, i, s, chain);
  const closed = f.reflexStart[i] === 1 && f.reflexEnd[i] === 1;
  const out: Float64Array[] = [];
  for (const ring of pieces) if (!subtractConvexRegion(ring, chain, k, closed, f.eps, out)) return null;
  return out;
}
