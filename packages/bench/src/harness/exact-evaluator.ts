import type { Design } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import { countingEvaluator, type CountingEvaluator } from "./counting-evaluator.js";

/**
 * The exact evaluator of a problem as an optimizer's evaluator. For a site-selection problem
 * pass the site: its parameter values are merged into every design before evaluation.
 * @param problem - the problem.
 * @param site - fixed values merged into each design (site selection), or undefined.
 * @returns a counting evaluator.
 */
export function exactEvaluator(problem: BenchProblem, site?: Design): CountingEvaluator {
  return countingEvaluator(`exact: ${problem.name}`, (batch) => {
    const designs = site ? batch.map((d) => ({ ...site, ...d })) : batch;
    return problem.evaluateBatch ? problem.evaluateBatch(designs) : Promise.resolve(designs.map((d) => problem.evaluate(d)));
  });
}
