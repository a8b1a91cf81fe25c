import { regressionMetrics, type Surrogate } from "@floorcast/surrogate";
import type { TrainingSet } from "./sample-training-set.js";
import type { BatchPredictor } from "./surrogate-evaluator.js";

/** A surrogate's accuracy on one target of the independent test set (trust-report metrics). */
export interface TargetAccuracy {
  readonly target: string;
  readonly rmse: number;
  readonly mae: number;
  readonly maxAbsError: number;
  readonly r2: number;
  readonly medianRelError: number;
  readonly p95RelError: number;
}

/**
 * Accuracy of a fitted surrogate on an independent, exactly evaluated test set: the trust
 * report's regression metrics (`regressionMetrics` of `@floorcast/surrogate`) for every target.
 * @param model - the surrogate (or a peer model's predictor).
 * @param test - the test set (its targets must be the model's targets, in order).
 * @returns one entry per target and the time taken.
 */
export async function assessAccuracy(
  model: Surrogate | BatchPredictor,
  test: TrainingSet,
): Promise<{ accuracy: TargetAccuracy[]; seconds: number }> {
  const t0 = performance.now();
  const { mean } = await model.predict(test.x);
  const accuracy = test.targets.map((target, j) => {
    const m = regressionMetrics(
      test.y.map((r) => r[j]!),
      mean.map((r) => r[j]!),
    );
    return {
      target,
      rmse: m.rmse,
      mae: m.mae,
      maxAbsError: m.maxAbsError,
      r2: m.r2,
      medianRelError: m.medianRelError,
      p95RelError: m.p95RelError,
    };
  });
  return { accuracy, seconds: (performance.now() - t0) / 1000 };
}
