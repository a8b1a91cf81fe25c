import type { Prediction, SurrogateTrainer, TrainingData } from "../surrogate-types.js";
import { checkTrainingData } from "../check-training-data.js";
import { regressionMetrics, type RegressionMetrics } from "./regression-metrics.js";
import { seededPermutation } from "./seeded-permutation.js";

/** Out-of-sample metrics of one target; `q2` is R² of the out-of-sample predictions. */
export type CrossValidatedMetrics = RegressionMetrics & { readonly q2: number };

/** Result of k-fold or leave-one-out cross-validation. */
export interface CrossValidationResult {
  readonly method: "k-fold" | "leave-one-out";
  /** Number of folds (n for leave-one-out). */
  readonly folds: number;
  /** Seed of the fold assignment (k-fold only). */
  readonly seed?: number;
  readonly n: number;
  /** Metrics per target name. */
  readonly perTarget: Readonly<Record<string, CrossValidatedMetrics>>;
  /** Out-of-sample predictions in the data's row order (rows × targets). */
  readonly predictions: Prediction;
  /** Fold of each row (k-fold only). */
  readonly foldOf?: readonly number[];
}

/**
 * Assigns n rows to k folds: a seeded random permutation cut into k consecutive blocks, the first
 * n mod k blocks one row longer (the block sizes of scikit-learn's KFold).
 * @param n - number of rows.
 * @param k - number of folds, 2 ≤ k ≤ n.
 * @param seed - explicit seed.
 * @returns the fold of each row.
 */
export function assignFolds(n: number, k: number, seed: number): number[] {
  if (!Number.isInteger(k) || k < 2 || k > n) throw new RangeError(`assignFolds: folds must be an integer in [2, ${n}], got ${k}`);
  const perm = seededPermutation(n, seed);
  const foldOf = new Array<number>(n);
  const base = Math.floor(n / k);
  const extra = n % k;
  let pos = 0;
  for (let f = 0; f < k; f++) {
    const size = base + (f < extra ? 1 : 0);
    for (let j = 0; j < size; j++) foldOf[perm[pos++]!] = f;
  }
  return foldOf;
}

/**
 * Metrics of out-of-sample predictions for every target, with Q².
 * @param data - the rows predicted.
 * @param predictions - out-of-sample predictions, rows × targets.
 */
export function outOfSampleMetrics(data: TrainingData, predictions: Prediction): Record<string, CrossValidatedMetrics> {
  const perTarget: Record<string, CrossValidatedMetrics> = {};
  data.targets.forEach((t, j) => {
    const m = regressionMetrics(
      data.y.map((r) => r[j]!),
      predictions.mean.map((r) => r[j]!),
    );
    perTarget[t] = { ...m, q2: m.r2 };
  });
  return perTarget;
}

/**
 * k-fold cross-validation of any surrogate trainer: each fold is predicted by a model trained on the
 * other folds (Hastie, Tibshirani & Friedman, Elements of Statistical Learning, §7.10). Fold f is fitted
 * with trainer seed `seed + 1 + f`.
 * @param trainer - fits a surrogate to data.
 * @param data - all rows (finite).
 * @param options.folds - k, default 5; 2 ≤ k ≤ n.
 * @param options.seed - seed of the fold assignment and the trainers.
 * @returns out-of-fold predictions, per-target metrics and Q².
 */
export async function kFoldCrossValidation(
  trainer: SurrogateTrainer,
  data: TrainingData,
  options: { folds?: number; seed: number },
): Promise<CrossValidationResult> {
  const fn = "kFoldCrossValidation";
  if (typeof trainer !== "function") throw new TypeError(`${fn}: trainer must be a function`);
  checkTrainingData(fn, data);
  if (!Number.isInteger(options?.seed)) throw new TypeError(`${fn}: options.seed must be an integer`);
  const n = data.x.length;
  const k = options.folds ?? 5;
  if (!Number.isInteger(k) || k < 2 || k > n) throw new RangeError(`${fn}: options.folds must be an integer in [2, ${n}], got ${k}`);
  const foldOf = assignFolds(n, k, options.seed);
  const mean: number[][] = new Array(n);
  const sd: number[][] = new Array(n);
  let hasSd = true;
  for (let f = 0; f < k; f++) {
    const trainIdx: number[] = [];
    const testIdx: number[] = [];
    foldOf.forEach((g, i) => (g === f ? testIdx : trainIdx).push(i));
    const model = await trainer(
      { inputs: data.inputs, targets: data.targets, x: trainIdx.map((i) => data.x[i]!), y: trainIdx.map((i) => data.y[i]!) },
      options.seed + 1 + f,
    );
    const pred = model.predict(testIdx.map((i) => data.x[i]!));
    if (pred.mean.length !== testIdx.length) {
      throw new RangeError(`${fn}: the model of fold ${f} returned ${pred.mean.length} predictions for ${testIdx.length} rows`);
    }
    testIdx.forEach((row, j) => {
      mean[row] = [...pred.mean[j]!];
      if (pred.sd) sd[row] = [...pred.sd[j]!];
    });
    if (!pred.sd) hasSd = false;
  }
  const predictions: Prediction = hasSd ? { mean, sd } : { mean };
  return {
    method: "k-fold",
    folds: k,
    seed: options.seed,
    n,
    perTarget: outOfSampleMetrics(data, predictions),
    predictions,
    foldOf,
  };
}
