import { pointInRing } from "../geometry/point-in-ring.js";
import { ringBoundaryDistance } from "../geometry/ring-boundary-distance.js";
import { subtractConvexRegion } from "../geometry/subtract-convex-region.js";
import type { LotFrame } from "./lot-frame.js";

const chain = new Float64Array(12);

/**
 * The strip of lot line i at depth s, as the half-planes of a convex
 * region in counter-clockwise order along its boundary (the order subtractConvexRegion walks): the
 * line itself (n·x ≥ c, running along the edge), the perpendicular through a re-entrant end
 * (−u·x ≥ −(u·P + length)), the parallel at depth s (−n·x ≥ −(c + s)), the perpendicular through a
 * re-entrant start (u·x ≥ u·P); with an end convex the chain starts and ends at infinity, so it
 * begins just after the missing perpendicular (with both ends convex, the two lines are parallel).
 * @returns the number of half-planes written to `out` (2 to 4; 4 when both ends are re-entrant).
 */
function stripChain(f: LotFrame, i: number, s: number, out: Float64Array): number {
  const t0 = f.ux[i]! * f.xy[2 * i]! + f.uy[i]! * f.xy[2 * i + 1]!;
  const c = f.c[i]!;
  const start = f.reflexStart[i] === 1;
  const end = f.reflexEnd[i] === 1;
  // Line, end perpendicular, parallel, start perpendicular (cyclic), starting after a missing one.
  const ring = [f.nx[i]!, f.ny[i]!, c, -f.ux[i]!, -f.uy[i]!, -(t0 + f.len[i]!), -f.nx[i]!, -f.ny[i]!, -(c + s), f.ux[i]!, f.uy[i]!, t0];
  const first = end ? 0 : 2;
  let k = 0;
  for (let r = 0; r < 4; r++) {
    const j = (first + r) % 4;
    if ((j === 1 && !end) || (j === 3 && !start)) continue;
    out[3 * k] = ring[3 * j]!;
    out[3 * k + 1] = ring[3 * j + 1]!;
    out[3 * k + 2] = ring[3 * j + 2]!;
    k++;
  }
  return k;
}

/**
 * Pieces less the yard of lot line i at depth s (the yard rule's strip, bounded by the
 * perpendicular(s) at its re-entrant end(s); see yardPieces), in floating point by
 * subtractConvexRegion: the whole strip when the yard is the whole common part of the lot and the
 * strip, else only the parts of the pieces within the strip that lie in the yard's pieces (the
 * common part's other pieces are apart from them; a part nearer than 1e-3 of the lot's size to the
 * yard without touching it is left to the caller).
 * @param f - the lot frame.
 * @param i - edge index.
 * @param s - depth, > 0.
 * @param pieces - counter-clockwise simple rings inside the lot.
 * @param yard - the yard's pieces when the yard is not the whole common part, else undefined.
 * @returns the remaining pieces, or null when some crossings do not pair up cleanly or a part cannot
 *   be told (the caller then uses a polygon clipper).
 */
export function subtractStrip(
  f: LotFrame,
  i: number,
  s: number,
  pieces: readonly Float64Array[],
  yard?: readonly Float64Array[],
): Float64Array[] | null {
  const k = stripChain(f, i, s, chain);
  const closed = f.reflexStart[i] === 1 && f.reflexEnd[i] === 1;
  const size = Math.hypot(f.maxX - f.minX, f.maxY - f.minY);
  const removes =
    yard === undefined
      ? undefined
      : (x: number, y: number): boolean | null => {
          let d = Infinity;
          for (const r of yard) d = Math.min(d, pointInRing(r, x, y) ? 0 : ringBoundaryDistance(r, x, y));
          return d <= 1e-6 * size ? true : d > 1e-3 * size ? false : null;
        };
  const out: Float64Array[] = [];
  for (const ring of pieces) if (!subtractConvexRegion(ring, chain, k, closed, f.eps, out, removes)) return null;
  return out;
}
