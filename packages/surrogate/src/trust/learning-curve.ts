import type { SurrogateTrainer, TrainingData } from "../surrogate-types.js";
import { checkTrainingData } from "../check-training-data.js";
import { powerLawFit, type PowerLawFit } from "./power-law-fit.js";
import { regressionMetrics } from "./regression-metrics.js";
import { seededPermutation } from "./seeded-permutation.js";

/** Test error at one training size. */
export interface LearningCurvePoint {
  readonly size: number;
  readonly rmse: number;
  readonly mae: number;
  readonly maxAbsError: number;
}

/** Test error against training size, with a power-law fit of RMSE. */
export interface LearningCurve {
  /** Target the errors are measured on. */
  readonly target: string;
  readonly points: readonly LearningCurvePoint[];
  /** RMSE ≈ a·nᵇ on the points; null when fewer than two points have RMSE > 0. */
  readonly powerLaw: PowerLawFit | null;
  readonly seed: number;
}

/** Default training sizes, capped by the rows available (the full set is always the last point). */
export const DEFAULT_LEARNING_CURVE_SIZES: readonly number[] = [50, 100, 200, 500, 1000, 2000, 5000];

/**
 * Learning curve: trains on nested random subsets of growing size (the first m rows of one seeded
 * permutation) and measures error on a fixed test set; fits RMSE ≈ a·nᵇ by least squares on log-log axes.
 * @param trainer - fits a surrogate.
 * @param train - training pool.
 * @param test - independent test set with the same inputs/targets.
 * @param options.target - target column to measure (default the first).
 * @param options.sizes - sizes; sizes above the pool are dropped and the pool size is added as last point.
 * @param options.seed - seed of the subsets and trainers (size m is fitted with seed `seed + m`).
 * @returns the curve.
 */
export async function learningCurve(
  trainer: SurrogateTrainer,
  train: TrainingData,
  test: TrainingData,
  options: { target?: string; sizes?: readonly number[]; seed: number },
): Promise<LearningCurve> {
  const fn = "learningCurve";
  if (typeof trainer !== "function") throw new TypeError(`${fn}: trainer must be a function`);
  checkTrainingData(fn, train);
  checkTrainingData(fn, test);
  if (!Number.isInteger(options?.seed)) throw new TypeError(`${fn}: options.seed must be an integer`);
  if (train.inputs.length !== test.inputs.length || train.inputs.some((c, k) => test.inputs[k] !== c)) {
    throw new RangeError(`${fn}: test.inputs must equal train.inputs (${train.inputs.join(", ")})`);
  }
  const target = options.target ?? train.targets[0]!;
  const j = train.targets.indexOf(target);
  const jt = test.targets.indexOf(target);
  if (j < 0 || jt < 0) throw new RangeError(`${fn}: options.target "${target}" is not a target of both data sets`);
  const n = train.x.length;
  const requested = options.sizes ?? DEFAULT_LEARNING_CURVE_SIZES;
  requested.forEach((s, i) => {
    if (!Number.isInteger(s) || s < 2) throw new RangeError(`${fn}: options.sizes[${i}] must be an integer ≥ 2, got ${s}`);
  });
  const sizes = [...new Set([...requested.filter((s) => s < n), n])].sort((a, b) => a - b);
  const perm = seededPermutation(n, options.seed);
  const yTest = test.y.map((r) => r[jt]!);
  const points: LearningCurvePoint[] = [];
  for (const m of sizes) {
    const idx = perm.slice(0, m);
    const model = await trainer(
      { inputs: train.inputs, targets: train.targets, x: idx.map((i) => train.x[i]!), y: idx.map((i) => train.y[i]!) },
      options.seed + m,
    );
    const pred = model.predict(test.x).mean.map((r) => r[j]!);
    const met = regressionMetrics(yTest, pred);
    points.push({ size: m, rmse: met.rmse, mae: met.mae, maxAbsError: met.maxAbsError });
  }
  const usable = points.filter((p) => p.rmse > 0);
  const powerLaw =
    usable.length >= 2 ? powerLawFit(usable.map((p) => p.size), usable.map((p) => p.rmse)) : null;
  return { target, points, powerLaw, seed: options.seed };
}
