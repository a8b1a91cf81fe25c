import { z } from "zod";
import { gpModelFileSchema } from "./gp-model-file-schema.js";
import { mlpModelFileSchema } from "./mlp-model-file-schema.js";
import { ensembleModelFileSchema } from "./ensemble-model-file-schema.js";
import { conformalModelFileSchema } from "./conformal-model-file-schema.js";
import { plateStackModelFileSchema } from "./plate-stack-model-file-schema.js";
import { compositeModelFileSchema } from "./composite-model-file-schema.js";

/**
 * Every surrogate model file, discriminated by `modelType`. To add a model type, write its
 * `envelopeSchema("<type>", payload)` in its own file and add ONE line to this list, plus one line
 * to `surrogate-loaders.ts`.
 */
export const modelFileSchema = z.discriminatedUnion("modelType", [
  gpModelFileSchema,
  mlpModelFileSchema,
  ensembleModelFileSchema,
  conformalModelFileSchema,
  plateStackModelFileSchema,
  compositeModelFileSchema,
]);

/** Any parsed surrogate model file. */
export type ModelFile = z.infer<typeof modelFileSchema>;
