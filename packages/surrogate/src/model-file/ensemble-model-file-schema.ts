import { z } from "zod";
import { envelopeSchema } from "./envelope-schema.js";

/**
 * Ensemble payload: the members' complete model files. Each member is checked here only for being an
 * object with a modelType; the loader validates it fully with parseModelFile (errors name
 * `payload.members[i]`).
 */
export const ensemblePayloadSchema = z.object({
  members: z.array(z.looseObject({ modelType: z.string() })).min(1),
});

/** The whole ensemble model file. */
export const ensembleModelFileSchema = envelopeSchema("ensemble", ensemblePayloadSchema);

/** An ensemble model file as written by `EnsembleSurrogate.toJSON()`. */
export type EnsembleModelFile = z.infer<typeof ensembleModelFileSchema>;
