import { createHash } from "node:crypto";
import { readFile, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { evaluateMassing, functionEvaluator, massingOutputs, writeDataset, type MassingInput, type Parameter, type Scenario, type Variable } from "@floorcast/sampler";
import { loadSurrogate, type Surrogate } from "@floorcast/surrogate";
import { fitModelFile } from "../families/fit-model-file.js";
import type { FitOptions } from "../families/model-family.js";
import { PARCEL_DESCRIPTOR_NAMES, parcelDescriptors } from "./parcel-descriptors.js";
import { PARCEL_DESIGN_VARIABLES, parcelDesignInput } from "./parcel-design-variables.js";

/** What {@link trainParcelSurrogate} needs. */
export interface ParcelSurrogateRequest {
  /** Every parcel's massing input at its zone's controls (metres), in file order. */
  readonly zones: readonly MassingInput[];
  /** Indices (into `zones`) of the parcels the training designs are drawn on. */
  readonly training: readonly number[];
  /** Exact evaluations in the training set (parcel × design rows). */
  readonly rows: number;
  /** Outputs the surrogate predicts (the objective, then constraint outputs). */
  readonly targets: readonly string[];
  readonly seed: number;
  /** Folder the dataset CSV, its manifest and the model file are written to. */
  readonly dir: string;
  /** Registered family name (default "gp"). */
  readonly model?: string;
  /** Fit options as `floorcast fit` takes them. */
  readonly fitOptions?: FitOptions;
  /** Called after each training row. */
  readonly onProgress?: (done: number, total: number) => void;
}

/** A fitted cross-parcel surrogate, loaded back from its model file. */
export interface ParcelSurrogate {
  readonly model: Surrogate;
  /** Its input variables: the descriptors (each on its training range), then PARCEL_DESIGN_VARIABLES. */
  readonly variables: readonly Variable[];
  readonly csv: string;
  readonly modelFile: string;
  /** Exact evaluations spent on the training set. */
  readonly evaluations: number;
}

/**
 * Trains a surrogate across parcels the way a user does: a Latin hypercube (writeDataset, "lhs-maximin") over a
 * `parcel` level (the training parcels) and PARCEL_DESIGN_VARIABLES is evaluated with the exact rule, each row
 * written with the parcel's descriptors (parcelDescriptors) beside the targets; the CSV is fitted through
 * fitModelFile (the entry `floorcast fit` uses) on descriptors + design variables, the model file written and
 * loaded back with loadSurrogate.
 * @param request - parcels, training parcels, rows, targets, seed, folder, family and fit options.
 * @returns the loaded model, its input variables and the files written.
 */
export async function trainParcelSurrogate(request: ParcelSurrogateRequest): Promise<ParcelSurrogate> {
  const { zones, training, targets } = request;
  const parameters: Parameter[] = [
    { kind: "categorical", name: "parcel", levels: [...training], unit: "", description: "Index of the training parcel in the parcel file." },
    ...PARCEL_DESIGN_VARIABLES.map((v) => ({ ...v, unit: v.unit ?? "", description: v.description ?? v.name }) as Parameter),
  ];
  const scenario: Scenario = {
    kind: "floorcast.scenario",
    formatVersion: 1,
    name: "parcel-ranking-training",
    title: "Designs on the training parcels of a parcel file",
    description: "Parcel × design rows evaluated with the exact rule, with each parcel's descriptors.",
    parameters,
    fixed: {},
    fileName: "(parcel ranking)",
    sha256: createHash("sha256").update(JSON.stringify({ zones: training.map((k) => zones[k]), targets })).digest("hex"),
  };
  const descriptors = zones.map((z) => parcelDescriptors(z));
  const evaluator = functionEvaluator(
    (input) => {
      const k = input.parcel as number;
      const out = massingOutputs(evaluateMassing(parcelDesignInput(zones[k]!, input as Record<string, number>)));
      return { ...descriptors[k]!, ...Object.fromEntries(targets.map((t) => [t, out[t] as number])) };
    },
    { name: "massing-rule on parcels" },
  );
  const csv = join(request.dir, `parcels-train-${request.seed}.csv`);
  await writeDataset(scenario, {
    out: csv,
    n: request.rows,
    design: "lhs-maximin",
    seed: request.seed,
    evaluator,
    force: true,
    ...(request.onProgress ? { onProgress: request.onProgress } : {}),
  });
  const inputs = [...PARCEL_DESCRIPTOR_NAMES, ...PARCEL_DESIGN_VARIABLES.map((v) => v.name)];
  const { text } = await fitModelFile({ data: csv, inputs, targets, model: request.model ?? "gp", seed: request.seed, options: request.fitOptions ?? {} });
  const modelFile = join(request.dir, `parcels-model-${request.seed}.json`);
  await writeFile(modelFile, text);
  const model = loadSurrogate(await readFile(modelFile, "utf8"), modelFile);
  const used = training.map((k) => descriptors[k]!);
  const variables: Variable[] = [
    ...PARCEL_DESCRIPTOR_NAMES.map((name): Variable => {
      const values = used.map((d) => d[name]);
      return { kind: "continuous", name, min: Math.min(...values), max: Math.max(...values) };
    }),
    ...PARCEL_DESIGN_VARIABLES,
  ];
  return { model, variables, csv, modelFile, evaluations: request.rows };
}
