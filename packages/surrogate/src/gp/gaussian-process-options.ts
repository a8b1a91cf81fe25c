import type { KernelName } from "./kernels/kernel-name.js";

/** Given (not fitted) hyperparameters for one target, in scaled units; a single lengthscale is shared. */
export interface GivenHyperparameters {
  readonly lengthscales: readonly number[] | number;
  readonly signalVariance: number;
  readonly noiseVariance: number;
}

/** Options of fitGaussianProcess (all optional; defaults in brackets). Variances refer to the standardised target. */
export interface GaussianProcessOptions {
  /** Kernel family ["matern52"]. */
  readonly kernel?: KernelName;
  /** One lengthscale per input [true] or one shared. */
  readonly ard?: boolean;
  /** Fix the noise variance to this value instead of learning it. */
  readonly noiseVariance?: number;
  /** Lower bound of the learned noise variance [1e-6]. */
  readonly noiseFloor?: number;
  /** Upper bound of the learned noise variance [1]. */
  readonly noiseCeiling?: number;
  /** Bounds of every lengthscale, unit-cube units [[0.01, 1000]]. */
  readonly lengthscaleBounds?: readonly [number, number];
  /** Bounds of the signal variance [[0.001, 1e6]]. */
  readonly signalVarianceBounds?: readonly [number, number];
  /** Declared input bounds for the unit-cube scaling [the data's range]. */
  readonly inputBounds?: { readonly lower: readonly number[]; readonly upper: readonly number[] };
  /** Skip the likelihood search and use these hyperparameters, one entry per target. */
  readonly hyperparameters?: readonly GivenHyperparameters[];
  /** Number of optimizer starts per target [3]. */
  readonly restarts?: number;
  /** Seed of the starting points [0]. */
  readonly seed?: number;
  /** Iteration cap per start [200]. */
  readonly maxIterations?: number;
  /**
   * Fit hyperparameters on a greedy maximin subset of this many rows when n is larger, then condition on all
   * rows; `false` always fits on all rows [600].
   */
  readonly hyperparameterSubset?: number | false;
  /**
   * After a subset fit, at most this many L-BFGS iterations on all rows from the subset's optimum
   * [10 when n ≤ 2,000, else 0]; 0 turns the polish off.
   */
  readonly polishIterations?: number;
  /**
   * Before a polish, compare on all rows the subset's optimum with it after shortening each ARD lengthscale in turn
   * (× 1/4 and × 1/16, and set to 1 and 1/4 of the unit cube when longer), and polish from the best [true]. A subset cannot resolve structure finer than its spacing (such as
   * FAR or whole-floor steps along one input); without the probes the polish stays in the basin the subset found.
   */
  readonly probeLengthscales?: boolean;
  /** Refuse (RangeError) fits estimated to need more bytes than this [2 GiB]. */
  readonly memoryBudgetBytes?: number;
}
