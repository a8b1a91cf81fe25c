import type { MassingInput, MassingResult, Variable } from "@floorcast/sampler";
import type { ProblemDataset } from "./problem-dataset.js";
import type { Design, OptimizationProblem, Outputs } from "../optimize/optimization-problem.js";

/** What a problem asks: one objective, two objectives (a front), or a ranking of sites. */
export type BenchProblemKind = "single" | "two-objective" | "site-selection";

/** The sites of a site-selection problem: each fixes the site parameters to one parcel's values. */
export interface BenchSites {
  /** Names of the parameters that differ between sites (parcel size and shape). */
  readonly parameters: readonly string[];
  /** One record per site, parameter name → value. */
  readonly sites: readonly Design[];
  /** Shortlist length compared between exact and surrogate rankings. */
  readonly shortlist: number;
}

/**
 * A loaded, checked benchmark problem: the optimization problem over its design variables plus
 * the exact evaluator of its fixed context (a Quillmere scenario or a published test function).
 */
export interface BenchProblem {
  readonly name: string;
  readonly title: string;
  readonly description: string;
  readonly suites: readonly string[];
  /** The file it was read from (empty for an in-memory problem). */
  readonly file: string;
  readonly kind: BenchProblemKind;
  /** Variables, objectives and constraints, in the optimizers' terms. */
  readonly optimization: OptimizationProblem;
  /** Exact-optimum search: grid points per continuous variable and the local refinement budget. */
  readonly exact: { readonly gridPoints: number; readonly refineEvaluations: number };
  /** Outputs a surrogate must predict: objectives then constraints, without repeats. */
  readonly outputs: readonly string[];
  /**
   * Variables a surrogate is trained over: the design variables, and for site selection
   * the site parameters before them (within the scenario's ranges).
   */
  readonly trainingVariables: readonly Variable[];
  /** The problem as a dataset `floorcast sample` could write: training sets are written through writeDataset. */
  readonly dataset: ProblemDataset;
  /** Site selection only. */
  readonly sites?: BenchSites;
  /** Exact outputs of one design (training variables' values); NaN outputs when it cannot be evaluated. */
  evaluate(design: Design): Outputs;
  /** An external evaluator command's asynchronous evaluation (then `evaluate` refuses); exactEvaluator uses it. */
  evaluateBatch?(batch: readonly Design[]): Promise<readonly Outputs[]>;
  /** Releases what the evaluator holds (an external command's processes). */
  close?(): Promise<void>;
  /** The full massing input of a design (massing problems only). */
  massingInput?(design: Design): MassingInput;
  /**
   * The exact evaluator's outputs with the plate profile (`sample --plate-profile` columns: lotArea, buildableArea,
   * rule_*, plateArea_k, plateWidth_k) of a design; massing problems only. Throws for a design that cannot be evaluated.
   */
  plateProfile?(design: Design): Readonly<Record<string, number | string>>;
  /** The exact massing result of a design, with floor plates when asked (massing problems only). */
  massingResult?(design: Design, plates?: boolean): MassingResult;
}
