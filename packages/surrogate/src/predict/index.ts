export { loadPredictor } from "./load-predictor.js";
export { sha256Hex } from "./sha256.js";
export type { Predictor, PredictorOutput } from "./predictor.js";
export type { MlpPredictor } from "./mlp-predictor.js";
export { createMlpPredictor } from "./mlp-predictor.js";
export type { ModelFileShape } from "./model-file-shape.js";
export type { MlpPayload, MlpLayerPayload, MlpActivation } from "./mlp-payload.js";
export type { EnsemblePayload } from "./ensemble-payload.js";
export type { ConformalPayload } from "./conformal-payload.js";
