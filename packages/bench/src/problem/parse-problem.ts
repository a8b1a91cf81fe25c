import { createDesign, evaluateMassing, mapUnitToSpace, massingEvaluator, scenarioToMassingInput } from "@floorcast/sampler";
import type { MassingInput, Parameter, Scenario, Variable } from "@floorcast/sampler";
import type { Design } from "../optimize/optimization-problem.js";
import type { BenchProblem, BenchSites } from "./bench-problem.js";
import { problemFileSchema, type ProblemFile } from "./problem-file-schema.js";
import { ProblemFileError } from "./problem-file-error.js";
import { MASSING_OUTPUTS, problemMassingOutputs } from "./massing-outputs.js";
import { TEST_FUNCTION_VARIABLES, testFunctionEvaluator } from "./test-function-problem.js";
import { problemDataset } from "./problem-dataset.js";
import { commandProblem } from "./command-problem.js";

type FileVariable = ProblemFile["variables"][number];

function toVariable(file: string, i: number, v: FileVariable, p: Parameter | undefined): Variable {
  const at = `variables[${i}]`;
  const fail = (field: string, problem: string): never => {
    throw new ProblemFileError(file, `${at}${field}`, problem);
  };
  const kind = v.kind ?? p?.kind ?? "continuous";
  if (p && p.kind !== kind) fail(".kind", `the scenario's ${p.name} is ${p.kind}, not ${kind}`);
  if (kind === "categorical") {
    const levels = v.levels ?? (p?.kind === "categorical" ? p.levels : undefined);
    if (!levels) return fail(".levels", "a categorical variable needs levels");
    if (p?.kind === "categorical") {
      for (const l of levels) if (!p.levels.includes(l)) fail(".levels", `${JSON.stringify(l)} is not a level of the scenario's ${p.name}`);
    }
    return { kind, name: v.name, levels };
  }
  const pMin = p && p.kind !== "categorical" ? p.min : undefined;
  const pMax = p && p.kind !== "categorical" ? p.max : undefined;
  const min = v.min ?? pMin;
  const max = v.max ?? pMax;
  if (min === undefined) return fail(".min", "needs min");
  if (max === undefined) return fail(".max", "needs max");
  if (!(max > min)) fail(".max", `max must exceed min (${min})`);
  if (pMin !== undefined && min < pMin) fail(".min", `must be ≥ the scenario's min ${pMin}, got ${min}`);
  if (pMax !== undefined && max > pMax) fail(".max", `must be ≤ the scenario's max ${pMax}, got ${max}`);
  if (kind === "integer") {
    if (!Number.isInteger(min) || !Number.isInteger(max)) fail(".min", "an integer variable needs integer bounds");
    return { kind, name: v.name, min, max };
  }
  const log = p?.kind === "continuous" && p.log === true;
  return { kind: "continuous", name: v.name, min, max, ...(log ? { log } : {}), ...(v.step === undefined ? {} : { step: v.step }) };
}

function fromParameter(p: Parameter): Variable {
  if (p.kind === "categorical") return { kind: "categorical", name: p.name, levels: p.levels };
  if (p.kind === "integer") return { kind: "integer", name: p.name, min: p.min, max: p.max };
  return { kind: "continuous", name: p.name, min: p.min, max: p.max, ...(p.log === true ? { log: true } : {}) };
}

/**
 * Validates a benchmark problem file's contents and builds the problem (schema in
 * problem-file-schema.ts; README "Benchmark"). A massing problem needs its scenario: every
 * scenario parameter must be a design variable, a fixed value or a site parameter. A problem with an
 * `evaluatorCommand` gives every variable's kind and bounds or levels itself; its fixed values go to the command
 * with each design.
 * @param json - parsed JSON (or a JSON string).
 * @param fileName - the file's name, for messages.
 * @param scenario - the scenario the file names (massing problems).
 * @param options - `dir`: the problem file's folder, the working directory of an `evaluatorCommand`.
 * @returns the problem.
 * @throws ProblemFileError (a RangeError) naming the file, the path and the problem.
 */
export function parseProblem(json: unknown, fileName: string, scenario?: Scenario, options: { readonly dir?: string } = {}): BenchProblem {
  let data: unknown = json;
  if (typeof json === "string") {
    try {
      data = JSON.parse(json);
    } catch (error) {
      throw new ProblemFileError(fileName, "", `is not JSON: ${(error as Error).message}`);
    }
  }
  const parsed = problemFileSchema.safeParse(data);
  if (!parsed.success) throw ProblemFileError.fromZod(fileName, parsed.error);
  const f = parsed.data;
  const fail = (path: string, problem: string): never => {
    throw new ProblemFileError(fileName, path, problem);
  };
  const params = new Map((scenario?.parameters ?? []).map((p) => [p.name, p]));
  if (f.scenario !== undefined && !scenario) fail("scenario", "the scenario was not loaded");
  const allowedVars = f.testFunction ? TEST_FUNCTION_VARIABLES[f.testFunction] : [...params.keys()];
  const variables = f.variables.map((v, i) => {
    if (f.evaluatorCommand === undefined && !allowedVars.includes(v.name)) {
      fail(`variables[${i}].name`, `"${v.name}" is not ${f.testFunction ? `an input of ${f.testFunction}` : `a parameter of scenario ${scenario!.name}`}; use one of ${allowedVars.join(", ")}`);
    }
    return toVariable(fileName, i, v, params.get(v.name));
  });
  if (f.testFunction) {
    const missing = allowedVars.filter((n) => !variables.some((v) => v.name === n));
    if (missing.length > 0) fail("variables", `${f.testFunction} needs variables ${missing.join(", ")}`);
  }
  const siteParams = f.siteSelection?.parameters ?? [];
  siteParams.forEach((name, i) => {
    if (!params.has(name)) fail(`siteSelection.parameters[${i}]`, `"${name}" is not a parameter of the scenario`);
    if (variables.some((v) => v.name === name) || name in f.fixed) {
      fail(`siteSelection.parameters[${i}]`, `"${name}" is already a variable or fixed`);
    }
  });
  for (const key of Object.keys(f.fixed)) {
    if (f.evaluatorCommand === undefined && !params.has(key)) fail(`fixed.${key}`, `is not a parameter of ${scenario ? `scenario ${scenario.name}` : "a test function"}`);
  }
  for (const name of params.keys()) {
    if (!variables.some((v) => v.name === name) && !(name in f.fixed) && !siteParams.includes(name)) {
      fail("fixed", `scenario parameter "${name}" needs a value (or make it a variable)`);
    }
  }
  const allowedOutputs: readonly string[] = f.testFunction ? ["f"] : MASSING_OUTPUTS;
  const checkOutput = (path: string, o: string): void => {
    // an external command names its own outputs: they are checked when it answers
    if (f.evaluatorCommand === undefined && !allowedOutputs.includes(o)) fail(path, `"${o}" is not an output; use one of ${allowedOutputs.join(", ")}`);
  };
  f.objectives.forEach((o, i) => checkOutput(`objectives[${i}].output`, o.output));
  f.constraints.forEach((c, i) => checkOutput(`constraints[${i}].output`, c.output));
  const objectives = f.objectives.map((o) => ({ output: o.output, sense: o.sense === "maximise" ? ("max" as const) : ("min" as const) }));
  const constraints = f.constraints.map((c) =>
    c.max !== undefined ? { output: c.output, op: "<=" as const, value: c.max } : { output: c.output, op: ">=" as const, value: c.min! },
  );
  const outputs = [...new Set([...objectives.map((o) => o.output), ...constraints.map((c) => c.output)])];

  let sites: BenchSites | undefined;
  if (f.siteSelection) {
    const s = f.siteSelection;
    const space = { parameters: s.parameters.map((n) => params.get(n)!) };
    const rows = createDesign({ n: s.count, dims: s.parameters.length, design: "random", seed: s.seed });
    if (s.shortlist > s.count) fail("siteSelection.shortlist", `must be ≤ count ${s.count}`);
    sites = { parameters: s.parameters, sites: mapUnitToSpace(space, rows), shortlist: s.shortlist };
  }
  const trainingVariables = [...siteParams.map((n) => fromParameter(params.get(n)!)), ...variables];
  const base = {
    name: f.name,
    title: f.title,
    description: f.description,
    suites: f.suites,
    file: fileName,
    kind: sites ? ("site-selection" as const) : objectives.length === 2 ? ("two-objective" as const) : ("single" as const),
    optimization: { variables, objectives, constraints },
    exact: f.exact,
    outputs,
    trainingVariables,
    ...(sites ? { sites } : {}),
  };
  const about = { name: f.name, title: f.title, description: f.description, fileName, contents: data };
  if (f.evaluatorCommand !== undefined) {
    const { datasetEvaluator, ...command } = commandProblem(f.evaluatorCommand, f.fixed, options.dir);
    return { ...base, ...command, dataset: problemDataset(about, trainingVariables, undefined, undefined, { fixed: f.fixed, evaluator: datasetEvaluator }) };
  }
  if (f.testFunction) {
    const evaluate = testFunctionEvaluator(f.testFunction);
    return { ...base, evaluate, dataset: problemDataset(about, trainingVariables, undefined, { name: f.testFunction, evaluate }) };
  }
  const sc = scenario!;
  const record = (design: Design): Record<string, number | string> => {
    const r: Record<string, number | string> = {};
    for (const name of params.keys()) {
      const v = name in design ? design[name] : f.fixed[name];
      if (v !== undefined) r[name] = v;
    }
    return r;
  };
  const massingInput = (design: Design): MassingInput => scenarioToMassingInput(sc, record(design));
  const profiled = massingEvaluator(sc, { plateProfile: true });
  return {
    ...base,
    dataset: problemDataset(about, trainingVariables, { scenario: sc, fixed: f.fixed }),
    massingInput,
    plateProfile: (design) => (profiled.evaluate([record(design)]) as readonly Readonly<Record<string, number | string>>[])[0]!,
    massingResult: (design, plates = false) => evaluateMassing(massingInput(design), { plates }),
    evaluate(design) {
      try {
        return problemMassingOutputs(evaluateMassing(massingInput(design)));
      } catch (error) {
        if (error instanceof RangeError || error instanceof TypeError) return problemMassingOutputs(null);
        throw error;
      }
    },
  };
}
