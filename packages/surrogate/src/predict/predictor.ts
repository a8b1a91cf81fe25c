/** Predictions of a loaded model: rows × targets; `sd` when the model gives uncertainty. */
export interface PredictorOutput {
  readonly mean: number[][];
  readonly sd?: number[][];
  /** GP files only: sd of the latent function (without the noise), rows × targets. */
  readonly sdLatent?: number[][];
  /** Conformal files only: interval bounds with the stated coverage, rows × targets. */
  readonly interval?: { readonly lower: number[][]; readonly upper: number[][]; readonly coverage: number };
}

/** A dependency-free predictor loaded from a model file. */
export interface Predictor {
  /** Model type of the file: "gp", "mlp", "ensemble" or "conformal". */
  readonly modelType: string;
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  /** Predicts a batch of rows (rows × inputs, in the original units). */
  predict(x: readonly (readonly number[])[]): PredictorOutput;
}
