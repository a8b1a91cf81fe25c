import type { Design, EvaluatedDesign, OptimizationResult } from "../optimize/optimization-problem.js";
import { gridSearch } from "../optimize/grid-search.js";
import { patternSearch } from "../optimize/pattern-search.js";
import { nsga2 } from "../optimize/nsga2.js";
import { nonDominatedIndices } from "../optimize/pareto-dominance.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import { exactEvaluator } from "./exact-evaluator.js";

/** The exact optimum of a single-objective problem (or of one site), with what it cost. */
export interface ExactOptimum {
  /** Best exactly-feasible design found (null when the grid found none feasible). */
  readonly best: EvaluatedDesign | null;
  /** Grid points per continuous variable. */
  readonly gridPoints: number;
  /** Exact evaluations: grid then local refinement. */
  readonly gridEvaluations: number;
  readonly refineEvaluations: number;
  readonly evaluations: number;
  /** Every exactly-feasible non-dominated design of the grid (the exact front for two objectives). */
  readonly front: readonly EvaluatedDesign[];
  readonly seconds: number;
}

/**
 * Finds the exact optimum the benchmark measures against: an exhaustive grid at the problem's
 * stated resolution (`exact.gridPoints` per continuous variable, every lattice value when fewer),
 * then exact local refinement by pattern search from the grid's best within
 * `exact.refineEvaluations` evaluations (common practice: a global grid guards against local
 * optima, the refinement recovers the resolution the grid lacks).
 * For two objectives the exact front is the feasible non-dominated set of the grid together with an
 * NSGA-II run (Deb et al. 2002) on the exact evaluator spending the refinement budget.
 * @param problem - the problem.
 * @param options - `site` for one site of a site-selection problem; `gridPoints`/`refineEvaluations` override; `onProgress`.
 * @returns the optimum and its evaluation counts.
 */
export async function findExactOptimum(
  problem: BenchProblem,
  options: {
    readonly site?: Design;
    readonly gridPoints?: number;
    readonly refineEvaluations?: number;
    readonly onProgress?: (done: number, total: number) => void;
  } = {},
): Promise<ExactOptimum> {
  const t0 = performance.now();
  const gridPoints = options.gridPoints ?? problem.exact.gridPoints;
  const evaluator = exactEvaluator(problem, options.site);
  const grid = await gridSearch(problem.optimization, evaluator, {
    resolution: gridPoints,
    batchSize: 512,
    ...(options.onProgress ? { onProgress: options.onProgress } : {}),
  });
  let best = grid.best;
  let refined: OptimizationResult | null = null;
  const budget = options.refineEvaluations ?? problem.exact.refineEvaluations;
  if (best && problem.optimization.objectives.length === 1 && budget > 0) {
    refined = await patternSearch(problem.optimization, evaluator, best.design, {
      maxEvaluations: budget,
      initialStep: 1 / Math.max(2, gridPoints - 1),
    });
    const r = refined.best;
    if (r && r.feasible) {
      const sense = problem.optimization.objectives[0]!.sense;
      const better = sense === "max" ? r.objectives[0]! > best.objectives[0]! : r.objectives[0]! < best.objectives[0]!;
      if (better) best = r;
    }
  }
  let front = grid.front;
  if (problem.optimization.objectives.length > 1 && budget > 0) {
    refined = await nsga2(problem.optimization, evaluator, { seed: "exact-front", maxEvaluations: budget, populationSize: 60 });
    const all = [...grid.front, ...refined.front];
    const senses = problem.optimization.objectives.map((o) => (o.sense === "max" ? -1 : 1));
    front = nonDominatedIndices(all.map((e) => e.objectives.map((v, k) => senses[k]! * v))).map((i) => all[i]!);
  }
  return {
    best,
    gridPoints,
    gridEvaluations: grid.evaluations,
    refineEvaluations: refined?.evaluations ?? 0,
    evaluations: grid.evaluations + (refined?.evaluations ?? 0),
    front,
    seconds: (performance.now() - t0) / 1000,
  };
}
