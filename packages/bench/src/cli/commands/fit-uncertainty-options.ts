import type { Command } from "commander";
import { fitConformal, fitEnsemble, type Surrogate, type SurrogateTrainer, type TrainingData } from "@floorcast/surrogate";
import { UsageError } from "../usage-error.js";

type Opts = Record<string, string | boolean | undefined>;
type Fitter<O extends Opts> = (data: TrainingData, opts: O, seed: number, say: (line: string) => void) => Promise<Surrogate>;

/**
 * Adds `--ensemble K`, `--conformal C` and `--calibration-fraction F` to `floorcast fit` (any model family).
 * @param cmd - the fit command.
 */
export function addUncertaintyOptions(cmd: Command): void {
  cmd
    .option("--ensemble <k>", "any model: deep ensemble of k members from different seeds (mean and spread)")
    .option("--conformal <coverage>", "any model: split-conformal intervals with this coverage, e.g. 0.9")
    .option("--calibration-fraction <f>", "with --conformal: share of rows held out for calibration", "0.25");
}

/**
 * Wraps a family's fitter so `--ensemble` and `--conformal` apply to it: an ensemble of k fits,
 * then (optionally) split-conformal calibration on held-out rows.
 * @param fit - the family's fitter.
 * @returns a fitter with the same signature.
 */
export function withUncertainty<O extends Opts>(fit: Fitter<O>): Fitter<O> {
  return async (data, opts, seed, say) => {
    const k = opts.ensemble === undefined ? 1 : Number(opts.ensemble);
    if (!Number.isInteger(k) || k < 2) {
      if (opts.ensemble !== undefined) throw new UsageError(`fit: --ensemble must be an integer ≥ 2, got ${String(opts.ensemble)}`);
    }
    const base: SurrogateTrainer = (d, s) => fit(d, opts, s, say);
    const trainer: SurrogateTrainer = k > 1 ? (d, s) => fitEnsemble(base, d, { members: k, seed: s }) : base;
    if (opts.conformal === undefined) return trainer(data, seed);
    const coverage = Number(opts.conformal);
    if (!(coverage > 0 && coverage < 1)) throw new UsageError(`fit: --conformal must be a coverage in (0, 1), got ${String(opts.conformal)}`);
    const fraction = Number(opts.calibrationFraction);
    if (!(fraction > 0 && fraction < 1)) throw new UsageError(`fit: --calibration-fraction must be in (0, 1), got ${String(opts.calibrationFraction)}`);
    const c = await fitConformal(trainer, data, { coverage, calibrationFraction: fraction, seed });
    const q = c.calibration.quantiles.map((v, j) => `${data.targets[j]} ${v === null ? "unbounded" : v.toPrecision(4)}`);
    say(`fit: conformal ${coverage} (${c.calibration.score} scores, ${c.calibration.calibrationSize} held-out rows): ${q.join(", ")}`);
    return c;
  };
}
