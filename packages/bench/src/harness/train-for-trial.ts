import { join } from "node:path";
import type { Surrogate } from "@floorcast/surrogate";
import type { BenchProblem } from "../problem/bench-problem.js";
import { assessAccuracy, type TargetAccuracy } from "./assess-accuracy.js";
import type { BenchTrainer } from "./bench-trainer.js";
import { sampleTrainingSet, type TrainingSet } from "./sample-training-set.js";
import type { BatchPredictor } from "./surrogate-evaluator.js";

/** A fitted, assessed surrogate of one trial. */
export interface TrainedTrial {
  readonly train: TrainingSet;
  readonly model: Surrogate | BatchPredictor;
  readonly fitSeconds: number;
  readonly accuracy: TargetAccuracy[];
  /** Assessment time. */
  readonly seconds: number;
}

/**
 * The steps every trial shares: sample the training design and evaluate it exactly (a dataset file, as `sample`
 * writes it), fit the surrogate (a model file, as `fit` writes it), and assess it on the independent test set.
 * @param problem - the problem.
 * @param setup - trainer, training size, seed, test set and optional unit rows (peer sampler).
 * @returns the training set, the model, and its accuracy and timings.
 */
export async function trainForTrial(
  problem: BenchProblem,
  setup: {
    readonly trainer: BenchTrainer;
    readonly trainingSize: number;
    readonly seed: number;
    readonly test: TrainingSet;
    readonly unitRows?: readonly (readonly number[])[];
    readonly sampler?: string;
    /** Training sets already drawn, by sampler, size and seed: trials on the same rows share one. */
    readonly cache?: Map<string, TrainingSet>;
    /** Folder for the training CSVs (with manifests) and model files of the run. */
    readonly workDir: string;
  },
): Promise<TrainedTrial> {
  const key = `${setup.sampler ?? "lhs-maximin"}|${setup.trainingSize}|${setup.seed}`;
  const cached = setup.cache?.get(key);
  // a training set shared with an earlier trial costs this one no sampling time
  const train = cached ? { ...cached, seconds: 0 } : await sampleTrainingSet(problem, setup.trainingSize, `train-${setup.seed}`, setup.workDir, setup.unitRows);
  if (!cached) setup.cache?.set(key, train);
  const t0 = performance.now();
  const modelFile = join(setup.workDir, `${setup.trainer.name}-${setup.sampler ?? "lhs-maximin"}-${setup.trainingSize}-${setup.seed}.json`);
  const model = await setup.trainer.fit(train, setup.seed, modelFile);
  const fitSeconds = (performance.now() - t0) / 1000;
  const assessed = await assessAccuracy(model, setup.test);
  return { train, model, fitSeconds, accuracy: assessed.accuracy, seconds: assessed.seconds };
}
