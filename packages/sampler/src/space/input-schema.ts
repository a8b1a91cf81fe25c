import { z } from "zod";
import type { Variable } from "./variable.js";

const finite = z.number().refine(Number.isFinite, "must be a finite number");

/**
 * The zod schema of one input's entry in a dataset manifest's or a model file's `inputSchema`: its kind, bounds,
 * scale (and step) or levels. A model file's copy is checked by the surrogate package's own schema of the same
 * shape (the surrogate package does not import the sampler).
 */
export const inputSchemaEntrySchema = z.discriminatedUnion("kind", [
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
]);

/** One input's entry in an input schema (see inputSchemaEntrySchema). */
export type InputSchemaEntry = z.infer<typeof inputSchemaEntrySchema>;

/**
 * The input schema of a variable list, as manifests and model files record it (unit and description left out).
 * @param variables - the variables, in order.
 * @returns one entry per variable.
 */
export function inputSchemaOf(variables: readonly Variable[]): InputSchemaEntry[] {
  return variables.map((v): InputSchemaEntry => {
    if (v.kind === "categorical") return { name: v.name, kind: "categorical", levels: [...v.levels] };
    if (v.kind === "integer") return { name: v.name, kind: "integer", min: v.min, max: v.max };
    return { name: v.name, kind: "continuous", min: v.min, max: v.max, scale: v.log === true ? "log" : "linear", ...(v.step === undefined ? {} : { step: v.step }) };
  });
}

/**
 * The variables an input schema describes (the inverse of inputSchemaOf).
 * @param schema - the entries.
 * @returns one variable per entry.
 */
export function variablesOfSchema(schema: readonly InputSchemaEntry[]): Variable[] {
  return schema.map((e): Variable => {
    if (e.kind === "categorical") return { kind: "categorical", name: e.name, levels: e.levels };
    if (e.kind === "integer") return { kind: "integer", name: e.name, min: e.min, max: e.max };
    return { kind: "continuous", name: e.name, min: e.min, max: e.max, ...(e.scale === "log" ? { log: true } : {}), ...(e.step === undefined ? {} : { step: e.step }) };
  });
}
