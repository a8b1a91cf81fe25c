import type { Evaluator } from "@floorcast/sampler";
import type { Design, Outputs } from "../optimize/optimization-problem.js";

/** An Evaluator (the sampler's contract) backed by an exact evaluator, counting every design it evaluates. */
export interface CountingEvaluator extends Evaluator<Outputs> {
  /** Designs evaluated so far. */
  readonly count: number;
}

/**
 * Wraps an exact batch evaluation as a one-at-a-time (concurrency 1) CountingEvaluator with nothing to close.
 * @param name - the evaluator's name. @param evaluate - evaluates a batch of designs.
 * @returns the counting evaluator.
 */
export function countingEvaluator(name: string, evaluate: (batch: readonly Design[]) => Promise<readonly Outputs[]>): CountingEvaluator {
  let count = 0;
  return {
    name,
    concurrency: 1,
    close: async () => {},
    get count() {
      return count;
    },
    evaluate(batch: readonly Design[]): Promise<readonly Outputs[]> {
      count += batch.length;
      return evaluate(batch);
    },
  };
}
