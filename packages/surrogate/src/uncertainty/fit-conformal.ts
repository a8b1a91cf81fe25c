import seedrandom from "seedrandom";
import type { SurrogateTrainer, TrainingData } from "../surrogate-types.js";
import { checkWrapperArgs } from "./check-wrapper-args.js";
import { shuffleInPlace } from "../seeded-shuffle.js";
import { calibrateConformal, type ConformalOptions } from "./calibrate-conformal.js";
import { minCalibrationRows } from "./min-calibration-rows.js";
import type { ConformalSurrogate } from "./conformal-surrogate.js";

/** Options of {@link fitConformal}. */
export interface FitConformalOptions extends ConformalOptions {
  /** Share of rows held out for calibration (default 0.25). */
  readonly calibrationFraction?: number;
  /** Seed of the split and of the trainer (default 0). */
  readonly seed?: number;
}

/**
 * Split conformal prediction (Lei et al. 2018, §2.2): splits the rows at random (seeded) into a
 * training part, on which `trainer` fits the base model, and a calibration part, on which the
 * interval quantiles are computed.
 * @param trainer - fits the base (GP, MLP or ensemble trainer).
 * @param data - all rows; at least 2.
 * @param options - coverage, score, calibration fraction, seed.
 * @returns the calibrated wrapper.
 * @throws TypeError / RangeError for bad data or options.
 */
export async function fitConformal(
  trainer: SurrogateTrainer,
  data: TrainingData,
  options: FitConformalOptions = {},
): Promise<ConformalSurrogate> {
  const fn = "fitConformal";
  const seed = checkWrapperArgs(fn, trainer, data, options.seed);
  const f = options.calibrationFraction ?? 0.25;
  if (typeof f !== "number") throw new TypeError(`${fn}: options.calibrationFraction must be a number`);
  if (!(f > 0 && f < 1)) throw new RangeError(`${fn}: options.calibrationFraction must be in (0, 1), got ${f}`);
  const n = data.x.length;
  const nCal = Math.round(n * f);
  if (nCal < 1 || n - nCal < 1) throw new RangeError(`${fn}: data.x needs rows for both training and calibration, got ${n}`);
  const coverage = options.coverage ?? 0.9;
  // Checked before the base is trained: a calibration part too small for the coverage gives no bounded interval.
  if (typeof coverage === "number" && coverage > 0 && coverage < 1 && nCal < minCalibrationRows(coverage)) {
    throw new RangeError(
      `${fn}: ${nCal} calibration rows (${n} × calibrationFraction ${f}) are too few for coverage ${coverage}: ` +
        `it needs at least ${minCalibrationRows(coverage)} for a bounded interval`,
    );
  }
  const rng = seedrandom(`floorcast-conformal:${seed}`);
  const order = Array.from({ length: n }, (_, i) => i);
  shuffleInPlace(order, rng);
  const cal = order.slice(0, nCal);
  const fit = order.slice(nCal);
  const base = await trainer(
    { inputs: data.inputs, targets: data.targets, x: fit.map((i) => data.x[i]!), y: fit.map((i) => data.y[i]!) },
    seed,
  );
  return calibrateConformal(
    base,
    { x: cal.map((i) => data.x[i]!), y: cal.map((i) => data.y[i]!) },
    options,
    { n, seed, calibrationFraction: f },
  );
}
