import type { Evaluator } from "@floorcast/sampler";
import type { OptimizationProblem, OptimizationResult } from "../optimize/optimization-problem.js";
import { OPTIMIZERS, optimizerNamed } from "../optimize/optimizers.js";

/** Optimizer names `floorcast optimize --optimizer` accepts: the registry's (optimize/optimizers.ts). */
export const OPTIMIZER_NAMES: readonly string[] = OPTIMIZERS.map((o) => o.name);

/** One of {@link OPTIMIZER_NAMES}. */
export type OptimizerName = string;

/**
 * Runs a registered optimizer with a budget, keeping its history (the harness falls back on it when the best
 * design is exactly infeasible); Bayesian optimization gets at most 200 evaluations (its GP refits grow as n³).
 * @param name - the optimizer.
 * @param problem - the problem (nsga2 needs two objectives; the others use the first).
 * @param evaluator - exact or surrogate.
 * @param options - seed, budget, grid resolution, progress callback.
 * @returns the optimizer's result.
 */
export function runOptimizer(
  name: OptimizerName,
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: { readonly seed: number; readonly budget: number; readonly gridPoints: number; readonly onProgress?: (done: number, total: number) => void },
): Promise<OptimizationResult> {
  const maxEvaluations = name === "bo" ? Math.min(options.budget, 200) : options.budget;
  return optimizerNamed(name).run(problem, evaluator, {
    seed: options.seed,
    keepHistory: true,
    maxEvaluations,
    gridPoints: options.gridPoints,
    ...(options.onProgress ? { onProgress: options.onProgress } : {}),
  });
}
