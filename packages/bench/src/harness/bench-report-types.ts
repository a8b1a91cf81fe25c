import type { ParcelRankingReport } from "../parcels/parcel-ranking.js";
import type { MassingInput, MassingResult } from "@floorcast/sampler";
import type { Design, Outputs } from "../optimize/optimization-problem.js";
import type { ReportedSource } from "./reevaluate-surrogate-optimum.js";
import type { TargetAccuracy } from "./assess-accuracy.js";

/** An exactly evaluated design as report.json writes it. */
export interface ReportedDesign {
  /** Design-variable values (and, for site selection, the site's parameters). */
  readonly design: Design;
  /** The full MassingInput (massing problems) or the design itself (test functions). */
  readonly input: MassingInput | Design;
  /** Its exact MassingResult (massing problems) or the exact outputs (test functions). */
  readonly result: MassingResult | Outputs;
  /** Exact value of the (first) objective. */
  readonly value: number;
}

/** The exact optimum and what it cost. */
export interface ExactOptimumRecord extends ReportedDesign {
  /** Exact evaluations: grid plus local refinement (for site selection, summed over sites). */
  readonly evaluations: number;
  readonly gridEvaluations: number;
  readonly refineEvaluations: number;
  /** Grid points per continuous variable (the stated resolution). */
  readonly gridPoints: number;
  readonly seconds: number;
}

/** Wall time of each step of one surrogate trial, in seconds. */
export interface TrialSeconds {
  readonly sample: number;
  readonly fit: number;
  readonly assess: number;
  readonly optimize: number;
  readonly reevaluate: number;
  readonly refine: number;
}

/** One surrogate-driven optimum: a surrogate, training size and seed through the gap measurement. */
export interface SurrogateOptimumRecord {
  /** "gp", "nn", or a peer such as "sklearn-gp", "sklearn-mlp". */
  readonly surrogate: string;
  /** How the training design was drawn: "lhs-maximin" or "scipy-lhs". */
  readonly sampler: string;
  readonly trainingSize: number;
  readonly seed: number;
  /** The reported design, exactly re-evaluated (null fields when no exactly-feasible design was found). */
  readonly design: Design | null;
  readonly input: MassingInput | Design | null;
  readonly result: MassingResult | Outputs | null;
  readonly value: number | null;
  /** (exact optimum − exact value here) / |exact optimum|; for two objectives 1 − hypervolume ratio. */
  readonly gap: number | null;
  /** Where the reported design came from (the rule never reports an exactly infeasible design). */
  readonly source: ReportedSource;
  /** The surrogate's own prediction at its first choice. */
  readonly predicted: Outputs | null;
  /** After a small budget of exact local refinement from the reported design. */
  readonly refined: (ReportedDesign & { readonly gap: number; readonly evaluations: number }) | null;
  /** Exact evaluations the surrogate-driven optimum cost: training rows plus re-evaluations. */
  readonly evaluations: number;
  readonly evaluationsBreakdown: {
    readonly training: number;
    readonly reevaluation: number;
    readonly refinement: number;
    readonly testSet: number;
  };
  /** Accuracy on the independent test set (trust-report metrics), per target. */
  readonly accuracy: readonly TargetAccuracy[];
  readonly seconds: TrialSeconds;
  /** Two objectives: hypervolume of the exactly re-evaluated surrogate front / the exact front's. */
  readonly hypervolumeRatio?: number;
  /** Two objectives: the exactly re-evaluated, exactly feasible surrogate front (objective values). */
  readonly front?: readonly (readonly number[])[];
  /** Site selection: rank agreement between surrogate and exact best-per-site values. */
  readonly ranking?: {
    readonly spearman: number;
    readonly kendall: number;
    readonly topOverlap: number;
    readonly shortlist: number;
    /** Surrogate-estimated best value per site, in site order (for the ranking scatter). */
    readonly estimates: readonly number[];
  };
}

/** Gap statistics of one surrogate at one training size over its seeds. */
export interface GapSummary {
  readonly surrogate: string;
  readonly sampler: string;
  readonly trainingSize: number;
  readonly trials: number;
  readonly medianGap: number | null;
  readonly worstGap: number | null;
  readonly medianGapRefined: number | null;
  readonly worstGapRefined: number | null;
  /** Trials whose reported design was not the surrogate's first choice (it was exactly infeasible). */
  readonly fallbacks: number;
  readonly medianR2: number | null;
  readonly medianEvaluations: number;
  readonly medianFitSeconds: number;
}

/** Exact evaluations an optimizer needed to come within the target of the exact optimum. */
export interface EvaluationsToTarget {
  readonly method: string;
  /** Per seed: evaluations to reach the target, null when the budget ran out first. */
  readonly evaluations: readonly (number | null)[];
  readonly median: number | null;
  readonly budget: number;
  /** (exact evaluations, best-so-far relative shortfall) of the first seed (for the curve). */
  readonly curve: readonly (readonly [number, number])[];
  readonly seconds: number;
}

/** Everything measured for one problem. */
export interface ProblemReport {
  readonly name: string;
  readonly title: string;
  readonly description: string;
  readonly kind: "single" | "two-objective" | "site-selection";
  readonly file: string;
  readonly objectives: readonly { readonly output: string; readonly sense: "max" | "min" }[];
  readonly constraints: readonly { readonly output: string; readonly op: "<=" | ">="; readonly value: number }[];
  readonly variables: readonly string[];
  readonly exactOptimum: ExactOptimumRecord;
  readonly surrogateOptimum: readonly SurrogateOptimumRecord[];
  readonly summary: readonly GapSummary[];
  /** Relative target (0.005 = within 0.5%) and each optimizer's evaluations to reach it. */
  readonly target: number;
  readonly evaluationsToTarget: readonly EvaluationsToTarget[];
  /** Two objectives: the exact front (objective values) and its hypervolume. */
  readonly exactFront?: { readonly points: readonly (readonly number[])[]; readonly hypervolume: number; readonly reference: readonly number[] };
  /** Site selection: exact best value per site, in site order. */
  readonly sites?: { readonly parameters: readonly string[]; readonly exactBest: readonly number[]; readonly count: number };
  /** Notes, e.g. why peers were skipped. */
  readonly notes: readonly string[];
  readonly seconds: number;
}

/** report.json. */
export interface BenchReport {
  readonly kind: "floorcast.bench-report";
  readonly formatVersion: 1;
  readonly caution: string;
  readonly suite: string;
  readonly options: Readonly<Record<string, unknown>>;
  readonly environment: { readonly node: string; readonly cpus: number; readonly peers: boolean };
  readonly problems: readonly ProblemReport[];
  readonly seconds: number;
  /** The demo's parcel file ranked by capacity (`floorcast demo`), drawn as a plan in the HTML report. */
  readonly parcels?: ParcelRankingReport;
}
