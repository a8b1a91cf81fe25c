import { z } from "zod";
import { sealModelFile } from "./seal-model-file.js";

const finite = z.number().refine(Number.isFinite, "must be a finite number");

/**
 * The zod schema of a model file's `inputSchema`: per input, in the order of `inputs`, its kind, bounds, scale
 * (and step) or levels, copied from the dataset manifest the model was fitted on. A categorical input's model-row
 * value is its level when the level is a number, else its position in `levels`. Defined here, in the shape the
 * sampler's manifests use, because this package does not import the sampler.
 */
export const inputSchemaSchema = z.array(
  z.discriminatedUnion("kind", [
    z.strictObject({
      name: z.string().min(1),
      kind: z.literal("continuous"),
      min: finite,
      max: finite,
      scale: z.enum(["linear", "log"]),
      step: finite.optional(),
    }),
    z.strictObject({ name: z.string().min(1), kind: z.literal("integer"), min: finite, max: finite }),
    z.strictObject({ name: z.string().min(1), kind: z.literal("categorical"), levels: z.array(z.union([z.string(), finite])).min(1) }),
  ]),
);

/** A model file's input schema (see inputSchemaSchema). */
export type InputSchema = z.infer<typeof inputSchemaSchema>;

/**
 * A copy of a model file carrying `inputSchema`, checked against the file's `inputs` (same names, same order).
 * A file that carries a checksum is sealed again (sealModelFile): the checksum covers the schema.
 * @param file - a model file object (as a surrogate's toJSON builds it).
 * @param schema - one entry per input, in the order of `inputs`.
 * @returns the file with `inputSchema` placed after `targets`.
 * @throws TypeError for a file without `inputs`; RangeError when the schema is malformed or its names differ.
 */
export function withInputSchema<T extends object>(file: T, schema: InputSchema): T & { inputSchema: InputSchema } {
  const inputs = (file as { inputs?: unknown }).inputs;
  if (!Array.isArray(inputs)) throw new TypeError("withInputSchema: file.inputs must be an array");
  const parsed = inputSchemaSchema.safeParse(schema);
  if (!parsed.success) throw new RangeError(`withInputSchema: schema: ${parsed.error.issues[0]?.message ?? "malformed"}`);
  const names = parsed.data.map((e) => e.name);
  if (names.join("\u0000") !== inputs.join("\u0000")) {
    throw new RangeError(`withInputSchema: schema names ${names.join(", ")} must be the file's inputs ${inputs.join(", ")}, in order`);
  }
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(file)) {
    if (k === "inputSchema") continue;
    out[k] = v;
    if (k === "targets") out.inputSchema = parsed.data;
  }
  if (!("inputSchema" in out)) out.inputSchema = parsed.data;
  return ("checksum" in out ? sealModelFile(out) : out) as T & { inputSchema: InputSchema };
}
