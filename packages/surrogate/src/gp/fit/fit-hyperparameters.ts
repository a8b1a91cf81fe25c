import type { HyperparameterLayout } from "../kernels/kernel-hyperparameters.js";
import type { KernelName } from "../kernels/kernel-name.js";
import { latinStarts } from "./latin-starts.js";
import { logMarginalLikelihood } from "./log-marginal-likelihood.js";
import { minimizeBounded } from "./minimize-bounded.js";

/** Settings of one type-II maximum-likelihood fit, all in log space. */
export interface HyperparameterSearch {
  readonly kernel: KernelName;
  readonly layout: HyperparameterLayout;
  readonly logLower: Float64Array;
  readonly logUpper: Float64Array;
  /** Box the starting points are spread over (inside the bounds). */
  readonly startLower: Float64Array;
  readonly startUpper: Float64Array;
  readonly restarts: number;
  readonly seed: number;
  readonly maxIterations: number;
  /** Start from these points instead of the Latin-hypercube starts (e.g. to polish a subset's optimum). */
  readonly starts?: readonly Float64Array[];
}

/** One restart's outcome. */
export interface RestartSummary {
  readonly logMarginalLikelihood: number;
  readonly iterations: number;
  readonly evaluations: number;
  readonly converged: boolean;
  readonly message: string;
}

/** Best θ over the restarts and the entries that ended on a bound. */
export interface HyperparameterFitResult {
  readonly theta: Float64Array;
  readonly logMarginalLikelihood: number;
  readonly restarts: readonly RestartSummary[];
  /** Per θ entry: "lower", "upper" or undefined. */
  readonly onBound: readonly ("lower" | "upper" | undefined)[];
}

/**
 * Type-II maximum likelihood (Rasmussen & Williams 2006, §5.4.1): maximises the log marginal likelihood with
 * its analytic gradient by bounded projected L-BFGS from `restarts` seeded Latin-hypercube starts (the first
 * at the centre of the start box) and keeps the best.
 * @param x - flat scaled inputs.
 * @param y - standardised targets.
 * @param search - kernel, layout, bounds, starts.
 * @returns the best θ, its LML, a summary per restart and bound flags.
 */
export function fitHyperparameters(x: Float64Array, y: Float64Array, search: HyperparameterSearch): HyperparameterFitResult {
  const n = y.length;
  const work = new Float64Array(n * n);
  const objective = (theta: Float64Array): { value: number; gradient: Float64Array } => {
    try {
      const r = logMarginalLikelihood(x, y, search.kernel, search.layout, theta, true, work);
      const g = r.gradient!;
      const neg = new Float64Array(g.length);
      for (let i = 0; i < g.length; i++) neg[i] = -g[i]!;
      return { value: -r.value, gradient: neg };
    } catch (error) {
      if (error instanceof RangeError) return { value: Infinity, gradient: new Float64Array(theta.length) };
      throw error;
    }
  };
  const starts = search.starts ?? latinStarts(Math.max(1, search.restarts), search.startLower, search.startUpper, search.seed, true);
  const restarts: RestartSummary[] = [];
  let best: { theta: Float64Array; value: number } | undefined;
  for (const start of starts) {
    const r = minimizeBounded(objective, start, search.logLower, search.logUpper, { maxIterations: search.maxIterations });
    restarts.push({
      logMarginalLikelihood: -r.value,
      iterations: r.iterations,
      evaluations: r.evaluations,
      converged: r.converged,
      message: r.message,
    });
    if (Number.isFinite(r.value) && (!best || r.value < best.value)) best = { theta: r.x, value: r.value };
  }
  if (!best) {
    throw new RangeError("fitGaussianProcess: the log marginal likelihood was not finite at any starting point");
  }
  const onBound = Array.from(best.theta, (t, i) => {
    const span = search.logUpper[i]! - search.logLower[i]!;
    if (t <= search.logLower[i]! + 1e-6 * span) return "lower" as const;
    if (t >= search.logUpper[i]! - 1e-6 * span) return "upper" as const;
    return undefined;
  });
  return { theta: best.theta, logMarginalLikelihood: -best.value, restarts, onBound };
}
