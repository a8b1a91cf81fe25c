import { ringArena } from "./ring-arena.js";

/** Least sine of a corner's turn that counts as a turn (parallel moved lines have no crossing). */
const MIN_TURN = 1e-9;

/**
 * The mitred offset ring after edges that vanished between two convex corners are dropped: such an
 * edge's moved line no longer bounds the offset near its corners, where the offset is locally the
 * intersection of the neighbouring half-planes, so the neighbours' moved lines meet directly (as in
 * the wavefront of the straight skeleton; Aichholzer et al. 1995, "A novel type of skeleton for
 * polygons"). Edges are dropped one at a time while some edge of the ring points against its line.
 * @param planes - the moved lines, triples [a, b, c] (a·x + b·y = c; (a, b) the inward unit normal),
 *   one per edge of a counter-clockwise ring, in order.
 * @param m - number of lines.
 * @returns the ring (interleaved), or null when a vanished edge touches a re-entrant corner, two
 *   lines that would meet are parallel or meet in a re-entrant corner, or fewer than 3 edges remain.
 */
export function collapseVanishedEdges(planes: Float64Array, m: number): Float64Array | null {
  const idx: number[] = [];
  for (let i = 0; i < m; i++) idx.push(i);
  const det = (p: number, q: number): number => planes[3 * p]! * planes[3 * q + 1]! - planes[3 * p + 1]! * planes[3 * q]!;
  for (;;) {
    const k = idx.length;
    if (k < 3) return null;
    const xs = ringArena.take(2 * k);
    for (let j = 0; j < k; j++) {
      const p = idx[j === 0 ? k - 1 : j - 1]!;
      const q = idx[j]!;
      const d = det(p, q);
      if (!(d > MIN_TURN)) return null; // parallel, or a re-entrant corner among the merged ones
      const c1 = planes[3 * p + 2]!;
      const c2 = planes[3 * q + 2]!;
      xs[2 * j] = (c1 * planes[3 * q + 1]! - planes[3 * p + 1]! * c2) / d;
      xs[2 * j + 1] = (planes[3 * p]! * c2 - c1 * planes[3 * q]!) / d;
    }
    let worst = -1;
    let worstLen = 0;
    for (let j = 0; j < k; j++) {
      const q = idx[j]!;
      const n = j + 1 === k ? 0 : j + 1;
      // Signed length along the line's direction (b, −a).
      const len = (xs[2 * n]! - xs[2 * j]!) * planes[3 * q + 1]! - (xs[2 * n + 1]! - xs[2 * j + 1]!) * planes[3 * q]!;
      if (len < worstLen) {
        worstLen = len;
        worst = j;
      }
    }
    if (worst < 0) return xs;
    idx.splice(worst, 1);
  }
}
