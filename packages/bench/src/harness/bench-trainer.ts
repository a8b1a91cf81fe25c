import type { Surrogate } from "@floorcast/surrogate";
import type { BatchPredictor } from "./surrogate-evaluator.js";
import type { TrainingSet } from "./sample-training-set.js";

/** A surrogate family the benchmark trains: floorcast's GP or NN, or a peer library's model. */
export interface BenchTrainer {
  /** Name in report.json, e.g. "gp", "nn", "sklearn-gp". */
  readonly name: string;
  /**
   * Fits on a training set (its CSV and rows) with a seed; floorcast's trainers write the model file to
   * `modelFile` and load it back. The result predicts batches of model rows.
   */
  fit(train: TrainingSet, seed: number, modelFile: string): Promise<Surrogate | BatchPredictor>;
  /** Releases what the model holds (a peer's child process); optional. */
  release?(model: Surrogate | BatchPredictor): void;
}
