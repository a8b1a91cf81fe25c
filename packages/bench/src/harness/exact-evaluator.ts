import type { Evaluator } from "@floorcast/sampler";
import type { Design, Outputs } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";

/** An Evaluator (the sampler's contract) backed by a problem's exact evaluator, counting every design it evaluates. */
export interface CountingEvaluator extends Evaluator<Outputs> {
  /** Designs evaluated so far. */
  readonly count: number;
}

/**
 * The exact evaluator of a problem as an optimizer's evaluator. For a site-selection problem
 * pass the site: its parameter values are merged into every design before evaluation.
 * @param problem - the problem.
 * @param site - fixed values merged into each design (site selection), or undefined.
 * @returns a counting evaluator.
 */
export function exactEvaluator(problem: BenchProblem, site?: Design): CountingEvaluator {
  let count = 0;
  return {
    name: `exact: ${problem.name}`,
    concurrency: 1,
    close: async () => {},
    get count() {
      return count;
    },
    evaluate(batch: readonly Design[]): Promise<readonly Outputs[]> {
      count += batch.length;
      const designs = site ? batch.map((d) => ({ ...site, ...d })) : batch;
      return problem.evaluateBatch ? problem.evaluateBatch(designs) : Promise.resolve(designs.map((d) => problem.evaluate(d)));
    },
  };
}
