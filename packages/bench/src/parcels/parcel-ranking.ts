import type { Design, Objective, Outputs } from "../optimize/optimization-problem.js";

/** The best design one route found for one parcel, exactly evaluated. */
export interface ParcelOptimum {
  /** Exact objective value at `design`; null when no exactly feasible design was found. */
  readonly value: number | null;
  readonly design: Design | null;
  /** Exact outputs at `design` (null with it). */
  readonly outputs: Outputs | null;
  /** Exact evaluations this route spent on this parcel. */
  readonly evaluations: number;
  /** 1 = best objective among the parcels (ties by file order; parcels without a value last). */
  readonly rank: number;
}

/** The surrogate route's result on one parcel: the surrogate's choice, re-evaluated exactly. */
export interface SurrogateParcelOptimum extends ParcelOptimum {
  /** The surrogate's predicted objective at its choice. */
  readonly predicted: number | null;
  /** Rank by `predicted` (what the surrogate alone says, before re-evaluation). */
  readonly predictedRank: number;
  /** True when the parcel's designs were in the training set. */
  readonly trained: boolean;
}

/** One parcel of a ranking. */
export interface RankedParcel {
  /** Position in the parcel list (file order among evaluated parcels). */
  readonly index: number;
  readonly id: string;
  /** Exact objective at the zone's own controls (no deeper yards, full caps, the zone's floor height); null when infeasible. */
  readonly zoneValue: number | null;
  readonly exact: ParcelOptimum | null;
  readonly surrogate: SurrogateParcelOptimum | null;
}

/** Agreement of a ranking with the exact route's ranking. */
export interface RankAgreement {
  /** Spearman's rho (scipy.stats.spearmanr's definition). */
  readonly spearman: number;
  /** Kendall's tau-b (scipy.stats.kendalltau's default). */
  readonly kendall: number;
  /** Share of the exact top `shortlist` also in this ranking's top `shortlist`. */
  readonly topOverlap: number;
}

/** What rankParcels returns. */
export interface ParcelRanking {
  readonly kind: "floorcast.parcel-ranking";
  readonly formatVersion: 1;
  readonly caution: string;
  readonly objective: Objective;
  readonly optimizer: string;
  readonly seed: number;
  /** Exact evaluations per parcel on the exact route; surrogate evaluations per parcel on the surrogate route. */
  readonly budget: number;
  readonly shortlist: number;
  readonly parcels: readonly RankedParcel[];
  readonly evaluations: {
    /** One exact evaluation per parcel at the zone's own controls (the no-search baseline). */
    readonly zone: number;
    readonly exact: number | null;
    readonly surrogate: { readonly training: number; readonly reevaluation: number; readonly total: number } | null;
  };
  /** The surrogate route: training parcels, rows and family. */
  readonly surrogate: { readonly model: string; readonly trainingParcels: readonly string[]; readonly rows: number } | null;
  /**
   * Against the exact ranking: the surrogate route by re-evaluated values and by its predictions alone (both routes
   * run), and the no-search baseline, the values at the zone's own controls (exact route run).
   */
  readonly agreement: { readonly zone: RankAgreement; readonly reevaluated: RankAgreement | null; readonly predicted: RankAgreement | null } | null;
}

/** A parcel ranking as a report carries it: the parcel file's name, the ranking and each parcel's outline (local metres). */
export interface ParcelRankingReport {
  readonly file: string;
  readonly ranking: ParcelRanking;
  /** Outer ring of each ranked parcel, in ranking order, local metres. */
  readonly outlines: readonly (readonly (readonly [number, number])[])[];
}
