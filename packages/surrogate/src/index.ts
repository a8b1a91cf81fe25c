export type { Prediction, Surrogate, SurrogateTrainer, TrainingData } from "./surrogate-types.js";
