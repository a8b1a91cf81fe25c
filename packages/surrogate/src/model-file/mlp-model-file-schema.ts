import { z } from "zod";
import { envelopeSchema } from "./envelope-schema.js";

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const width = z.number().int().min(1);

/** One dense layer: declared shape [inputs, outputs], row-major weights, biases. */
export const mlpLayerSchema = z
  .object({ shape: z.tuple([width, width]), weights: z.array(finite), bias: z.array(finite) })
  .superRefine((l, ctx) => {
    if (l.weights.length !== l.shape[0] * l.shape[1]) {
      ctx.addIssue({ code: "custom", path: ["weights"], message: `must have ${l.shape[0] * l.shape[1]} values (shape ${l.shape.join("×")}), got ${l.weights.length}` });
    }
    if (l.bias.length !== l.shape[1]) {
      ctx.addIssue({ code: "custom", path: ["bias"], message: `must have ${l.shape[1]} values, got ${l.bias.length}` });
    }
  });

/** MLP payload (see predict/mlp-payload.ts for the arithmetic): hidden activation and the dense layers. */
export const mlpPayloadSchema = z.object({
  activation: z.enum(["relu", "tanh", "elu"]),
  layers: z.array(mlpLayerSchema).min(1),
});

/** The whole MLP model file (envelope + MLP payload). */
export const mlpModelFileSchema = envelopeSchema("mlp", mlpPayloadSchema);

/** An MLP model file as written by `MlpSurrogate.toJSON()`. */
export type MlpModelFileParsed = z.infer<typeof mlpModelFileSchema>;
