import { bayesianOptimisation } from "../optimise/bayesian-optimisation.js";
import { geneticAlgorithm } from "../optimise/genetic-algorithm.js";
import { gridSearch } from "../optimise/grid-search.js";
import { nsga2 } from "../optimise/nsga2.js";
import type { Evaluator, OptimisationProblem, OptimisationResult } from "../optimise/optimisation-problem.js";
import { particleSwarm } from "../optimise/particle-swarm.js";
import { projectedGradient } from "../optimise/projected-gradient.js";
import { randomSearch } from "../optimise/random-search.js";

/** Optimiser names `floorcast optimize --optimizer` accepts. */
export const OPTIMIZER_NAMES = ["grid", "random", "lhs", "gradient", "pso", "ga", "nsga2", "bo"] as const;

/** One of {@link OPTIMIZER_NAMES}. */
export type OptimizerName = (typeof OPTIMIZER_NAMES)[number];

/**
 * Runs a named optimiser of `@floorcast/bench` with a budget, keeping its history (the harness
 * falls back on it when the best design is exactly infeasible).
 * @param name - the optimiser.
 * @param problem - the problem (nsga2 needs two objectives; the others use the first).
 * @param evaluator - exact or surrogate.
 * @param options - seed, budget, grid resolution, progress callback.
 * @returns the optimiser's result.
 */
export function runOptimizer(
  name: OptimizerName,
  problem: OptimisationProblem,
  evaluator: Evaluator,
  options: { readonly seed: number; readonly budget: number; readonly gridPoints: number; readonly onProgress?: (done: number, total: number) => void },
): Promise<OptimisationResult> {
  const common = { seed: options.seed, keepHistory: true, ...(options.onProgress ? { onProgress: options.onProgress } : {}) };
  switch (name) {
    case "grid":
      return gridSearch(problem, evaluator, { ...common, resolution: options.gridPoints });
    case "random":
      return randomSearch(problem, evaluator, { ...common, maxEvaluations: options.budget });
    case "lhs":
      return randomSearch(problem, evaluator, { ...common, design: "lhs", maxEvaluations: options.budget });
    case "gradient":
      return projectedGradient(problem, evaluator, { ...common, maxEvaluations: options.budget });
    case "pso":
      return particleSwarm(problem, evaluator, { ...common, maxEvaluations: options.budget });
    case "ga":
      return geneticAlgorithm(problem, evaluator, { ...common, maxEvaluations: options.budget });
    case "nsga2":
      return nsga2(problem, evaluator, { ...common, maxEvaluations: options.budget });
    case "bo":
      return bayesianOptimisation(problem, evaluator, { ...common, maxEvaluations: Math.min(options.budget, 200) });
  }
}
