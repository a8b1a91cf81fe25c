import type { EvaluatedDesign } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import type { ReportedDesign } from "./bench-report-types.js";

/**
 * An exactly evaluated design as report.json writes it: the full MassingInput and its exact
 * MassingResult for massing problems, the design and its outputs for test functions.
 * @param problem - the problem.
 * @param e - the exactly evaluated design.
 */
export function reportDesign(problem: BenchProblem, e: EvaluatedDesign): ReportedDesign {
  const input = problem.massingInput ? problem.massingInput(e.design) : e.design;
  const result = problem.massingResult ? problem.massingResult(e.design) : e.outputs;
  return { design: e.design, input, result, value: e.objectives[0]! };
}
