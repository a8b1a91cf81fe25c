import { loadSurrogate } from "../model-file/load-surrogate.js";
import { parseModelFile } from "../model-file/parse-model-file.js";
import { checkModelChecksum } from "../predict/check-model-checksum.js";
import { nodeSha256Hex } from "../model-file/seal-model-file.js";
import type { CompositeModelFile } from "../model-file/composite-model-file-schema.js";
import { CompositeSurrogate, type Combiner } from "./composite-surrogate.js";

/**
 * Loads a composite model file: the file names its combining function, and the caller supplies it (code is never
 * read from a file). Validates the envelope, each intermediate's file (loadSurrogate) and the checksum.
 * @param json - the model file (object or JSON text).
 * @param combiners - the caller's functions by name; the one the file names must be there.
 * @param fileName - named in messages.
 * @returns the composite surrogate.
 * @throws RangeError naming the missing function, or the file's problem.
 */
export function loadCompositeSurrogate(
  json: unknown,
  combiners: Readonly<Record<string, Combiner>>,
  fileName = "model file",
): CompositeSurrogate {
  const fn = "loadCompositeSurrogate";
  const file = parseModelFile(json, fileName, fn);
  if (file.modelType !== "composite") throw new RangeError(`${fn}: ${fileName}: modelType must be composite, got ${file.modelType}`);
  const f = file as CompositeModelFile;
  const combiner = combiners[f.payload.combine];
  if (combiner === undefined) {
    throw new RangeError(`${fn}: ${fileName} combines its intermediates with ${JSON.stringify(f.payload.combine)}; pass that function in combiners`);
  }
  const inner = f.payload.intermediates.map((i, j) => loadSurrogate(i.model, `${fileName} payload.intermediates[${j}]`));
  checkModelChecksum((typeof json === "string" ? JSON.parse(json) : json) as Record<string, unknown>, nodeSha256Hex, fn, fileName);
  const { checksum: _c, ...rest } = f;
  return new CompositeSurrogate(rest, inner, combiner);
}
