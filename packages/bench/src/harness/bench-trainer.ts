import type { Surrogate, TrainingData } from "@floorcast/surrogate";
import type { BatchPredictor } from "./surrogate-evaluator.js";

/** A surrogate family the benchmark trains: floorcast's GP or NN, or a peer library's model. */
export interface BenchTrainer {
  /** Name in report.json, e.g. "gp", "nn", "sklearn-gp". */
  readonly name: string;
  /** Fits on the training data with a seed; the result predicts batches of rows. */
  fit(data: TrainingData, seed: number): Promise<Surrogate | BatchPredictor>;
  /** Releases what the model holds (a peer's child process); optional. */
  release?(model: Surrogate | BatchPredictor): void;
}
