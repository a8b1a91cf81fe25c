import { z } from "zod";
import { MODEL_FILE_KIND, MODEL_FORMAT_VERSION } from "./model-file-version.js";
import { inputSchemaSchema } from "./input-schema.js";

const finite = z.number().refine(Number.isFinite, "must be a finite number");
/** Column names: non-empty strings, each once (a duplicate would make rows ambiguous). */
const names = z
  .array(z.string().min(1))
  .min(1)
  .refine((v) => new Set(v).size === v.length, { message: "must not repeat a name" });

/** Training summary every envelope carries; families add their own fields (the object is open). */
export const trainingSummarySchema = z.looseObject({
  n: z.number().int().nonnegative(),
  seed: z.number(),
  /** Written by files before fit times left the file (the same rows and options now give the same bytes). */
  fitTimeMs: z.number().nonnegative().optional(),
});

/**
 * The zod schema of one model type's file: the shared versioned envelope (kind, formatVersion, optional caution, modelType,
 * inputs, targets, optional inputSchema, inputScaling, outputScaling, payload, training, optional checksum) around `payload`.
 * Each model type builds its schema with this and adds one line to `model-file-schema.ts`.
 * @param modelType - the discriminator value, e.g. "gp".
 * @param payload - the type-specific payload schema.
 * @returns the envelope schema (a zod object, usable in a discriminated union).
 */
export function envelopeSchema<T extends string, P extends z.ZodType>(modelType: T, payload: P) {
  return z.object({
    kind: z.literal(MODEL_FILE_KIND),
    formatVersion: z.literal(MODEL_FORMAT_VERSION),
    modelType: z.literal(modelType),
    /** The caution users see with the model's numbers (withCaution); files written before it lack it. */
    caution: z.string().min(1).optional(),
    inputs: names,
    targets: names,
    /** Kind, bounds, scale and levels of each input (files written before it lack it, and load with a note). */
    inputSchema: inputSchemaSchema.optional(),
    inputScaling: z.object({ lower: z.array(finite), upper: z.array(finite) }),
    outputScaling: z.object({ mean: z.array(finite), std: z.array(finite.refine((v) => v > 0, "must be > 0")) }),
    payload,
    training: trainingSummarySchema,
    checksum: z.string().optional(),
  });
}
