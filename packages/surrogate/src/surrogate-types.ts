/** Predictions for a batch: `mean[i][j]` is row i, target j; `sd` when the model gives uncertainty. */
export interface Prediction {
  readonly mean: number[][];
  readonly sd?: number[][];
  /** Conformal wrappers only: interval bounds (rows × targets) with the stated coverage. */
  readonly interval?: { readonly lower: number[][]; readonly upper: number[][]; readonly coverage: number };
}

/**
 * A fitted surrogate. Every surrogate is built fitted: there is no unfitted state.
 */
export interface Surrogate {
  /** Model family, e.g. "gp", "mlp", "ensemble", "conformal". */
  readonly kind: string;
  /** Input column names, in order. */
  readonly inputs: readonly string[];
  /** Target column names, in order. */
  readonly targets: readonly string[];
  /** Predict a batch of rows (rows × inputs). */
  predict(x: readonly (readonly number[])[]): Prediction;
  /** The versioned model file. */
  toJSON(): unknown;
  /** Optional: gradient of the predicted mean at one row, targets × inputs, original units (GP). */
  gradient?(x: readonly number[]): number[][];
}

/** Training data: `x` rows × inputs, `y` rows × targets. */
export interface TrainingData {
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly x: readonly (readonly number[])[];
  readonly y: readonly (readonly number[])[];
}

/** Fits a surrogate to data; used by cross-validation, ensembles and conformal wrappers. */
export type SurrogateTrainer = (data: TrainingData, seed: number) => Promise<Surrogate>;
