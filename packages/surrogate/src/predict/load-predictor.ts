import type { ModelFileShape } from "./model-file-shape.js";
import type { Predictor } from "./predictor.js";
import { objectField } from "./predictor-checks.js";
import { createMlpPredictor } from "./mlp-predictor.js";
import { createGpPredictor } from "./gp-predictor.js";
import { createEnsemblePredictor } from "./ensemble-predictor.js";
import { createConformalPredictor } from "./conformal-predictor.js";
import { createPlateStackPredictor } from "./plate-stack-predictor.js";
import { checkModelChecksum } from "./check-model-checksum.js";
import { sha256Hex } from "./sha256.js";
import { checkJsonDepth } from "./check-json-depth.js";

const FN = "loadPredictor";

function names(label: string, v: unknown): string[] {
  if (!Array.isArray(v) || v.length === 0 || !v.every((s) => typeof s === "string")) {
    throw new TypeError(`${FN}: ${label} must be a non-empty array of names`);
  }
  const seen = new Set<string>();
  for (const s of v as string[]) {
    if (seen.has(s)) throw new RangeError(`${FN}: ${label} must not repeat a name, got ${JSON.stringify(s)} twice`);
    seen.add(s);
  }
  return v as string[];
}

/**
 * Loads a floorcast model file (a parsed object or its JSON text) into a dependency-free predictor:
 * plain typed-array arithmetic for "gp", "mlp", "ensemble", "conformal" and "plate-stack" files, importing nothing
 * outside this directory, so it also runs in a browser.
 * @param modelJson - the model file, as an object or a JSON string.
 * @returns `{ modelType, inputs, targets, predict(x) }`; predict takes rows × inputs in original
 *   units and gives `mean` (and `sd`, and for conformal files `interval`) as rows × targets.
 * The stored payload checksum ("sha256:…" over the canonical JSON, checked with the plain-TypeScript sha256Hex)
 * must match: an edited or damaged file is refused; a file without one is accepted. A "__proto__" key is refused.
 * @throws TypeError / RangeError naming the faulty field (wrong kind, unsupported format version, bad payload, checksum).
 */
export function loadPredictor(modelJson: unknown): Predictor {
  const predictor = buildPredictor(modelJson);
  const raw = typeof modelJson === "string" ? (JSON.parse(modelJson) as Record<string, unknown>) : (modelJson as Record<string, unknown>);
  checkModelChecksum(raw, sha256Hex, FN, "model file");
  return predictor;
}

function buildPredictor(modelJson: unknown): Predictor {
  let raw = modelJson;
  if (typeof modelJson === "string") {
    try {
      raw = JSON.parse(modelJson) as unknown;
    } catch (error) {
      throw new RangeError(`${FN}: the model file is not valid JSON (${(error as Error).message})`);
    }
  }
  const file = objectField(FN, "model file", raw);
  checkJsonDepth(FN, "the model file", file);
  if (file.kind !== "floorcast.surrogate") {
    throw new RangeError(`${FN}: kind must be "floorcast.surrogate", got ${JSON.stringify(file.kind)}`);
  }
  if (file.formatVersion !== 1) {
    throw new RangeError(`${FN}: formatVersion ${JSON.stringify(file.formatVersion)} is not supported (this predictor reads 1)`);
  }
  names("inputs", file.inputs);
  names("targets", file.targets);
  objectField(FN, "inputScaling", file.inputScaling);
  objectField(FN, "outputScaling", file.outputScaling);
  const shaped = file as unknown as ModelFileShape;
  switch (file.modelType) {
    case "gp":
      return createGpPredictor(shaped);
    case "mlp":
      return createMlpPredictor(shaped);
    case "ensemble":
      return createEnsemblePredictor(shaped, loadPredictor);
    case "conformal":
      return createConformalPredictor(shaped, loadPredictor);
    case "plate-stack":
      return createPlateStackPredictor(shaped, loadPredictor);
    default:
      throw new RangeError(`${FN}: modelType must be gp, mlp, ensemble, conformal or plate-stack, got ${JSON.stringify(file.modelType)}`);
  }
}
