// @floorcast/bench/harness: the optimum-gap benchmark harness, its metrics and report types.
export { averageRanks } from "./average-ranks.js";
export { spearmanRho } from "./spearman-rho.js";
export { kendallTau } from "./kendall-tau.js";
export { topKOverlap } from "./top-k-overlap.js";
export { optimumGap } from "./optimum-gap.js";
export { exactEvaluator } from "./exact-evaluator.js";
export type { CountingEvaluator } from "./counting-evaluator.js";
export { surrogateEvaluator } from "./surrogate-evaluator.js";
export type { BatchPredictor } from "./surrogate-evaluator.js";
export { findExactOptimum } from "./find-exact-optimum.js";
export type { ExactOptimum } from "./find-exact-optimum.js";
export { reevaluateSurrogateOptimum } from "./reevaluate-surrogate-optimum.js";
export type { ReevaluatedOptimum, ReportedSource } from "./reevaluate-surrogate-optimum.js";
export { runProblem } from "./run-problem.js";
export type { RunProblemOptions, TrialPlan } from "./run-problem.js";
export { runBench } from "./run-bench.js";
export { FLOORCAST_CAUTION } from "../floorcast-caution.js";
export type { RunBenchOptions } from "./run-bench.js";
export { runSuite } from "./run-suite.js";
export type { RunSuiteOptions } from "./run-suite.js";
export { benchSettings } from "./bench-settings.js";
export type { BenchSettings } from "./bench-settings.js";
export { writeBenchReport } from "./write-bench-report.js";
export type {
  BenchReport,
  EvaluationsToTarget,
  ExactOptimumRecord,
  GapSummary,
  ProblemReport,
  ReportedDesign,
  SurrogateOptimumRecord,
  TrialSeconds,
} from "./bench-report-types.js";
export { MODEL_FAMILIES, modelFamily } from "../families/model-families.js";
export type { FamilyOption, FitOptions, ModelFamily } from "../families/model-family.js";
export { fitModelFile } from "../families/fit-model-file.js";
export type { FitModelRequest } from "../families/fit-model-file.js";
export { evaluateParcelFile } from "../parcels/evaluate-parcel-file.js";
export type { EvaluatedParcel, ParcelFileOptions, ParcelFileResult } from "../parcels/evaluate-parcel-file.js";
export { parcelDescriptors, PARCEL_DESCRIPTOR_NAMES } from "../parcels/parcel-descriptors.js";
export type { ParcelDescriptors } from "../parcels/parcel-descriptors.js";
export { PARCEL_DESIGN_VARIABLES, parcelDesignInput } from "../parcels/parcel-design-variables.js";
export { parcelEvaluator } from "../parcels/parcel-evaluator.js";
export { trainParcelSurrogate } from "../parcels/train-parcel-surrogate.js";
export type { ParcelSurrogate, ParcelSurrogateRequest } from "../parcels/train-parcel-surrogate.js";
export { rankParcels } from "../parcels/rank-parcels.js";
export type { RankParcelsOptions } from "../parcels/rank-parcels.js";
export type { ParcelOptimum, ParcelRanking, RankAgreement, RankedParcel, SurrogateParcelOptimum } from "../parcels/parcel-ranking.js";
export type { ParcelRankingReport } from "../parcels/parcel-ranking.js";
export { rankedParcelCollection } from "../parcels/ranked-parcel-collection.js";
export { rankParcelCollection } from "../parcels/rank-parcel-collection.js";
export type { RankedParcelFile } from "../parcels/rank-parcel-collection.js";
export { rankDemoParcels, DEFAULT_PARCELS_DIR } from "../parcels/rank-demo-parcels.js";
export type { DemoParcelRankingOptions } from "../parcels/rank-demo-parcels.js";
