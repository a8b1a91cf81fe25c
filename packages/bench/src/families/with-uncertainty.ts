import { fitConformal, fitEnsemble, type Surrogate, type SurrogateTrainer, type TrainingData } from "@floorcast/surrogate";
import { parseWhole } from "../cli/parse-whole.js";
import { UsageError } from "../cli/usage-error.js";
import type { FamilyOption, FitOptions, ModelFamily } from "./model-family.js";

/** `--ensemble K`, `--conformal C` and `--calibration-fraction F`: options of every family. */
export const UNCERTAINTY_OPTIONS: readonly FamilyOption[] = [
  { flags: "--ensemble <k>", description: "any model: deep ensemble of k members from different seeds (mean and spread)" },
  { flags: "--conformal <coverage>", description: "any model: split-conformal intervals with this coverage, e.g. 0.9" },
  { flags: "--calibration-fraction <f>", description: "with --conformal: share of rows held out for calibration", default: "0.25" },
];

/**
 * Fits a family with `--ensemble` and `--conformal` applied: an ensemble of k fits (Lakshminarayanan et al. 2017),
 * then (optionally) split-conformal calibration on held-out rows (Lei et al. 2018).
 * @param family - the family.
 * @param data - training rows.
 * @param opts - parsed options, defaults filled in.
 * @param seed - the seed.
 * @param say - writes a note.
 * @returns the fitted surrogate.
 * @throws UsageError for a bad option value.
 */
export async function fitWithUncertainty(family: ModelFamily, data: TrainingData, opts: FitOptions, seed: number, say: (line: string) => void): Promise<Surrogate> {
  const k = opts.ensemble === undefined ? 1 : parseWhole("fit", "--ensemble", String(opts.ensemble), 2);
  const fit = family.fit?.bind(family);
  if (!fit) throw new UsageError(`fit: --model ${family.name} fits from the CSV itself`);
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
}
