import type { Scenario } from "../scenario/scenario.js";
import type { Evaluator, EvaluatorFunction } from "./evaluator.js";
import { functionEvaluator } from "./function-evaluator.js";
import { massingEvaluator } from "./massing-evaluator.js";

/**
 * The evaluator a dataset run uses: the scenario's exact massing evaluator when none is given, a plain
 * function wrapped as an evaluator, or the given evaluator itself.
 * @param scenario - the scenario (for the default massing evaluator).
 * @param given - an evaluator, a function, or undefined.
 */
export function resolveEvaluator(scenario: Scenario, given: Evaluator | EvaluatorFunction | undefined): Evaluator {
  if (given === undefined) return massingEvaluator(scenario);
  return typeof given === "function" ? functionEvaluator(given) : given;
}
