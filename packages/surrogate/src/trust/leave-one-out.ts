import type { Prediction, Surrogate, TrainingData } from "../surrogate-types.js";
import { checkTrainingData } from "../check-training-data.js";
import { outOfSampleMetrics, type CrossValidationResult } from "./cross-validation.js";

/**
 * Optional capability of a surrogate that can give its leave-one-out predictions of its own training
 * rows without refitting (for a GP in closed form: Rasmussen & Williams 2006, eq. 5.12,
 * μ₋ᵢ = yᵢ − [K⁻¹y]ᵢ/[K⁻¹]ᵢᵢ, σ²₋ᵢ = 1/[K⁻¹]ᵢᵢ, at fixed hyperparameters).
 */
export interface LeaveOneOutCapable {
  /** Leave-one-out predictions of the training rows, in training order (rows × targets). */
  leaveOneOut(): Prediction;
}

/**
 * Whether a surrogate offers closed-form leave-one-out predictions.
 * @param model - any surrogate.
 */
export function hasLeaveOneOut(model: Surrogate): model is Surrogate & LeaveOneOutCapable {
  return typeof (model as Partial<LeaveOneOutCapable>).leaveOneOut === "function";
}

/**
 * Leave-one-out validation of a model that offers it in closed form, with Q² per target.
 * @param model - a surrogate with `leaveOneOut()`.
 * @param data - its training data (the targets the LOO predictions are compared with), same row order.
 * @returns the cross-validation result with method "leave-one-out".
 */
export function leaveOneOutValidation(model: Surrogate & LeaveOneOutCapable, data: TrainingData): CrossValidationResult {
  const fn = "leaveOneOutValidation";
  if (!hasLeaveOneOut(model)) throw new TypeError(`${fn}: model has no leaveOneOut() method`);
  checkTrainingData(fn, data);
  const predictions = model.leaveOneOut();
  if (predictions.mean.length !== data.x.length) {
    throw new RangeError(`${fn}: model has ${predictions.mean.length} training rows but data has ${data.x.length}`);
  }
  return {
    method: "leave-one-out",
    folds: data.x.length,
    n: data.x.length,
    perTarget: outOfSampleMetrics(data, predictions),
    predictions,
  };
}
