import { gaussianProcessFromFile } from "../gp/gaussian-process-from-file.js";
import type { Surrogate } from "../surrogate-types.js";
import { mlpSurrogateFromFile } from "./mlp-surrogate-from-file.js";
import { ensembleFromFile } from "../uncertainty/ensemble-from-file.js";
import { conformalFromFile } from "../uncertainty/conformal-from-file.js";
import type { ModelFile } from "./model-file-schema.js";
import { plateStackFromFile } from "../plate-stack/plate-stack-from-file.js";
import { compositeNeedsFunction } from "../composite/composite-needs-function.js";

/** A loader for each model type: builds the fitted surrogate from its validated file. */
export type SurrogateLoaders = {
  readonly [K in ModelFile["modelType"]]: (
    file: Extract<ModelFile, { modelType: K }>,
    fileName: string,
    loadNested: (json: unknown, name: string) => Surrogate,
  ) => Surrogate;
};

/** One line per model type (the type above makes a missing line a compile error). */
export const surrogateLoaders: SurrogateLoaders = {
  gp: gaussianProcessFromFile,
  mlp: mlpSurrogateFromFile,
  ensemble: ensembleFromFile,
  conformal: conformalFromFile,
  "plate-stack": plateStackFromFile,
  composite: compositeNeedsFunction,
};
