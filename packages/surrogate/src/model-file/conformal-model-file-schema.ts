import { z } from "zod";
import { envelopeSchema } from "./envelope-schema.js";

const quantile = z.number().refine((v) => Number.isFinite(v) && v >= 0, "must be a finite number ≥ 0").nullable();

/**
 * Split-conformal payload (see predict/conformal-payload.ts): the base model file (validated fully by
 * the loader), the coverage 1 − α, the score ("absolute" |y − μ| or "normalised" |y − μ|/σ), one
 * calibrated quantile per target (null: unbounded) and the calibration-set size.
 */
export const conformalPayloadSchema = z.object({
  base: z.looseObject({ modelType: z.string() }),
  coverage: z.number().gt(0).lt(1),
  score: z.enum(["absolute", "normalised"]),
  quantiles: z.array(quantile).min(1),
  calibrationSize: z.number().int().min(1),
});

/** The whole conformal model file. */
export const conformalModelFileSchema = envelopeSchema("conformal", conformalPayloadSchema);

/** A conformal model file as written by `ConformalSurrogate.toJSON()`. */
export type ConformalModelFile = z.infer<typeof conformalModelFileSchema>;
