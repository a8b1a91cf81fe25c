import type { HyperparameterSearch } from "./fit/fit-hyperparameters.js";

/**
 * The search that polishes a subset fit on all rows: the same settings, one start (the subset's optimum or its best
 * probe, see choosePolishStart), at most `iterations` L-BFGS iterations.
 * @param search - the subset's search. @param start - where the polish starts (log space). @param iterations - the polish budget.
 * @returns the polish search.
 */
export function polishSearch(search: HyperparameterSearch, start: Float64Array, iterations: number): HyperparameterSearch {
  return { ...search, starts: [start], maxIterations: iterations };
}
