import { hullWidth } from "../geometry/hull-width.js";
import { mitreInset } from "../geometry/mitre-inset.js";
import { ringArea, ringIsConvex, ringPerimeter } from "../geometry/ring-metrics.js";

const MAX_ITERATIONS = 200;

function insetAll(pieces: readonly Float64Array[], convex: readonly boolean[], delta: number, extent: number): Float64Array[] {
  const result: Float64Array[] = [];
  for (let p = 0; p < pieces.length; p++) mitreInset(pieces[p]!, convex[p]!, delta, extent, result);
  return result;
}

/**
 * The coverage cap on a buildable area of one or more pieces: one uniform inward offset δ of every
 * edge of every piece, with mitred corners (see mitreInset), solved so that the total area equals
 * `target` to within `tolerance`. Same solve as the convex rule (solveCoverageInset): the first guess
 * is the root of A(δ) = A − P·δ + δ²·Σ tan(φᵢ/2) over all corners (φ the signed turn; exact while no
 * edge vanishes; derived), then Newton steps with A′(δ) = −P(δ) (every edge moves at unit speed;
 * derived) kept inside a bisection bracket [0, max width / 2].
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
  const convex = pieces.map(ringIsConvex);
  let lo = 0;
  let hi = 0;
  let area = 0;
  let perimeter = 0;
  let s = 0;
  for (const ring of pieces) {
    const m = ring.length >> 1;
    hi = Math.max(hi, hullWidth(ring, m) / 2);
    area += ringArea(ring);
    perimeter += ringPerimeter(ring);
    for (let j = 0; j < m; j++) {
      const i = j === 0 ? m - 1 : j - 1;
      const k = j + 1 === m ? 0 : j + 1;
      const ex = ring[2 * j]! - ring[2 * i]!;
      const ey = ring[2 * j + 1]! - ring[2 * i + 1]!;
      const fx = ring[2 * k]! - ring[2 * j]!;
      const fy = ring[2 * k + 1]! - ring[2 * j + 1]!;
      const le = Math.hypot(ex, ey);
      const lf = Math.hypot(fx, fy);
      // tan(φ/2) = sin φ / (1 + cos φ) for unit edge directions.
      s += (ex * fy - ey * fx) / (le * lf + ex * fx + ey * fy);
    }
  }
  let f = area - target;
  const disc = perimeter * perimeter - 4 * s * f;
  // Smaller root of s·δ² − P·δ + f = 0, written to stay accurate for any sign of s.
  const guess = disc >= 0 ? (2 * f) / (perimeter + Math.sqrt(disc)) : NaN;
  let delta = 0;
  let result: Float64Array[] = [];
  for (let iter = 0; iter < MAX_ITERATIONS; iter++) {
    let next = iter === 0 && guess > lo && guess < hi ? guess : perimeter > 0 ? delta + f / perimeter : NaN;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    result = insetAll(pieces, convex, next, extent);
    area = 0;
    perimeter = 0;
    for (const r of result) {
      area += ringArea(r);
      perimeter += ringPerimeter(r);
    }
    f = area - target;
    delta = next;
    if (Math.abs(f) <= tolerance * 1e-3 || (iter >= 8 && Math.abs(f) <= tolerance)) return result;
    if (f > 0) lo = next;
    else hi = next;
  }
  return result;
}
