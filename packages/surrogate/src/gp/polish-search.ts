import type { HyperparameterFitResult, HyperparameterSearch } from "./fit/fit-hyperparameters.js";

/**
 * The search that polishes a subset fit on all rows: the same settings, one start at the subset's optimum, at most
 * `iterations` L-BFGS iterations.
 * @param search - the subset's search. @param fit - its result. @param iterations - the polish budget.
 * @returns the polish search.
 */
export function polishSearch(search: HyperparameterSearch, fit: HyperparameterFitResult, iterations: number): HyperparameterSearch {
  return { ...search, starts: [fit.theta], maxIterations: iterations };
}
