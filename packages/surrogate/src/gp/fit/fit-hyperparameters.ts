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

/** One restart's optimum and its summary (what a worker thread sends back). */
export interface RestartOutcome {
  /** Best θ of this restart. */
  readonly theta: Float64Array;
  /** Its negative log marginal likelihood (Infinity when it was never finite). */
  readonly value: number;
  readonly summary: RestartSummary;
}

/**
 * The starting points of a search: `search.starts`, or `restarts` seeded Latin-hypercube points of the start box
 * with the first at its centre.
 * @param search - the search settings.
 * @returns the starts, in the order their outcomes are compared.
 */
export function hyperparameterStarts(search: HyperparameterSearch): readonly Float64Array[] {
  return search.starts ?? latinStarts(Math.max(1, search.restarts), search.startLower, search.startUpper, search.seed, true);
}

/**
 * One restart of type-II maximum likelihood: bounded projected L-BFGS on −log p(y | X, θ) with its analytic gradient
 * (Rasmussen & Williams 2006, §5.4.1) from `start`. A θ whose kernel matrix cannot be factorised counts as +∞.
 * @param x - flat scaled inputs. @param y - standardised targets. @param search - kernel, layout, bounds.
 * @param start - the starting θ (log space).
 * @returns the restart's optimum and summary.
 */
export function runRestart(x: Float64Array, y: Float64Array, search: HyperparameterSearch, start: Float64Array): RestartOutcome {
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
  const r = minimizeBounded(objective, start, search.logLower, search.logUpper, { maxIterations: search.maxIterations });
  return {
    theta: r.x,
    value: r.value,
    summary: { logMarginalLikelihood: -r.value, iterations: r.iterations, evaluations: r.evaluations, converged: r.converged, message: r.message },
  };
}

/**
 * The log marginal likelihood at one θ without a search (one Cholesky factorisation, no gradient), as a restart
 * outcome with zero iterations: used to compare candidate starts on all rows before a polish. A θ whose kernel
 * matrix cannot be factorised counts as +∞.
 * @param x - flat scaled inputs. @param y - standardised targets. @param search - kernel and layout.
 * @param theta - the θ to evaluate (log space).
 * @returns θ, its negative LML and a summary.
 */
export function runProbe(x: Float64Array, y: Float64Array, search: HyperparameterSearch, theta: Float64Array): RestartOutcome {
  let value = Infinity;
  try {
    value = -logMarginalLikelihood(x, y, search.kernel, search.layout, theta, false).value;
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
  }
  if (Number.isNaN(value)) value = Infinity;
  return {
    theta,
    value,
    summary: { logMarginalLikelihood: -value, iterations: 0, evaluations: 1, converged: false, message: "probe" },
  };
}

/**
 * Keeps the best of the restarts' outcomes, given in the order of their starts (the first of equal values wins), and
 * flags the θ entries that ended on a bound.
 * @param search - the search settings (bounds). @param outcomes - one per start, in start order.
 * @returns the best θ, its LML, a summary per restart and bound flags.
 * @throws RangeError when no restart reached a finite value.
 */
export function bestOfRestarts(search: HyperparameterSearch, outcomes: readonly RestartOutcome[]): HyperparameterFitResult {
  let best: RestartOutcome | undefined;
  for (const r of outcomes) if (Number.isFinite(r.value) && (!best || r.value < best.value)) best = r;
  if (!best) {
    throw new RangeError("fitGaussianProcess: the log marginal likelihood was not finite at any starting point");
  }
  const theta = best.theta;
  const onBound = Array.from(theta, (t, i) => {
    const span = search.logUpper[i]! - search.logLower[i]!;
    if (t <= search.logLower[i]! + 1e-6 * span) return "lower" as const;
    if (t >= search.logUpper[i]! - 1e-6 * span) return "upper" as const;
    return undefined;
  });
  return { theta, logMarginalLikelihood: -best.value, restarts: outcomes.map((r) => r.summary), onBound };
}

/**
 * Type-II maximum likelihood (Rasmussen & Williams 2006, §5.4.1): maximises the log marginal likelihood with
 * its analytic gradient by bounded projected L-BFGS from `restarts` seeded Latin-hypercube starts (the first
 * at the centre of the start box) and keeps the best. The restarts run one after another here;
 * fitGaussianProcessParallel runs the same runRestart calls on worker threads.
 * @param x - flat scaled inputs.
 * @param y - standardised targets.
 * @param search - kernel, layout, bounds, starts.
 * @returns the best θ, its LML, a summary per restart and bound flags.
 */
export function fitHyperparameters(x: Float64Array, y: Float64Array, search: HyperparameterSearch): HyperparameterFitResult {
  return bestOfRestarts(search, hyperparameterStarts(search).map((start) => runRestart(x, y, search, start)));
}
