import type { ModelFileShape } from "./model-file-shape.js";
import type { Predictor, PredictorOutput } from "./predictor.js";
import { objectField } from "./predictor-checks.js";
import { conformalInterval } from "./conformal-interval.js";

/**
 * Builds a predictor for a "conformal" model file (see conformal-payload.ts):
 * the base model's mean and sd, plus split-conformal intervals with the file's coverage.
 * @param file - the conformal model file.
 * @param load - loads the base model file (the dispatching loader).
 * @throws TypeError / RangeError for a malformed payload.
 */
export function createConformalPredictor(file: ModelFileShape, load: (base: unknown) => Predictor): Predictor {
  const fn = "loadPredictor";
  const payload = objectField(fn, "payload", file.payload);
  const base = load(payload.base);
  const coverage = payload.coverage;
  if (typeof coverage !== "number" || !(coverage > 0 && coverage < 1)) {
    throw new RangeError(`${fn}: payload.coverage must be in (0, 1), got ${String(coverage)}`);
  }
  const score = payload.score;
  if (score !== "absolute" && score !== "normalised") {
    throw new RangeError(`${fn}: payload.score must be "absolute" or "normalised", got ${String(score)}`);
  }
  const q = payload.quantiles;
  if (!Array.isArray(q) || q.length !== file.targets.length || !q.every((v) => v === null || (typeof v === "number" && v >= 0 && Number.isFinite(v)))) {
    throw new RangeError(`${fn}: payload.quantiles must hold ${file.targets.length} values ≥ 0 (or null)`);
  }
  const quantiles = q as (number | null)[];
  return {
    modelType: "conformal",
    inputs: [...file.inputs],
    targets: [...file.targets],
    predict(x: readonly (readonly number[])[]): PredictorOutput {
      const p = base.predict(x);
      if (score === "normalised" && !p.sd) throw new RangeError(`${fn}: normalised scores need a base model that gives sd`);
      const { lower, upper } = conformalInterval(p.mean, p.sd, quantiles, score);
      return p.sd ? { mean: p.mean, sd: p.sd, interval: { lower, upper, coverage } } : { mean: p.mean, interval: { lower, upper, coverage } };
    },
  };
}
