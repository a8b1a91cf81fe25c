import { MASSING_OUTPUT_COLUMNS, type MassingInput } from "@floorcast/sampler";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import type { FitOptions } from "../families/model-family.js";
import { kendallTau } from "../harness/kendall-tau.js";
import { reevaluateSurrogateOptimum } from "../harness/reevaluate-surrogate-optimum.js";
import { spearmanRho } from "../harness/spearman-rho.js";
import { surrogateEvaluator } from "../harness/surrogate-evaluator.js";
import { topKOverlap } from "../harness/top-k-overlap.js";
import type { Objective, OptimizationProblem, OutputConstraint } from "../optimize/optimization-problem.js";
import { optimizerNamed } from "../optimize/optimizers.js";
import { scoreOutputs } from "../optimize/evaluation-session.js";
import { parcelDescriptors } from "./parcel-descriptors.js";
import { PARCEL_DESIGN_VARIABLES } from "./parcel-design-variables.js";
import { parcelEvaluator } from "./parcel-evaluator.js";
import type { ParcelOptimum, ParcelRanking, RankAgreement, RankedParcel, SurrogateParcelOptimum } from "./parcel-ranking.js";
import { trainParcelSurrogate } from "./train-parcel-surrogate.js";

/** Options of {@link rankParcels}. */
export interface RankParcelsOptions {
  /** "exact": an optimizer per parcel on the exact rule; "surrogate": on a cross-parcel surrogate; "both" (compared). */
  readonly route: "exact" | "surrogate" | "both";
  /** Default: maximise gfa. */
  readonly objective?: Objective;
  readonly constraints?: readonly OutputConstraint[];
  /** A registered single-objective optimizer (default "pso"). */
  readonly optimizer?: string;
  /** Evaluations per parcel: exact ones on the exact route, surrogate ones on the surrogate route (default 150). */
  readonly budget?: number;
  /** Seed of every optimizer run, the training design and the fit (default 1). */
  readonly seed?: number;
  /** Shortlist length of the top-k overlap (default min(3, parcels)). */
  readonly shortlist?: number;
  /** The surrogate route (required with route "surrogate" or "both"). */
  readonly surrogate?: {
    /** Folder for the training CSV, its manifest and the model file. */
    readonly dir: string;
    /** Parcels the training designs are drawn on (default ⌈2/3⌉ of them). */
    readonly trainingParcels?: number;
    /** Exact evaluations in the training set (default 8 per training parcel). */
    readonly rows?: number;
    /** Registered family (default "gp"). */
    readonly model?: string;
    readonly fitOptions?: FitOptions;
    /** Surrogate choices tried exactly per parcel when the first is exactly infeasible (default 3). */
    readonly candidates?: number;
  };
  /** Progress: stage ("exact", "training", "surrogate"), steps done, steps in the stage. */
  readonly onProgress?: (stage: string, done: number, total: number) => void;
}

const fn = "rankParcels";

function checkCount(name: string, v: number | undefined, lo: number, hi: number): void {
  if (v === undefined) return;
  if (typeof v !== "number") throw new TypeError(`${fn}: ${name} must be a number, got ${typeof v}`);
  if (!Number.isInteger(v) || v < lo || v > hi) throw new RangeError(`${fn}: ${name} must be an integer in [${lo}, ${hi}], got ${v}`);
}

/** 1-based ranks by score (higher first; ties and nulls by position, nulls last). */
function ranksOf(scores: readonly (number | null)[]): number[] {
  const order = scores.map((_, i) => i).sort((a, b) => {
    const x = scores[a]!;
    const y = scores[b]!;
    if (x === null || y === null) return x === null && y === null ? a - b : x === null ? 1 : -1;
    return y - x || a - b;
  });
  const ranks = new Array<number>(scores.length);
  order.forEach((i, r) => (ranks[i] = r + 1));
  return ranks;
}

/** Scores for the rank statistics: sense-signed values, a parcel without one just below the worst. */
function scoresOf(values: readonly (number | null)[], sign: number): number[] {
  const finite = values.filter((v): v is number => v !== null).map((v) => sign * v);
  const floor = finite.length > 0 ? Math.min(...finite) - 1 : 0;
  return values.map((v) => (v === null ? floor : sign * v));
}

function agreement(exact: readonly number[], other: readonly number[], k: number): RankAgreement {
  return { spearman: spearmanRho(exact, other), kendall: kendallTau(exact, other), topOverlap: topKOverlap(exact, other, k) };
}

/** Training parcels spread over the range of a crude capacity proxy (lot area × FAR cap; no exact evaluation). */
function spreadParcels(zones: readonly MassingInput[], m: number): number[] {
  const proxy = zones.map((z) => {
    const d = parcelDescriptors(z);
    return d.parcelArea * d.farCap;
  });
  const order = zones.map((_, i) => i).sort((a, b) => proxy[a]! - proxy[b]! || a - b);
  const picked = new Set<number>();
  for (let j = 0; j < m; j++) picked.add(order[m === 1 ? 0 : Math.round((j * (order.length - 1)) / (m - 1))]!);
  return [...picked].sort((a, b) => a - b);
}

/**
 * Ranks parcels by their best achievable objective over PARCEL_DESIGN_VARIABLES (yards beyond the minimums,
 * height and coverage up to the caps, floor-to-floor height). The exact route runs a registered optimizer per
 * parcel on the exact rule with `budget` evaluations (seeded). The surrogate route trains one surrogate across
 * parcels on parcel descriptors plus the design variables (trainParcelSurrogate: dataset CSV → fitModelFile →
 * model file → loadSurrogate), runs the optimizer per parcel on it, and re-evaluates its choice exactly
 * (reevaluateSurrogateOptimum: the next candidates when exactly infeasible). With both, the surrogate route's
 * rankings (by re-evaluated and by predicted values) are compared with the exact one: Spearman's rho, Kendall's
 * tau-b and the top-k overlap, as the site-selection benchmark reports them; so is the no-search baseline (one exact
 * evaluation per parcel at the zone's own controls), which says how much of the ranking the parcels' sizes and zones
 * already decide. Estimates for early feasibility studies, not a zoning determination.
 * @param parcels - id and massing input (metres, zone's controls) of each parcel, ≥ 2.
 * @param options - route, objective, optimizer, budget, seed, shortlist, surrogate settings, progress.
 * @returns the ranking, the evaluations each route spent and the agreement.
 * @throws TypeError/RangeError naming the field for bad options.
 */
export async function rankParcels(parcels: readonly { readonly id: string; readonly input: MassingInput }[], options: RankParcelsOptions): Promise<ParcelRanking> {
  if (!Array.isArray(parcels)) throw new TypeError(`${fn}: parcels must be an array`);
  if (parcels.length < 2) throw new RangeError(`${fn}: parcels must hold at least 2 parcels to rank, got ${parcels.length}`);
  if (typeof options !== "object" || options === null) throw new TypeError(`${fn}: options must be an object`);
  if (!["exact", "surrogate", "both"].includes(options.route)) throw new RangeError(`${fn}: route must be exact, surrogate or both, got ${JSON.stringify(options.route)}`);
  const n = parcels.length;
  const objective = options.objective ?? { output: "gfa", sense: "max" };
  const budget = options.budget ?? 150;
  const seed = options.seed ?? 1;
  const shortlist = options.shortlist ?? Math.min(3, n);
  checkCount("budget", budget, 1, 1e7);
  checkCount("seed", seed, 0, 2 ** 31);
  checkCount("shortlist", shortlist, 1, n);
  const outputs = MASSING_OUTPUT_COLUMNS.filter((c) => c !== "limitedBy") as readonly string[];
  if (typeof objective !== "object" || objective === null) throw new TypeError(`${fn}: objective must be an object { output, sense }`);
  if (!outputs.includes(objective.output)) throw new RangeError(`${fn}: objective.output must be one of ${outputs.join(", ")}, got ${JSON.stringify(objective.output)}`);
  if (objective.sense !== "max" && objective.sense !== "min") throw new RangeError(`${fn}: objective.sense must be max or min, got ${JSON.stringify(objective.sense)}`);
  for (const [k, c] of (options.constraints ?? []).entries()) {
    if (!outputs.includes(c?.output)) throw new RangeError(`${fn}: constraints.${k}.output must be one of ${outputs.join(", ")}, got ${JSON.stringify(c?.output)}`);
  }
  const entry = optimizerNamed(options.optimizer ?? "pso");
  if (entry.objectives !== "single") throw new RangeError(`${fn}: optimizer must optimize one objective; ${entry.name} gives a front`);
  const problem: OptimizationProblem = { variables: PARCEL_DESIGN_VARIABLES, objectives: [objective], constraints: options.constraints ?? [] };
  const zones = parcels.map((p) => p.input);
  const sign = objective.sense === "max" ? 1 : -1;
  const progress = options.onProgress ?? (() => {});

  let exact: Omit<ParcelOptimum, "rank">[] | null = null;
  if (options.route !== "surrogate") {
    exact = [];
    for (const [i, zone] of zones.entries()) {
      const ev = parcelEvaluator(zone);
      const r = await entry.run(problem, ev, { maxEvaluations: budget, seed });
      const best = r.best?.feasible ? r.best : null;
      exact.push({ value: best?.objectives[0] ?? null, design: best?.design ?? null, outputs: best?.outputs ?? null, evaluations: ev.count });
      progress("exact", i + 1, n);
    }
  }

  let surrogate: Omit<SurrogateParcelOptimum, "rank" | "predictedRank">[] | null = null;
  let trained: { model: string; training: number[]; rows: number } | null = null;
  if (options.route !== "exact") {
    const s = options.surrogate;
    if (s === undefined || typeof s.dir !== "string") throw new TypeError(`${fn}: surrogate.dir must be a folder for the training files`);
    const m = s.trainingParcels ?? Math.ceil((2 * n) / 3);
    checkCount("surrogate.trainingParcels", m, 1, n);
    const rows = s.rows ?? 8 * m;
    checkCount("surrogate.rows", rows, 2, 1e6);
    checkCount("surrogate.candidates", s.candidates, 1, 100);
    const training = spreadParcels(zones, m);
    const targets = [...new Set([objective.output, ...(options.constraints ?? []).map((c) => c.output)])];
    const fitted = await trainParcelSurrogate({
      zones,
      training,
      rows,
      targets,
      seed,
      dir: s.dir,
      ...(s.model === undefined ? {} : { model: s.model }),
      ...(s.fitOptions === undefined ? {} : { fitOptions: s.fitOptions }),
      onProgress: (done, total) => progress("training", done, total),
    });
    trained = { model: s.model ?? "gp", training, rows };
    surrogate = [];
    for (const [i, zone] of zones.entries()) {
      const site = parcelDescriptors(zone);
      const r = await entry.run(problem, surrogateEvaluator(fitted.model, fitted.variables, site), { maxEvaluations: budget, seed, keepHistory: true });
      const chosen = await reevaluateSurrogateOptimum(problem, r.history ?? [], parcelEvaluator(zone), [], s.candidates ?? 3);
      const best = chosen.exact?.feasible ? chosen.exact : null;
      surrogate.push({
        value: best?.objectives[0] ?? null,
        design: best?.design ?? null,
        outputs: best?.outputs ?? null,
        evaluations: chosen.evaluations,
        predicted: chosen.predicted?.objectives[0] ?? null,
        trained: training.includes(i),
      });
      progress("surrogate", i + 1, n);
    }
  }

  // the no-search baseline: one exact evaluation per parcel at the zone's own controls
  const zoneDesign = (z: MassingInput) => ({ frontYardExtra: 0, sideYardExtra: 0, rearYardExtra: 0, heightShare: 1, coverageShare: 1, floorHeight: z.floorHeight });
  const zoneValues: (number | null)[] = [];
  for (const z of zones) {
    const e = scoreOutputs(problem, zoneDesign(z), (await parcelEvaluator(z).evaluate([zoneDesign(z)]))[0]!);
    zoneValues.push(e.feasible ? e.objectives[0]! : null);
  }
  const exactRanks = exact ? ranksOf(exact.map((e) => (e.value === null ? null : sign * e.value))) : null;
  const surrRanks = surrogate ? ranksOf(surrogate.map((e) => (e.value === null ? null : sign * e.value))) : null;
  const predRanks = surrogate ? ranksOf(surrogate.map((e) => (e.predicted === null || !Number.isFinite(e.predicted) ? null : sign * e.predicted))) : null;
  const ranked: RankedParcel[] = parcels.map((p, i) => ({
    index: i,
    id: p.id,
    zoneValue: zoneValues[i]!,
    exact: exact ? { ...exact[i]!, rank: exactRanks![i]! } : null,
    surrogate: surrogate ? { ...surrogate[i]!, rank: surrRanks![i]!, predictedRank: predRanks![i]! } : null,
  }));
  const sum = (v: readonly { evaluations: number }[]): number => v.reduce((t, e) => t + e.evaluations, 0);
  const reevaluation = surrogate ? sum(surrogate) : 0;
  let agree: ParcelRanking["agreement"] = null;
  if (exact) {
    const e = scoresOf(exact.map((x) => x.value), sign);
    agree = {
      zone: agreement(e, scoresOf(zoneValues, sign), shortlist),
      reevaluated: surrogate ? agreement(e, scoresOf(surrogate.map((x) => x.value), sign), shortlist) : null,
      predicted: surrogate ? agreement(e, scoresOf(surrogate.map((x) => (x.predicted !== null && Number.isFinite(x.predicted) ? x.predicted : null)), sign), shortlist) : null,
    };
  }
  return {
    kind: "floorcast.parcel-ranking",
    formatVersion: 1,
    caution: FLOORCAST_CAUTION,
    objective,
    optimizer: entry.name,
    seed,
    budget,
    shortlist,
    parcels: ranked,
    evaluations: {
      zone: n,
      exact: exact ? sum(exact) : null,
      surrogate: trained ? { training: trained.rows, reevaluation, total: trained.rows + reevaluation } : null,
    },
    surrogate: trained ? { model: trained.model, trainingParcels: trained.training.map((k) => parcels[k]!.id), rows: trained.rows } : null,
    agreement: agree,
  };
}
