export { fitMlp } from "./fit-mlp.js";
export { MlpSurrogate } from "./mlp-surrogate.js";
export type { MlpModelFile } from "./mlp-surrogate.js";
export type { MlpOptions, LearningRateSchedule } from "./mlp-options.js";
export type { MlpTrainingSummary } from "./train-mlp.js";
export { useNnBackend } from "./tf-backend.js";
export type { NnBackend, NnBackendRequest } from "./tf-backend.js";
export { mlpTrainer } from "./mlp-trainer.js";
