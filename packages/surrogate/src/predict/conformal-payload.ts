import type { ModelFileShape } from "./model-file-shape.js";

/**
 * The payload of a "conformal" model file: the base model's file and split-conformal quantiles
 * (Lei et al. 2018, §2.2), one per target. The interval is μ ± q ("absolute" scores |y − μ|) or
 * μ ± q·σ ("normalised" scores |y − μ| / σ, used when the base gives an sd). `quantile` is null
 * when the calibration set is too small for the coverage (the interval is then unbounded).
 */
export interface ConformalPayload {
  readonly base: ModelFileShape;
  readonly coverage: number;
  readonly score: "absolute" | "normalised";
  readonly quantiles: readonly (number | null)[];
  readonly calibrationSize: number;
}
