export { main } from "./cli/main.js";
// Optimisers (packages/bench/src/optimise/)
export type {
  CategoricalVariable,
  CommonOptions,
  ContinuousVariable,
  Design,
  EvaluatedDesign,
  Evaluator,
  IntegerVariable,
  Objective,
  OptimisationProblem,
  OptimisationResult,
  OptimisationVariable,
  OutputConstraint,
  OutputGradient,
  Outputs,
} from "./optimise/optimisation-problem.js";
export { scoreOutputs } from "./optimise/evaluation-session.js";
export { compareFeasibility, objectiveLoss } from "./optimise/feasibility-rules.js";
export { dominates, nonDominatedIndices } from "./optimise/pareto-dominance.js";
export { gridAxes, gridSearch } from "./optimise/grid-search.js";
export type { GridSearchOptions } from "./optimise/grid-search.js";
export { randomSearch } from "./optimise/random-search.js";
export type { RandomSearchOptions } from "./optimise/random-search.js";
export { patternSearch } from "./optimise/pattern-search.js";
export type { PatternSearchOptions } from "./optimise/pattern-search.js";
export { geneticAlgorithm } from "./optimise/genetic-algorithm.js";
export type { GeneticAlgorithmOptions } from "./optimise/genetic-algorithm.js";
export { particleSwarm } from "./optimise/particle-swarm.js";
export type { ParticleSwarmOptions } from "./optimise/particle-swarm.js";
export { hypervolume } from "./optimise/hypervolume.js";
export { constrainedDominates, crowdingDistance, fastNonDominatedSort } from "./optimise/nondominated-sort.js";
export type { SortableIndividual } from "./optimise/nondominated-sort.js";
export { nsga2 } from "./optimise/nsga2.js";
export type { Nsga2Options } from "./optimise/nsga2.js";
export { projectedGradient } from "./optimise/projected-gradient.js";
export type { ProjectedGradientOptions } from "./optimise/projected-gradient.js";
export { expectedImprovement, probabilityOfFeasibility } from "./optimise/expected-improvement.js";
export { bayesianOptimisation } from "./optimise/bayesian-optimisation.js";
export type { AcquisitionModel, BayesianOptimisationOptions } from "./optimise/bayesian-optimisation.js";
// Report rendering: self-contained pages, Vega-Lite charts to SVG, the trust report (report/)
export { chartSvg } from "./report/chart-svg.js";
export { escapeHtml } from "./report/escape-html.js";
export { formatNumber } from "./report/format-number.js";
export { htmlTable } from "./report/html-table.js";
export { renderFigure } from "./report/render-figure.js";
export { renderPage } from "./report/render-page.js";
export type { PageSection } from "./report/render-page.js";
export { trustFigureSpecs } from "./report/trust-figure-specs.js";
export type { TrustFigureSpec } from "./report/trust-figure-specs.js";
export { trustSummaryTables } from "./report/trust-summary-tables.js";
export type { SummaryTable } from "./report/trust-summary-tables.js";
export { renderTrustMarkdown } from "./report/trust-report-markdown.js";
export { renderTrustHtml } from "./report/trust-report-html.js";
// Problems and the optimum-gap benchmark harness (problem/, harness/)
export type { BenchProblem, BenchProblemKind, BenchSites } from "./problem/bench-problem.js";
export { problemFileSchema } from "./problem/problem-file-schema.js";
export type { ProblemFile } from "./problem/problem-file-schema.js";
export { ProblemFileError } from "./problem/problem-file-error.js";
export { parseProblem } from "./problem/parse-problem.js";
export { loadProblem } from "./problem/load-problem.js";
export { DEFAULT_PROBLEMS_DIR, loadSuite } from "./problem/load-suite.js";
export { MASSING_OUTPUTS, massingOutputs } from "./problem/massing-outputs.js";
export { branin } from "./problem/branin.js";
export { forrester } from "./problem/forrester.js";
export { sixHumpCamel } from "./problem/six-hump-camel.js";
export { averageRanks } from "./harness/average-ranks.js";
export { spearmanRho } from "./harness/spearman-rho.js";
export { kendallTau } from "./harness/kendall-tau.js";
export { topKOverlap } from "./harness/top-k-overlap.js";
export { optimumGap } from "./harness/optimum-gap.js";
export { exactEvaluator } from "./harness/exact-evaluator.js";
export type { CountingEvaluator } from "./harness/exact-evaluator.js";
export { surrogateEvaluator } from "./harness/surrogate-evaluator.js";
export type { BatchPredictor } from "./harness/surrogate-evaluator.js";
export { findExactOptimum } from "./harness/find-exact-optimum.js";
export type { ExactOptimum } from "./harness/find-exact-optimum.js";
export { reevaluateSurrogateOptimum } from "./harness/reevaluate-surrogate-optimum.js";
export type { ReevaluatedOptimum, ReportedSource } from "./harness/reevaluate-surrogate-optimum.js";
export { runProblem } from "./harness/run-problem.js";
export type { RunProblemOptions, TrialPlan } from "./harness/run-problem.js";
export { BENCH_CAUTION, runBench } from "./harness/run-bench.js";
export type { RunBenchOptions } from "./harness/run-bench.js";
export { runSuite } from "./harness/run-suite.js";
export type { RunSuiteOptions } from "./harness/run-suite.js";
export { benchSettings } from "./harness/bench-settings.js";
export type { BenchSettings } from "./harness/bench-settings.js";
export { writeBenchReport } from "./harness/write-bench-report.js";
export { renderBenchMarkdown } from "./harness/bench-report-markdown.js";
export { renderBenchHtml } from "./harness/bench-report-html.js";
export { massingDrawingSpec } from "./harness/massing-drawing-spec.js";
export type {
  BenchReport,
  EvaluationsToTarget,
  ExactOptimumRecord,
  GapSummary,
  ProblemReport,
  ReportedDesign,
  SurrogateOptimumRecord,
  TrialSeconds,
} from "./harness/bench-report-types.js";
