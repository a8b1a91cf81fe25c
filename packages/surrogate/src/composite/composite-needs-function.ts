import type { CompositeModelFile } from "../model-file/composite-model-file-schema.js";

/**
 * The loadSurrogate entry for "composite" files: refuses, because the combining function is the caller's.
 * @param file - the validated file.
 * @param fileName - named in the message.
 */
export function compositeNeedsFunction(file: CompositeModelFile, fileName = "model file"): never {
  throw new RangeError(
    `loadSurrogate: ${fileName} is a composite model combined by ${JSON.stringify(file.payload.combine)}; ` +
      "load it with loadCompositeSurrogate(json, { [name]: combiner })",
  );
}
