import type { Surrogate } from "../surrogate-types.js";
import { checkMatrix } from "../check-training-data.js";
import { SD_FLOOR } from "../predict/conformal-interval.js";
import { conformalQuantile } from "./conformal-quantile.js";
import { minCalibrationRows } from "./min-calibration-rows.js";
import { ConformalSurrogate } from "./conformal-surrogate.js";

/** Options of {@link calibrateConformal}. */
export interface ConformalOptions {
  /** Nominal coverage 1 − α in (0, 1) (default 0.9). */
  readonly coverage?: number;
  /**
   * Conformity score: "absolute" |y − μ| (constant-width intervals), "normalised" |y − μ| / σ
   * (width follows the base's sd; Lei et al. 2018 §5.2, locally weighted), or "auto" (default):
   * normalised when the base gives sd (GP, ensemble), absolute otherwise (single MLP).
   */
  readonly score?: "absolute" | "normalised" | "auto";
}

/**
 * Calibrates split-conformal intervals (Lei et al. 2018, §2.2) for a fitted surrogate on held-out
 * rows it was not trained on: per target, the ⌈(n+1)(1−α)⌉-th smallest score.
 * @param base - any fitted surrogate (GP, MLP, ensemble).
 * @param calibration - held-out rows `{ x, y }` (rows × inputs, rows × targets).
 * @param options - coverage and score.
 * @param training - summary fields stored in the model file (n, seed, fit time of the whole procedure).
 * @returns the wrapped surrogate.
 * @throws TypeError / RangeError for bad rows or options (naming row and column).
 */
export function calibrateConformal(
  base: Surrogate,
  calibration: { readonly x: readonly (readonly number[])[]; readonly y: readonly (readonly number[])[] },
  options: ConformalOptions = {},
  training: Record<string, unknown> = {},
): ConformalSurrogate {
  const fn = "calibrateConformal";
  const coverage = options.coverage ?? 0.9;
  if (typeof coverage !== "number") throw new TypeError(`${fn}: options.coverage must be a number`);
  if (!(coverage > 0 && coverage < 1)) throw new RangeError(`${fn}: options.coverage must be in (0, 1), got ${coverage}`);
  const requested = options.score ?? "auto";
  if (requested !== "auto" && requested !== "absolute" && requested !== "normalised") {
    throw new RangeError(`${fn}: options.score must be auto, absolute or normalised, got ${String(requested)}`);
  }
  checkMatrix(fn, "calibration.x", calibration.x, base.inputs.length);
  checkMatrix(fn, "calibration.y", calibration.y, base.targets.length);
  const n = calibration.x.length;
  if (n === 0) throw new RangeError(`${fn}: calibration.x must have at least one row, got 0`);
  if (calibration.y.length !== n) throw new RangeError(`${fn}: calibration.y must have ${n} rows, got ${calibration.y.length}`);
  const least = minCalibrationRows(coverage);
  if (n < least) {
    throw new RangeError(`${fn}: calibration.x has ${n} rows; coverage ${coverage} needs at least ${least} for a bounded interval`);
  }
  const p = base.predict(calibration.x);
  const score = requested === "auto" ? (p.sd ? "normalised" : "absolute") : requested;
  if (score === "normalised" && !p.sd) throw new RangeError(`${fn}: options.score "normalised" needs a base that gives sd`);
  const quantiles = base.targets.map((_, j) => {
    const s = calibration.y.map((row, i) => {
      const r = Math.abs(row[j]! - p.mean[i]![j]!);
      return score === "normalised" ? r / Math.max(p.sd![i]![j]!, SD_FLOOR) : r;
    });
    return conformalQuantile(s, coverage);
  });
  return new ConformalSurrogate(base, { coverage, score, quantiles, calibrationSize: n }, { seed: 0, ...training, n: (training.n as number | undefined) ?? n, calibrationSize: n });
}
