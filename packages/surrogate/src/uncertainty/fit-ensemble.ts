import seedrandom from "seedrandom";
import type { SurrogateTrainer, TrainingData } from "../surrogate-types.js";
import { checkWrapperArgs } from "./check-wrapper-args.js";
import { EnsembleSurrogate } from "./ensemble-surrogate.js";

/** Options of {@link fitEnsemble}. */
export interface EnsembleOptions {
  /** Number of members k (default 5, the paper's choice). */
  readonly members?: number;
  /** Seed from which the members' seeds are drawn (default 0). */
  readonly seed?: number;
}

/**
 * Fits a deep ensemble (Lakshminarayanan, Pritzel & Blundell 2017): k members trained by `trainer`
 * on the same data from different seeds (drawn with seedrandom from `seed`), one after another.
 * @param trainer - fits one member, e.g. `mlpTrainer({...})` from `@floorcast/surrogate/nn` or a GP trainer.
 * @param data - training rows.
 * @param options - members k and seed.
 * @returns the fitted ensemble.
 * @throws TypeError / RangeError for bad data or options.
 */
export async function fitEnsemble(
  trainer: SurrogateTrainer,
  data: TrainingData,
  options: EnsembleOptions = {},
): Promise<EnsembleSurrogate> {
  const fn = "fitEnsemble";
  const seed = checkWrapperArgs(fn, trainer, data, options.seed);
  const k = options.members ?? 5;
  if (typeof k !== "number") throw new TypeError(`${fn}: options.members must be a number`);
  if (!Number.isInteger(k) || k < 1) throw new RangeError(`${fn}: options.members must be an integer ≥ 1, got ${k}`);
  const rng = seedrandom(`floorcast-ensemble:${seed}`);
  const memberSeeds = Array.from({ length: k }, () => Math.floor(rng() * 2 ** 31));
  const members = [];
  for (const s of memberSeeds) members.push(await trainer(data, s));
  return new EnsembleSurrogate(members, { n: data.x.length, seed, memberSeeds });
}
