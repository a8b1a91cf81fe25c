import type { BenchTrainer } from "./bench-trainer.js";
import type { TrainingSet } from "./sample-training-set.js";

/** What one surrogate trial needs besides the problem. */
export interface TrialSetup {
  readonly trainer: BenchTrainer;
  readonly trainingSize: number;
  readonly seed: number;
  /** Independent, exactly evaluated test set (shared by every trial of the problem). */
  readonly test: TrainingSet;
  /** Exact optimum value of the (first) objective. */
  readonly exactValue: number;
  /** Exact evaluations of local refinement after the surrogate search (default 20). */
  readonly refineBudget?: number;
  /** Unit-cube training rows to use instead of floorcast's maximin LHS (peer sampler). */
  readonly unitRows?: readonly (readonly number[])[];
  /** Sampler name written to the report (default "lhs-maximin"). */
  readonly sampler?: string;
  /** Surrogate search candidates (default 1024). */
  readonly candidates?: number;
  /** Training sets shared by trials on the same rows (same sampler, size and seed). */
  readonly cache?: Map<string, TrainingSet>;
  /** Folder for the run's training CSVs (with manifests) and model files. */
  readonly workDir: string;
}
