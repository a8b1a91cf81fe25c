import { readTable, schemaLevels } from "@floorcast/sampler";
import { withCaution, withInputSchema, type TrainingData } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import { UsageError } from "../cli/usage-error.js";
import { datasetInputSchema } from "./dataset-input-schema.js";
import { optionDefaults, type FitOptions } from "./model-family.js";
import { MODEL_FAMILIES, modelFamily } from "./model-families.js";
import { UNCERTAINTY_OPTIONS, fitWithUncertainty } from "./with-uncertainty.js";

/** What {@link fitModelFile} fits. */
export interface FitModelRequest {
  /** The training CSV (its manifest, when beside it, gives the input schema). */
  readonly data: string;
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  /** Family name, e.g. "gp" (see MODEL_FAMILIES). */
  readonly model: string;
  readonly seed: number;
  /** Family and uncertainty options as `floorcast fit` parses them; missing ones take the family's defaults. */
  readonly options?: FitOptions;
  /** Writes one note line (default: nothing). */
  readonly say?: (line: string) => void;
}

/**
 * The one fit entry: reads the training columns of a CSV, fits the family with its defaults (overridden by
 * `options`), applies `--ensemble`/`--conformal`, records the input schema from the manifest and the caution
 * (FLOORCAST_CAUTION), and returns the model file's text exactly as `floorcast fit` writes it (the benchmark
 * writes and reloads the same text).
 * @param request - data, inputs, targets, family, seed and options.
 * @returns the model file's JSON text (one line and a newline) and the number of training rows.
 * @throws UsageError for an unknown family or a bad option value; RangeError from the CSV reader.
 */
export async function fitModelFile(request: FitModelRequest): Promise<{ readonly text: string; readonly rows: number }> {
  const family = modelFamily(request.model);
  if (!family) throw new UsageError(`fit: --model must be one of ${MODEL_FAMILIES.map((f) => f.name).join(", ")}, got ${request.model}`);
  const say = request.say ?? (() => {});
  const opts: FitOptions = { ...optionDefaults(family.options), ...optionDefaults(UNCERTAINTY_OPTIONS), ...stripUndefined(request.options ?? {}) };
  const inputs = [...request.inputs];
  const targets = [...request.targets];
  const schema = await datasetInputSchema(request.data, inputs, say);
  // categorical inputs with string levels are coded as the codec codes model rows (a string level's position)
  const table = await readTable(request.data, { inputs, targets, levels: schemaLevels(schema) });
  const data: TrainingData = { inputs, targets, x: table.x, y: table.y };
  const model = family.fitCsv
    ? await family.fitCsv(request.data, inputs, targets, opts, request.seed, say)
    : await fitWithUncertainty(family, data, opts, request.seed, say);
  const fitted = schema === undefined ? model.toJSON() : withInputSchema(model.toJSON() as object, schema);
  const file = withCaution(fitted as object, FLOORCAST_CAUTION);
  return { text: `${JSON.stringify(file)}\n`, rows: data.x.length };
}

function stripUndefined(o: FitOptions): FitOptions {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));
}
