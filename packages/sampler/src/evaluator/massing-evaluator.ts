import { evaluateMassing } from "../massing/evaluate-massing.js";
import type { Scenario } from "../scenario/scenario.js";
import { scenarioToMassingInput } from "../scenario/scenario-to-massing-input.js";
import type { Evaluator, EvaluatorInput, EvaluatorOutput } from "./evaluator.js";
import { massingOutputs } from "./massing-outputs.js";
import { plateProfileColumns, plateProfileLayout } from "./plate-profile-columns.js";

/** Options of {@link massingEvaluator}. */
export interface MassingEvaluatorOptions {
  /** Add the plate-profile columns (`rule_*`, `plateArea_k`, `plateWidth_k`; README "Plate profiles"). */
  readonly plateProfile?: boolean;
}

/**
 * The exact evaluator of a scenario: maps each sample onto the massing rule (scenarioToMassingInput) and
 * returns every scalar of MassingResult (see massingOutputs), plus the plate profile when asked for.
 * @param scenario - a validated scenario.
 * @param options - `plateProfile: true` adds the plate-profile columns (plateProfileColumns).
 * @returns an in-process evaluator named "massing-rule-v1" ("massing-rule-v1+plate-profile" with the profile).
 */
export function massingEvaluator(scenario: Scenario, options: MassingEvaluatorOptions = {}): Evaluator {
  const names = scenario.parameters.map((p) => p.name);
  const layout = options.plateProfile === true ? plateProfileLayout(scenario) : undefined;
  return {
    name: layout === undefined ? "massing-rule-v1" : "massing-rule-v1+plate-profile",
    concurrency: 1,
    evaluate(batch) {
      return batch.map(evaluateOne);
    },
    close: async () => {},
  };

  function evaluateOne(input: EvaluatorInput): EvaluatorOutput {
    const record: Record<string, number | string> = {};
    for (const name of names) {
      const v = input[name];
      if (typeof v === "boolean") throw new TypeError(`massingEvaluator: ${name} must be a number or string`);
      if (v !== undefined) record[name] = v;
    }
    const massing = scenarioToMassingInput(scenario, record);
    if (layout === undefined) return massingOutputs(evaluateMassing(massing));
    const r = evaluateMassing(massing, { profile: true });
    const profile = { lotArea: r.lotArea, buildableArea: r.buildableArea, storeys: r.profile! };
    return { ...massingOutputs(r), ...plateProfileColumns(massing, profile, layout) };
  }
}
