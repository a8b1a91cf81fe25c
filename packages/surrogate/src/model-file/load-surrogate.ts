import type { Surrogate } from "../surrogate-types.js";
import type { ModelFile } from "./model-file-schema.js";
import { parseModelFile } from "./parse-model-file.js";
import { surrogateLoaders } from "./surrogate-loaders.js";

/**
 * Loads any floorcast surrogate model file (checks kind and format version, validates with zod, dispatches
 * on modelType). The loaded model predicts exactly as the one that was saved.
 * @param json - the parsed JSON value (or its text).
 * @param fileName - named in error messages.
 * @returns the fitted surrogate.
 * @throws TypeError / RangeError naming the file, the path and the problem.
 */
export function loadSurrogate(json: unknown, fileName = "model file"): Surrogate {
  const file = parseModelFile(json, fileName, "loadSurrogate");
  const load = surrogateLoaders[file.modelType] as (f: ModelFile, name: string) => Surrogate;
  return load(file, fileName);
}
