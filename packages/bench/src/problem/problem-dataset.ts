import { createHash } from "node:crypto";
import { functionEvaluator, massingEvaluator, type Evaluator, type Parameter, type Scenario, type Variable } from "@floorcast/sampler";
import type { Design, Outputs } from "../optimize/optimization-problem.js";

/** How a problem's training data are sampled the way `floorcast sample` samples a scenario. */
export interface ProblemDataset {
  /** The problem as a scenario: its training variables sampled, everything else fixed. */
  readonly scenario: Scenario;
  /** A fresh evaluator for writeDataset (the massing rule of that scenario, or the test function). */
  evaluator(): Evaluator;
}

/**
 * The dataset side of a problem: a scenario whose parameters are the problem's training variables (units and
 * descriptions from the base scenario) and whose fixed values are the base scenario's plus the problem's, named
 * after the problem and hashed from the problem file's contents; the evaluator is the massing rule of that
 * scenario (as `sample` uses it), the external command (as `sample --evaluator-command` runs it) or, for a test
 * function, the function.
 * @param problem - name, file name and contents of the problem file.
 * @param variables - the training variables.
 * @param base - the scenario the file names (massing problems), with the problem's fixed values.
 * @param testFunction - the function of a standard-suite problem.
 * @param command - the fixed values and evaluator factory of a problem with an external evaluator command.
 * @returns the scenario and evaluator factory.
 */
export function problemDataset(
  problem: { readonly name: string; readonly title: string; readonly description: string; readonly fileName: string; readonly contents: unknown },
  variables: readonly Variable[],
  base: { readonly scenario: Scenario; readonly fixed: Readonly<Record<string, number | string>> } | undefined,
  testFunction?: { readonly name: string; readonly evaluate: (d: Design) => Outputs },
  command?: { readonly fixed: Readonly<Record<string, number | string>>; readonly evaluator: () => Evaluator },
): ProblemDataset {
  const params = new Map((base?.scenario.parameters ?? []).map((p) => [p.name, p]));
  const parameters = variables.map((v): Parameter => {
    const p = params.get(v.name);
    return { ...v, unit: p?.unit ?? "", description: p?.description ?? `${v.name} of ${problem.name}` } as Parameter;
  });
  const scenario: Scenario = {
    kind: "floorcast.scenario",
    formatVersion: 1,
    name: problem.name,
    title: problem.title,
    description: problem.description,
    parameters,
    fixed: { ...(base?.scenario.fixed ?? {}), ...(base?.fixed ?? {}), ...(command?.fixed ?? {}) },
    fileName: problem.fileName,
    sha256: createHash("sha256").update(JSON.stringify(problem.contents)).digest("hex"),
  };
  return {
    scenario,
    evaluator: () =>
      command
        ? command.evaluator()
        : testFunction
        ? functionEvaluator((input) => testFunction.evaluate(input as Design), { name: `test-function: ${testFunction.name}` })
        : massingEvaluator(scenario, { plateProfile: true }),
  };
}
