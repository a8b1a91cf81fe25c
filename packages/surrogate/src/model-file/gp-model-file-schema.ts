import { z } from "zod";
import { envelopeSchema } from "./envelope-schema.js";

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const positive = finite.refine((v) => v > 0, "must be > 0");

/** One target's conditioned GP: hyperparameters (scaled units), the jitter used, weights α = (K + σ_n²I)⁻¹y. */
export const gpComponentSchema = z.object({
  lengthscales: z.array(positive).min(1),
  signalVariance: positive,
  noiseVariance: finite.refine((v) => v >= 0, "must be ≥ 0"),
  jitter: finite.refine((v) => v >= 0, "must be ≥ 0"),
  alpha: z.array(finite),
  logMarginalLikelihood: finite,
});

/** GP payload: kernel family, ARD flag, training inputs in the unit-cube scaling, one component per target. */
export const gpPayloadSchema = z.object({
  kernel: z.enum(["se", "matern32", "matern52"]),
  ard: z.boolean(),
  trainingInputs: z.array(z.array(finite)).min(1),
  components: z.array(gpComponentSchema).min(1),
});

/** The whole GP model file (envelope + GP payload). */
export const gpModelFileSchema = envelopeSchema("gp", gpPayloadSchema);

/** A GP model file as written by `GaussianProcess.toJSON()`. */
export type GpModelFile = z.infer<typeof gpModelFileSchema>;
