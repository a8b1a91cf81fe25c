import type { DesignKind } from "./create-design.js";
import { SOBOL_MAX_DIMS } from "./sobol-sequence.js";

/**
 * Largest n for which the default design is the optimized Latin hypercube "lhs-maximin-cd" (ESE then the
 * discrepancy polish, O(n²·d) overall): about 2 s of CPU at n = 1,000, d = 8 to 12 on one core (measured).
 */
export const DEFAULT_OPTIMISED_MAX_N = 1000;

/**
 * The default design for n points in dims dimensions, chosen so that no default run is quadratic in n at a size
 * where that hurts: "lhs-maximin-cd" up to DEFAULT_OPTIMISED_MAX_N points (at n = 500, d = 12 it beats scipy's
 * LatinHypercube(optimization="random-cd") on minimum distance, centred discrepancy and CPU time: see
 * `npm run bench:design`), then scrambled "sobol" (O(n·d), streamed; Joe & Kuo 2008 directions), or plain "lhs"
 * above SOBOL_MAX_DIMS dimensions.
 * @param n - number of points, an integer ≥ 1. @param dims - number of dimensions, an integer ≥ 1.
 * @returns the design kind to use.
 * @throws TypeError/RangeError for a bad n or dims.
 */
export function defaultDesign(n: number, dims: number): DesignKind {
  for (const [field, v] of [["n", n], ["dims", dims]] as const) {
    if (typeof v !== "number") throw new TypeError(`defaultDesign: ${field} must be a number, got ${typeof v}`);
    if (!Number.isSafeInteger(v) || v < 1) throw new RangeError(`defaultDesign: ${field} must be an integer ≥ 1, got ${v}`);
  }
  if (n <= DEFAULT_OPTIMISED_MAX_N) return "lhs-maximin-cd";
  return dims <= SOBOL_MAX_DIMS ? "sobol" : "lhs";
}
