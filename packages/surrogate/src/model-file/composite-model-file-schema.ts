import { z } from "zod";
import { envelopeSchema } from "./envelope-schema.js";

const finite = z.number().refine(Number.isFinite, "must be a finite number");

/** Composite payload: the combining function's name, each intermediate's model file, the QMC draws (one column per intermediate). */
export const compositePayloadSchema = z.object({
  combine: z.string().min(1),
  intermediates: z.array(z.strictObject({ name: z.string().min(1), model: z.looseObject({ modelType: z.string() }) })).min(1),
  draws: z.array(z.array(finite)),
});

/** The whole composite model file. */
export const compositeModelFileSchema = envelopeSchema("composite", compositePayloadSchema);

/** A composite model file as written by `CompositeSurrogate.toJSON()`. */
export type CompositeModelFile = z.infer<typeof compositeModelFileSchema>;
