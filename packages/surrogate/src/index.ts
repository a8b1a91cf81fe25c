export type { Prediction, Surrogate, SurrogateTrainer, TrainingData } from "./surrogate-types.js";
// Trust report numerics (trust/)
export { erf, erfc } from "./trust/error-function.js";
export { standardNormal } from "./trust/standard-normal.js";
export { percentile } from "./trust/percentile.js";
export { regressionMetrics } from "./trust/regression-metrics.js";
export type { RegressionMetrics } from "./trust/regression-metrics.js";
export { metricsByRegime } from "./trust/metrics-by-regime.js";
export { gaussianCrps } from "./trust/gaussian-crps.js";
export { gaussianCalibration } from "./trust/gaussian-calibration.js";
export type { CoverageEntry, GaussianCalibration } from "./trust/gaussian-calibration.js";
export { intervalCoverage } from "./trust/interval-coverage.js";
export type { IntervalCoverage } from "./trust/interval-coverage.js";
export { assignFolds, kFoldCrossValidation, outOfSampleMetrics } from "./trust/cross-validation.js";
export type { CrossValidatedMetrics, CrossValidationResult } from "./trust/cross-validation.js";
export { hasLeaveOneOut, leaveOneOutValidation } from "./trust/leave-one-out.js";
export type { LeaveOneOutCapable } from "./trust/leave-one-out.js";
export { powerLawFit } from "./trust/power-law-fit.js";
export type { PowerLawFit } from "./trust/power-law-fit.js";
export { DEFAULT_LEARNING_CURVE_SIZES, learningCurve } from "./trust/learning-curve.js";
export type { LearningCurve, LearningCurvePoint } from "./trust/learning-curve.js";
export { buildValidityDomain, nearestDistance, scaleToDomain } from "./trust/validity-domain.js";
export type { ValidityDomain } from "./trust/validity-domain.js";
export { checkDomain, domainOfModel } from "./trust/check-domain.js";
export type { DomainAware, DomainCheck, DomainRowCheck } from "./trust/check-domain.js";
export { DomainError } from "./trust/domain-error.js";
export { collectDiagnostics } from "./trust/model-diagnostics.js";
export type { DiagnosticValue, TrustDiagnostics } from "./trust/model-diagnostics.js";
export { buildTrustReport } from "./trust/trust-report.js";
export { TRUST_REPORT_DEFAULT_CAUTION } from "./trust/trust-report-caution.js";
export type { TrustFigureData, TrustReport } from "./trust/trust-report.js";
// Gaussian-process surrogate, scaling, linear algebra and the model file (gp/, scaling/, linalg/, model-file/)
export { createInputScaling, inputSpan, scaleInputs } from "./scaling/input-scaling.js";
export type { InputScaling } from "./scaling/input-scaling.js";
export { createOutputScaling, standardiseTarget } from "./scaling/output-scaling.js";
export type { OutputScaling } from "./scaling/output-scaling.js";
export { choleskyWithJitter } from "./linalg/cholesky-with-jitter.js";
export type { CholeskyFactor } from "./linalg/cholesky-with-jitter.js";
export { solveLower, solveLowerMany, solveLowerTransposed } from "./linalg/triangular-solve.js";
export { logDeterminant } from "./linalg/log-determinant.js";
export { choleskyInverseInPlace } from "./linalg/cholesky-inverse.js";
export { conditionEstimate } from "./linalg/condition-estimate.js";
export { KERNEL_NAMES } from "./gp/kernels/kernel-name.js";
export type { KernelName } from "./gp/kernels/kernel-name.js";
export type { KernelHyperparameters } from "./gp/kernels/kernel-hyperparameters.js";
export { minimizeBounded } from "./gp/fit/minimize-bounded.js";
export type { BoundedMinimum, MinimizeBoundedOptions, ValueAndGradient } from "./gp/fit/minimize-bounded.js";
export { fitGaussianProcess } from "./gp/fit-gaussian-process.js";
export { fitGaussianProcessParallel } from "./gp/fit-gaussian-process-parallel.js";
export type { ParallelGaussianProcessOptions } from "./gp/fit-gaussian-process-parallel.js";
export type { GaussianProcessOptions, GivenHyperparameters } from "./gp/gaussian-process-options.js";
export { GaussianProcess } from "./gp/gaussian-process.js";
export type { GaussianProcessParts, GpPrediction } from "./gp/gaussian-process.js";
export type { GpDiagnostics, GpTargetDiagnostics } from "./gp/gp-diagnostics.js";
export { DEFAULT_GP_MEMORY_BUDGET, gpMemoryBytes } from "./gp/check-gp-memory.js";
export { MODEL_FILE_KIND, MODEL_FORMAT_VERSION } from "./model-file/model-file-version.js";
export { envelopeSchema, trainingSummarySchema } from "./model-file/envelope-schema.js";
export { gpModelFileSchema, gpPayloadSchema } from "./model-file/gp-model-file-schema.js";
export type { GpModelFile } from "./model-file/gp-model-file-schema.js";
export { modelFileSchema } from "./model-file/model-file-schema.js";
export type { ModelFile } from "./model-file/model-file-schema.js";
export { parseModelFile } from "./model-file/parse-model-file.js";
export { inputSchemaSchema, withInputSchema } from "./model-file/input-schema.js";
export { withCaution } from "./model-file/with-caution.js";
export type { InputSchema } from "./model-file/input-schema.js";
export { loadSurrogate } from "./model-file/load-surrogate.js";
export { sealModelFile, nodeSha256Hex } from "./model-file/seal-model-file.js";
export { checkModelChecksum, CHECKSUM_PREFIX } from "./predict/check-model-checksum.js";
export { canonicalJson } from "./predict/canonical-json.js";
// Uncertainty for any surrogate: deep ensembles and split-conformal intervals (uncertainty/)
export { EnsembleSurrogate } from "./uncertainty/ensemble-surrogate.js";
export type { EnsembleTraining } from "./uncertainty/ensemble-surrogate.js";
export { fitEnsemble } from "./uncertainty/fit-ensemble.js";
export type { EnsembleOptions } from "./uncertainty/fit-ensemble.js";
export { ConformalSurrogate } from "./uncertainty/conformal-surrogate.js";
export type { ConformalCalibration } from "./uncertainty/conformal-surrogate.js";
export { calibrateConformal } from "./uncertainty/calibrate-conformal.js";
export type { ConformalOptions } from "./uncertainty/calibrate-conformal.js";
export { fitConformal } from "./uncertainty/fit-conformal.js";
export type { FitConformalOptions } from "./uncertainty/fit-conformal.js";
export { conformalQuantile } from "./uncertainty/conformal-quantile.js";
export { minCalibrationRows } from "./uncertainty/min-calibration-rows.js";
export { MlpFileSurrogate } from "./model-file/mlp-surrogate-from-file.js";
// Structure-aware plate-stack surrogate: learned plate geometry, exact stacking rule (plate-stack/)
export { fitPlateStack } from "./plate-stack/fit-plate-stack.js";
export type { PlateStackOptions } from "./plate-stack/fit-plate-stack.js";
export { PlateStackSurrogate } from "./plate-stack/plate-stack-surrogate.js";
export type { FittedQuantity, PlateStackParts } from "./plate-stack/plate-stack-surrogate.js";
export { plateStackColumns } from "./plate-stack/plate-stack-training-rows.js";
export type { PlateStackData } from "./plate-stack/plate-stack-training-rows.js";
export { qmcNormalDraws } from "./plate-stack/qmc-normal-draws.js";
export { fitMinAffineTrend } from "./plate-stack/fit-min-affine-trend.js";
export type { MinAffineTrendOptions } from "./plate-stack/fit-min-affine-trend.js";
export { plateStackModelFileSchema, plateStackPayloadSchema } from "./model-file/plate-stack-model-file-schema.js";
export type { PlateStackModelFile } from "./model-file/plate-stack-model-file-schema.js";
export {
  PLATE_STACK_OUTPUTS,
  PLATE_STACK_RULE_NAME,
  evaluatePlateStack,
  minAffineAt,
  stackPlates,
} from "./predict/index.js";
export type { MinAffineTrend, PlateStackEvaluation, PlateStackPayload, StackRule, StackResult, StackLimit } from "./predict/index.js";
// General composite: surrogates of named intermediate outputs combined by the caller's function (composite/)
export { CompositeSurrogate } from "./composite/composite-surrogate.js";
export type { CombineFunction, Combiner } from "./composite/composite-surrogate.js";
export { fitComposite } from "./composite/fit-composite.js";
export type { CompositeData } from "./composite/fit-composite.js";
export { loadCompositeSurrogate } from "./composite/load-composite-surrogate.js";
export { compositeModelFileSchema } from "./model-file/composite-model-file-schema.js";
export type { CompositeModelFile } from "./model-file/composite-model-file-schema.js";
