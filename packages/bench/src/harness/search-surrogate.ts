import type { Evaluator } from "@floorcast/sampler";
import type { EvaluatedDesign, OptimizationProblem } from "../optimize/optimization-problem.js";
import { randomSearch } from "../optimize/random-search.js";
import { patternSearch } from "../optimize/pattern-search.js";

/** Budget of a search on a surrogate (cheap evaluations, so generous). */
export interface SurrogateSearchOptions {
  /** Latin-hypercube candidates scanned first (default 1024). */
  readonly candidates?: number;
  /** Pattern-search evaluations from each of the best starts (default 200). */
  readonly polish?: number;
  /** Number of best candidates polished (default 3). */
  readonly starts?: number;
  readonly seed: number | string;
}

/**
 * Searches a surrogate for a single objective's optimum: a Latin-hypercube scan of candidates, then
 * pattern search (exact local refinement's method, here on the surrogate) from the best few —
 * multi-start local search, common practice for cheap smooth models. Returns every design it
 * scored, so the harness can fall back on the ranked list.
 * @param problem - the single-objective problem.
 * @param surrogate - the surrogate evaluator.
 * @param options - budget and seed.
 * @returns all surrogate-scored designs, in order.
 */
export async function searchSurrogate(
  problem: OptimizationProblem,
  surrogate: Evaluator,
  options: SurrogateSearchOptions,
): Promise<EvaluatedDesign[]> {
  const scan = await randomSearch(problem, surrogate, {
    design: "lhs",
    maxEvaluations: options.candidates ?? 1024,
    seed: `${String(options.seed)}-scan`,
    keepHistory: true,
    batchSize: 1024,
  });
  const history: EvaluatedDesign[] = [...(scan.history ?? [])];
  const sense = problem.objectives[0]!.sense;
  const starts = history
    .filter((e) => e.feasible)
    .sort((a, b) => (sense === "max" ? b.objectives[0]! - a.objectives[0]! : a.objectives[0]! - b.objectives[0]!))
    .slice(0, options.starts ?? 3);
  for (const s of starts) {
    const polished = await patternSearch(problem, surrogate, s.design, {
      maxEvaluations: options.polish ?? 200,
      keepHistory: true,
    });
    history.push(...(polished.history ?? []));
  }
  return history;
}
