import { Matrix, solve } from "ml-matrix";
import type { Surrogate, SurrogateTrainer, TrainingData } from "@floorcast/surrogate";

/**
 * A toy trainer for the trust tests: ordinary least squares with intercept, per target, with an optional
 * constant predictive sd. It is a Surrogate like any other, so cross-validation and learning curves can
 * run on it and be compared with scikit-learn's LinearRegression.
 */
export function olsTrainer(sd?: number): SurrogateTrainer {
  return async (data: TrainingData) => olsModel(data, sd);
}

/** Fits OLS with intercept by the normal equations. */
export function olsModel(data: TrainingData, sd?: number): Surrogate {
  const X = new Matrix(data.x.map((r) => [1, ...r]));
  const Y = new Matrix(data.y.map((r) => [...r]));
  const B = solve(X.transpose().mmul(X), X.transpose().mmul(Y));
  const predict = (x: readonly (readonly number[])[]) => {
    const mean = new Matrix(x.map((r) => [1, ...r])).mmul(B).to2DArray();
    return sd === undefined ? { mean } : { mean, sd: mean.map((r) => r.map(() => sd)) };
  };
  return {
    kind: "ols-toy",
    inputs: data.inputs,
    targets: data.targets,
    predict,
    toJSON: () => ({ kind: "ols-toy", coefficients: B.to2DArray() }),
  };
}
