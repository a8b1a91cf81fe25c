import { clipHalfPlanes } from "../geometry/clip-half-planes.js";
import { edgeHalfPlanes } from "../geometry/edge-half-planes.js";
import { polygonPerimeter } from "../geometry/polygon-perimeter.js";
import { polygonWidth } from "../geometry/polygon-width.js";
import { signedArea } from "../geometry/polygon-area.js";
import type { MassingWorkspace } from "./massing-workspace.js";

const MAX_ITERATIONS = 200;

/**
 * Finds the inner parallel polygon of the buildable area B (every edge moved inward by the same δ)
 * whose area equals `target`, to within `tolerance`, and writes it to `ws.base`.
 *
 * The first guess is the root of A(δ) = A − P·δ + δ²·Σ cot(θᵢ/2), exact while no edge of B vanishes
 * (derived). After that, A(δ) is continuous, decreasing and convex (A′(δ) = −P(δ), the inset's
 * perimeter, which shrinks as δ grows; derived), so Newton steps δ ← δ + (A(δ) − target) / P(δ)
 * converge without oscillating; each step is kept inside a bisection bracket [lo, hi] with
 * hi = width(B) / 2 (the inset is empty there), so the solve always converges.
 * @param ws - workspace holding B in `ws.buildable`.
 * @param m - number of vertices of B (counter-clockwise, convex, area > target).
 * @param target - wanted area (> 0).
 * @param tolerance - allowed |area − target| (the solve aims at a thousandth of it; with round-off
 *   only, it stops after a bounded number of steps).
 * @param minEdge - edges of B this short or shorter are ignored (no reliable direction).
 * @returns the number of vertices of the inset in `ws.base`.
 */
export function solveCoverageInset(
  ws: MassingWorkspace,
  m: number,
  target: number,
  tolerance: number,
  minEdge: number,
): number {
  const src = ws.buildable;
  const k = edgeHalfPlanes(src, m, 0, ws.planes, minEdge);
  const planes = ws.planes;
  const shifted = ws.shifted;
  let lo = 0;
  let hi = polygonWidth(src, m) / 2;
  let delta = 0;
  let f = signedArea(src, m) - target;
  let perimeter = polygonPerimeter(src, m);
  let count = 0;
  // First guess: the root of A(δ) = A − P·δ + δ²·Σ cot(θᵢ/2) (exact while no edge vanishes; derived).
  // For consecutive unit inward normals u, v, cot(θ/2) = tan(φ/2) = (u × v) / (1 + u · v), φ the turn.
  let s = 0;
  for (let j = 0; j < k; j++) {
    const i = j === 0 ? k - 1 : j - 1;
    const ua = planes[3 * i]!;
    const ub = planes[3 * i + 1]!;
    const va = planes[3 * j]!;
    const vb = planes[3 * j + 1]!;
    s += (ua * vb - ub * va) / (1 + ua * va + ub * vb);
  }
  const disc = perimeter * perimeter - 4 * s * f;
  const guess = s > 0 && disc >= 0 ? (2 * f) / (perimeter + Math.sqrt(disc)) : NaN;
  for (let iter = 0; iter < MAX_ITERATIONS; iter++) {
    let next = iter === 0 && guess > lo && guess < hi ? guess : perimeter > 0 ? delta + f / perimeter : NaN;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    for (let j = 0; j < k; j++) {
      shifted[3 * j] = planes[3 * j]!;
      shifted[3 * j + 1] = planes[3 * j + 1]!;
      shifted[3 * j + 2] = planes[3 * j + 2]! + next;
    }
    count = clipHalfPlanes(src, m, shifted, k, ws.base, ws.scratch);
    const area = count > 0 ? signedArea(ws.base, count) : 0;
    f = area - target;
    delta = next;
    // Aim well inside the tolerance so that sums over many floors stay within it too.
    // When round-off keeps it from getting there, the tolerance itself is accepted after a few steps.
    if (Math.abs(f) <= tolerance * 1e-3 || (iter >= 8 && Math.abs(f) <= tolerance)) return count;
    if (f > 0) lo = next;
    else hi = next;
    perimeter = count > 0 ? polygonPerimeter(ws.base, count) : 0;
  }
  return count;
}
