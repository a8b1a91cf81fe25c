import type { Prediction, Surrogate } from "../surrogate-types.js";
import { conformalInterval } from "../predict/conformal-interval.js";
import { memberEnvelope } from "./member-envelope.js";
import { sealModelFile } from "../model-file/seal-model-file.js";

/** The calibration a {@link ConformalSurrogate} carries. */
export interface ConformalCalibration {
  /** 1 − α. */
  readonly coverage: number;
  /** "absolute": |y − μ|; "normalised": |y − μ| / σ (needs a base that gives sd). */
  readonly score: "absolute" | "normalised";
  /** One quantile per target; null when the calibration set is too small (unbounded interval). */
  readonly quantiles: readonly (number | null)[];
  readonly calibrationSize: number;
}

/**
 * A split-conformal wrapper (Lei et al. 2018) around any fitted surrogate: predictions are the
 * base's mean (and sd), plus an interval μ ± q (absolute scores) or μ ± q·σ (normalised scores) per
 * target that covers a new exchangeable point with probability ≥ coverage.
 */
export class ConformalSurrogate implements Surrogate {
  readonly kind = "conformal";
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly base: Surrogate;
  readonly calibration: ConformalCalibration;
  /** Gradient of the base mean; present when the base has one. */
  readonly gradient?: (x: readonly number[]) => number[][];
  readonly #file: Record<string, unknown>;

  /**
   * @param base - the fitted surrogate.
   * @param calibration - from {@link calibrateConformal} or a model file.
   * @param training - summary stored in the file.
   */
  constructor(base: Surrogate, calibration: ConformalCalibration, training: Record<string, unknown>) {
    this.base = base;
    this.calibration = { ...calibration, quantiles: [...calibration.quantiles] };
    this.inputs = base.inputs;
    this.targets = base.targets;
    const env = memberEnvelope("ConformalSurrogate", "base", base.toJSON());
    this.#file = {
      kind: "floorcast.surrogate",
      formatVersion: 1,
      modelType: "conformal",
      inputs: [...base.inputs],
      targets: [...base.targets],
      inputScaling: env.inputScaling,
      outputScaling: env.outputScaling,
      payload: { base: env.file, ...this.calibration },
      training,
    };
    const g = (base as { gradient?: (x: readonly number[]) => number[][] }).gradient;
    if (typeof g === "function") this.gradient = (x) => g.call(base, x);
  }

  /** Base mean (and sd) with the conformal interval, rows × targets. */
  predict(x: readonly (readonly number[])[]): Prediction {
    const p = this.base.predict(x);
    if (this.calibration.score === "normalised" && !p.sd) {
      throw new RangeError("ConformalSurrogate.predict: normalised scores need a base that gives sd");
    }
    const { lower, upper } = conformalInterval(p.mean, p.sd, this.calibration.quantiles, this.calibration.score);
    const interval = { lower, upper, coverage: this.calibration.coverage };
    return p.sd ? { mean: p.mean, sd: p.sd, interval } : { mean: p.mean, interval };
  }

  /** The "conformal" model file, nesting the base's file. */
  toJSON(): Record<string, unknown> {
    return sealModelFile(this.#file);
  }
}
