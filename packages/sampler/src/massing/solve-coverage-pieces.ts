import { mitreInset } from "../geometry/mitre-inset.js";
import { ringArea, ringIsConvex, ringPerimeter } from "../geometry/ring-metrics.js";

const MAX_STEPS = 60;

interface Stage {
  readonly pieces: Float64Array[];
  readonly convex: boolean[];
  readonly area: number;
  readonly perimeter: number;
  /** Σ tan(φ/2) over every corner (φ the signed turn). */
  readonly turn: number;
}

function stage(pieces: Float64Array[]): Stage {
  let area = 0;
  let perimeter = 0;
  let turn = 0;
  for (const ring of pieces) {
    const m = ring.length >> 1;
    area += ringArea(ring);
    perimeter += ringPerimeter(ring);
    for (let j = 0; j < m; j++) {
      const i = j === 0 ? m - 1 : j - 1;
      const k = j + 1 === m ? 0 : j + 1;
      const ex = ring[2 * j]! - ring[2 * i]!;
      const ey = ring[2 * j + 1]! - ring[2 * i + 1]!;
      const fx = ring[2 * k]! - ring[2 * j]!;
      const fy = ring[2 * k + 1]! - ring[2 * j + 1]!;
      // tan(φ/2) = sin φ / (1 + cos φ) for the turn φ between unit edge directions.
      turn += (ex * fy - ey * fx) / (Math.hypot(ex, ey) * Math.hypot(fx, fy) + ex * fx + ey * fy);
    }
  }
  return { pieces, convex: pieces.map(ringIsConvex), area, perimeter, turn };
}

/** Smaller root h of turn·h² − P·h + over = 0 (the stage's area model; see solveCoveragePieces), or the Newton step over / P when it has none. */
function quadraticStep(s: Stage, over: number): number {
  const disc = s.perimeter * s.perimeter - 4 * s.turn * over;
  return disc >= 0 ? (2 * over) / (s.perimeter + Math.sqrt(disc)) : over / s.perimeter;
}

function inset(s: Stage, h: number, extent: number): Stage {
  const out: Float64Array[] = [];
  for (let p = 0; p < s.pieces.length; p++) mitreInset(s.pieces[p]!, s.convex[p]!, h, extent, out);
  return stage(out.filter((r) => ringArea(r) > 0));
}

/**
 * The offset of `cur` between 0 (area above the target) and `h` (area `below.area` under it) whose area
 * is within `tol` of the target. A(δ) is decreasing and convex with A′ = −P (see solveCoveragePieces),
 * so a Newton step from the low end (area A₀, perimeter P₀), δ + (A₀ − target) / P₀, stays at or
 * below the root, and the chord through the two ends hits the target at or above it. The first step
 * from a new low end takes its quadratic area model's root (exact when no edge vanishes on the way),
 * later ones Newton's; every other step, when the last one did not halve the bracket, takes the chord's
 * point, and the midpoint when a point falls outside the bracket (round-off). Each step offsets the
 * low end's offset (offsets compose, as in the main loop), so once past the edge that vanished the
 * steps are mostly plain moved-line rings, not Clipper2 differences. When the bracket shrinks to
 * round-off without reaching the target (A steps there), the end nearer the target is returned.
 */
function refine(cur: Stage, h: number, below: Stage, target: number, tol: number, extent: number): Float64Array[] {
  let lo = 0;
  let loStage = cur;
  let hi = h;
  let hiStage = below;
  let chord = false;
  // The quadratic step from `cur` is `h`, which overshot.
  let triedQuadratic = true;
  for (let b = 0; b < 200; b++) {
    const over = loStage.area - target;
    let x: number;
    if (chord) x = lo + (over * (hi - lo)) / (loStage.area - hiStage.area);
    else if (!triedQuadratic) {
      x = lo + quadraticStep(loStage, over);
      triedQuadratic = true;
    } else x = lo + over / loStage.perimeter;
    if (!(x > lo && x < hi)) x = (lo + hi) / 2;
    const width = hi - lo;
    const next = inset(loStage, x - lo, extent);
    if (Math.abs(next.area - target) <= tol) return next.pieces;
    if (next.area > target) {
      lo = x;
      loStage = next;
      triedQuadratic = false;
    } else {
      hi = x;
      hiStage = next;
    }
    if (width <= 1e-15 * (1 + hi)) break;
    chord = !chord && hi - lo > width / 2;
  }
  // The bracket closed on a step of A (the float vertex recovery of a near-degenerate offset): the end nearer the target.
  return loStage.area - target <= target - hiStage.area ? loStage.pieces : hiStage.pieces;
}

/**
 * The coverage cap on a buildable area of one or more pieces: one uniform inward offset δ of every
 * edge of every piece, with mitred corners (see mitreInset), solved so that the total area equals
 * `target` to within `tolerance`.
 *
 * While no edge vanishes, A(δ₀ + h) = A − P·h + h²·Σ tan(φᵢ/2) exactly (φ the signed turn at each
 * corner of the offset at δ₀; derived: every edge moves at unit speed, each corner adds a kite of
 * h²·tan(φ/2)). Each step takes that quadratic's smaller root h from the current offset and offsets
 * the current offset by h: mitred offsets compose (the moved lines of a moved line are the lines moved
 * by the sum; derived), so every step starts from an exact offset and a step with no vanishing edge
 * lands on the root. A(δ) is decreasing and convex (A′ = −P, and P shrinks; derived), so when an edge
 * vanishes within a step the quadratic (which keeps the vanished edge at negative length) stays at
 * or below A and the step stops short of the root; the next step starts from there. A step that
 * overshoots anyway (below the target) is refined from the last offset above it by safeguarded Newton
 * and chord steps (see refine).
 * @param pieces - counter-clockwise simple rings of the buildable area, total area > target.
 * @param target - wanted area (> 0).
 * @param tolerance - allowed |area − target|.
 * @param extent - largest |coordinate| of the lot.
 * @returns the inset's pieces.
 */
export function solveCoveragePieces(
  pieces: readonly Float64Array[],
  target: number,
  tolerance: number,
  extent: number,
): Float64Array[] {
  let cur = stage(pieces.slice());
  for (let stepNo = 0; stepNo < MAX_STEPS; stepNo++) {
    const f = cur.area - target;
    if (f <= tolerance * 1e-3) return cur.pieces;
    // Smaller root of turn·h² − P·h + f = 0, written to stay accurate for any sign of turn; a Newton
    // step when the quadratic has no root (its minimum is above the target).
    const h = quadraticStep(cur, f);
    if (!(h > 0) || !Number.isFinite(h)) return cur.pieces;
    const next = inset(cur, h, extent);
    if (next.area < target - tolerance * 1e-3) return refine(cur, h, next, target, tolerance * 1e-3, extent);
    cur = next;
  }
  return cur.pieces;
}
