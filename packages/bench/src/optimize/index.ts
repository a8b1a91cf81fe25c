// @floorcast/bench/optimizers: the optimizers, their problem and evaluator contract, and the registry.
// Loads no CLI parser, chart package, progress bar or tfjs (a test checks the loaded modules).
export type {
  CommonOptions,
  Design,
  EvaluatedDesign,
  Objective,
  OptimizationProblem,
  OptimizationResult,
  OutputConstraint,
  Outputs,
} from "./optimization-problem.js";
export { scoreOutputs } from "./evaluation-session.js";
export { compareFeasibility, objectiveLoss } from "./feasibility-rules.js";
export { dominates, nonDominatedIndices } from "./pareto-dominance.js";
export { gridAxes, gridSearch } from "./grid-search.js";
export type { GridSearchOptions } from "./grid-search.js";
export { randomSearch } from "./random-search.js";
export type { RandomSearchOptions } from "./random-search.js";
export { patternSearch } from "./pattern-search.js";
export type { PatternSearchOptions } from "./pattern-search.js";
export { geneticAlgorithm } from "./genetic-algorithm.js";
export type { GeneticAlgorithmOptions } from "./genetic-algorithm.js";
export { particleSwarm } from "./particle-swarm.js";
export type { ParticleSwarmOptions } from "./particle-swarm.js";
export { hypervolume } from "./hypervolume.js";
export { constrainedDominates, crowdingDistance, fastNonDominatedSort } from "./nondominated-sort.js";
export type { SortableIndividual } from "./nondominated-sort.js";
export { nsga2 } from "./nsga2.js";
export type { Nsga2Options } from "./nsga2.js";
export { projectedGradient } from "./projected-gradient.js";
export type { ProjectedGradientOptions } from "./projected-gradient.js";
export { expectedImprovement, probabilityOfFeasibility } from "./expected-improvement.js";
export { bayesianOptimization } from "./bayesian-optimization.js";
export type { AcquisitionModel, BayesianOptimizationOptions } from "./bayesian-optimization.js";
export { OPTIMIZERS, optimizerNamed } from "./optimizers.js";
export type { OptimizerEntry, OptimizerRunOptions } from "./optimizers.js";
