import type { Surrogate } from "../surrogate-types.js";
import type { ModelFile } from "./model-file-schema.js";
import { parseModelFile } from "./parse-model-file.js";
import { surrogateLoaders } from "./surrogate-loaders.js";
import { checkModelChecksum } from "../predict/check-model-checksum.js";
import { nodeSha256Hex } from "./seal-model-file.js";

/**
 * Loads any floorcast surrogate model file (checks kind and format version, validates with zod, dispatches
 * on modelType), then checks the stored payload checksum (see sealModelFile): an edited or damaged file is
 * refused; a file without a checksum (written before checksums were added) is accepted. Nothing in the file is
 * ever executed, and a "__proto__" key is refused. The loaded model predicts exactly as the one that was saved.
 * @param json - the parsed JSON value (or its text).
 * @param fileName - named in error messages.
 * @returns the fitted surrogate.
 * @throws TypeError / RangeError naming the file, the path and the problem.
 */
export function loadSurrogate(json: unknown, fileName = "model file"): Surrogate {
  const file = parseModelFile(json, fileName, "loadSurrogate");
  const load = surrogateLoaders[file.modelType] as (f: ModelFile, name: string, loadNested: (json: unknown, name: string) => Surrogate) => Surrogate;
  const model = load(file, fileName, loadSurrogate);
  checkModelChecksum(rawModelFile(json), nodeSha256Hex, "loadSurrogate", fileName);
  return model;
}

/** The parsed value behind a model file given as text or object (parseModelFile has already accepted it). */
function rawModelFile(json: unknown): Record<string, unknown> {
  return (typeof json === "string" ? JSON.parse(json) : json) as Record<string, unknown>;
}
