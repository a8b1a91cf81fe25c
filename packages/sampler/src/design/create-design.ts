import { checkCount, seededRandom } from "./check-design-args.js";
import { eseOptimize } from "./ese-optimize.js";
import { latinHypercube } from "./latin-hypercube.js";
import { polishCentredDiscrepancy } from "./polish-centred-discrepancy.js";
import { randomDesign } from "./random-design.js";
import { SOBOL_MAX_DIMS, sobolSequence } from "./sobol-sequence.js";

/** The design families `createDesign` knows. */
export const DESIGN_KINDS = ["random", "lhs", "lhs-centred", "lhs-maximin", "lhs-maximin-cd", "sobol"] as const;

/** One of DESIGN_KINDS. */
export type DesignKind = (typeof DESIGN_KINDS)[number];

/** Arguments of createDesign. */
export interface CreateDesignOptions {
  /** Number of points, an integer ≥ 1. */
  readonly n: number;
  /** Number of dimensions, an integer ≥ 1 (≤ SOBOL_MAX_DIMS for "sobol"). */
  readonly dims: number;
  readonly design: DesignKind;
  /** Seed of every random draw (through seedrandom). */
  readonly seed: number | string;
  /**
   * Outer iterations of the ESE search for "lhs-maximin" and "lhs-maximin-cd" (it stops early after 10 without gain). Default
   * round(25,000 / n) clamped to 20…100: 100 up to n = 250, 50 at n = 500, 20 from n = 1,250 (each
   * iteration tries 5,000 exchanges at O(n) each); 20 for "lhs-maximin-cd". More iterations give a better design, slowly.
   */
  readonly eseIterations?: number;
  /**
   * Progress of the optimized designs ("lhs-maximin", "lhs-maximin-cd"): called after each ESE outer iteration and
   * after the discrepancy polish with steps done and steps planned (the search may stop early; the last call has
   * done = total).
   */
  readonly onProgress?: (done: number, total: number) => void;
}

/**
 * A space-filling design in the unit cube [0, 1]^dims:
 * - "random": independent uniform points;
 * - "lhs": Latin hypercube, a uniform point in each stratum (McKay, Beckman & Conover 1979);
 * - "lhs-centred": Latin hypercube with every point at its stratum centre;
 * - "lhs-maximin": a centred Latin hypercube optimized on φp (Morris & Mitchell 1995) by the enhanced
 *   stochastic evolutionary algorithm (Jin, Chen & Sudjianto 2005);
 * - "lhs-maximin-cd": "lhs-maximin", then column exchanges that lower the centred L2 discrepancy
 *   (Hickernell 1998) while every pairwise distance stays ≥ 0.7 × the maximin design's minimum distance
 *   (a spread and uniformity compromise; still a Latin hypercube);
 * - "sobol": scrambled Sobol' points (Joe & Kuo 2008 directions; linear matrix scramble and digital shift);
 *   their balance needs n a power of 2.
 * The same seed always gives the same points.
 * @returns n rows of dims coordinates.
 * @throws TypeError/RangeError naming the bad field.
 */
export function createDesign(options: CreateDesignOptions): number[][] {
  const fn = "createDesign";
  if (typeof options !== "object" || options === null) throw new TypeError(`${fn}: options must be an object`);
  const n = checkCount(fn, "n", options.n);
  const dims = checkCount(fn, "dims", options.dims);
  if (options.onProgress !== undefined && typeof options.onProgress !== "function") {
    throw new TypeError(`${fn}: onProgress must be a function`);
  }
  if (n * dims > MAX_DESIGN_VALUES) {
    // A design is held whole (about 8 bytes per value plus per-row overhead): refuse before running out of memory.
    throw new RangeError(`${fn}: n × dims = ${n * dims} values is more than a design held in memory may have (${MAX_DESIGN_VALUES})`);
  }
  const rng = seededRandom(fn, options.seed);
  switch (options.design) {
    case "random":
      return randomDesign(n, dims, rng);
    case "lhs":
      return latinHypercube(n, dims, rng, false);
    case "lhs-centred":
      return latinHypercube(n, dims, rng, true);
    case "lhs-maximin":
    case "lhs-maximin-cd": {
      // The discrepancy polish gives back part of the spread, so "lhs-maximin-cd" starts from a shorter ESE run.
      const iterations =
        options.eseIterations === undefined
          ? options.design === "lhs-maximin"
            ? defaultEseIterations(n)
            : CD_ESE_ITERATIONS
          : checkCount(fn, "eseIterations", options.eseIterations, 0);
      const polish = options.design === "lhs-maximin" ? 0 : 1;
      const report = options.onProgress;
      const maximin = eseOptimize(latinHypercube(n, dims, rng, true), rng, {
        outerIterations: iterations,
        ...(report === undefined ? {} : { onProgress: (done: number, total: number) => report(done, total + polish) }),
      });
      const points = polish === 0 ? maximin.points : polishCentredDiscrepancy(maximin.points, rng).points;
      report?.(maximin.outerIterations + polish, maximin.outerIterations + polish);
      return points;
    }
    case "sobol":
      if (dims > SOBOL_MAX_DIMS) {
        throw new RangeError(`${fn}: dims must be ≤ ${SOBOL_MAX_DIMS} for "sobol", got ${dims}`);
      }
      if (n > 2 ** 30) throw new RangeError(`${fn}: n must be ≤ 2^30 for "sobol", got ${n}`);
      return sobolSequence(n, dims, rng);
    default:
      throw new RangeError(`${fn}: design must be one of ${DESIGN_KINDS.join(", ")}, got ${String(options.design)}`);
  }
}

/** Most values (n × dims) a design may have: 5e7 doubles, about 0.4 GB before per-row overhead (common practice: fail with a message, not an out-of-memory crash). */
const MAX_DESIGN_VALUES = 5e7;

/** Default ESE outer iterations before the discrepancy polish of "lhs-maximin-cd". */
const CD_ESE_ITERATIONS = 20;

/** The default ESE outer-iteration count for n points (see CreateDesignOptions.eseIterations). */
function defaultEseIterations(n: number): number {
  return Math.max(20, Math.min(100, Math.round(25_000 / n)));
}
