import { z } from "zod";
import { envelopeSchema } from "./envelope-schema.js";
import { PLATE_STACK_RULE_NAME } from "../predict/plate-stack-rule.js";
import { PLATE_STACK_QUANTITIES } from "../predict/plate-stack-payload.js";

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const source = z.union([
  z.strictObject({ value: finite }),
  z.strictObject({ input: z.string().min(1) }),
  z.strictObject({ input: z.string().min(1), levels: z.array(finite).min(1) }),
]);
/** An inner quantity: a constant, or a complete gp/mlp model file (validated fully by loadSurrogate). */
const inner = z.union([
  z.strictObject({ constant: finite }),
  z.strictObject({
    model: z.looseObject({ modelType: z.enum(["gp", "mlp"]), inputs: z.array(z.string()) }),
    trend: z.strictObject({ pieces: z.array(z.array(finite).min(1)).min(1) }).optional(),
  }).refine((q) => q.trend === undefined || q.trend.pieces.every((p) => p.length === q.model.inputs.length + 1), {
    message: "trend pieces must have one intercept and one slope per input of the inner model",
    path: ["trend", "pieces"],
  }),
]);
const slot = z.enum(["floorHeight", "maxHeight", "maxFar", "maxCoverage", "minPlateWidth", "minPlateArea", "skyPlaneStart", "skyPlaneRatio"]);

/** Plate-stack payload (see PlateStackPayload in the predictor's plate-stack-payload.ts). */
export const plateStackPayloadSchema = z.object({
  rule: z.literal(PLATE_STACK_RULE_NAME),
  ruleValues: z
    .partialRecord(slot, source)
    .refine((r) => r.floorHeight !== undefined && r.maxHeight !== undefined, "must give floorHeight and maxHeight"),
  geometryInputs: z.array(z.string().min(1)),
  coverageInput: z.string().min(1).nullable(),
  quantities: z.object({
    lotArea: inner,
    buildableArea: inner,
    baseWidth: inner.optional(),
    cutArea: inner.optional(),
    cutWidth: inner.optional(),
  }),
  draws: z.array(z.array(finite).length(PLATE_STACK_QUANTITIES.length)),
  pointMode: z.enum(["expected", "plugin"]),
});

/** The whole plate-stack model file. */
export const plateStackModelFileSchema = envelopeSchema("plate-stack", plateStackPayloadSchema);

/** A plate-stack model file as written by `PlateStackSurrogate.toJSON()`. */
export type PlateStackModelFile = z.infer<typeof plateStackModelFileSchema>;
