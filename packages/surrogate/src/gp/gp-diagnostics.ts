/** What happened while fitting one target's GP. */
export interface GpTargetDiagnostics {
  readonly target: string;
  /** Absolute jitter added to the diagonal of K + σ_n² I to factor it (0 when none was needed). */
  readonly jitter: number;
  /** 2-norm condition number of K + σ_n² I (exact for n ≤ 150, a power-iteration estimate above). */
  readonly conditionNumber: number;
  /** Hyperparameters that ended on a bound, e.g. "lengthscale[width]=upper". */
  readonly onBounds: readonly string[];
  /** Human-readable warnings (near-singular kernel, hyperparameters on bounds). */
  readonly warnings: readonly string[];
  /** LML of each restart (standardised target), in start order; empty when hyperparameters were given. */
  readonly restartLogMarginalLikelihoods: readonly number[];
  /**
   * Where the polish on all rows started: "subset optimum" or the probe that beat it, e.g. "lengthscale[maxFar] × 1/4"
   * (absent when there was no polish).
   */
  readonly polishStart?: string;
}

/** Fit summary of a Gaussian process. */
export interface GpDiagnostics {
  readonly targets: readonly GpTargetDiagnostics[];
  /** Wall-clock fit time in milliseconds (not written to the model file; a loaded model has it only from an older file). */
  readonly fitTimeMs?: number;
  /** Rows the hyperparameters were fitted on (n when no subset was used). */
  readonly hyperparameterRows: number;
  /** L-BFGS iterations on all rows after a subset fit (0 when none). */
  readonly polishIterations: number;
}
