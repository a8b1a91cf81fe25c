import { evaluateMassing } from "../massing/evaluate-massing.js";
import type { Scenario } from "../scenario/scenario.js";
import { scenarioToMassingInput } from "../scenario/scenario-to-massing-input.js";
import type { Evaluator } from "./evaluator.js";
import { massingOutputs } from "./massing-outputs.js";

/**
 * The exact evaluator of a scenario: maps each sample onto the massing rule (scenarioToMassingInput) and
 * returns every scalar of MassingResult (see massingOutputs).
 * @param scenario - a validated scenario.
 * @returns an in-process evaluator named "massing-rule-v1".
 */
export function massingEvaluator(scenario: Scenario): Evaluator {
  const names = scenario.parameters.map((p) => p.name);
  return {
    name: "massing-rule-v1",
    concurrency: 1,
    evaluate(input) {
      const record: Record<string, number | string> = {};
      for (const name of names) {
        const v = input[name];
        if (typeof v === "boolean") throw new TypeError(`massingEvaluator: ${name} must be a number or string`);
        if (v !== undefined) record[name] = v;
      }
      return massingOutputs(evaluateMassing(scenarioToMassingInput(scenario, record)));
    },
    close: async () => {},
  };
}
