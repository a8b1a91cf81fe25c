import { gridAxes, gridSearch } from "../optimize/grid-search.js";
import { optimizerNamed } from "../optimize/optimizers.js";
import type { OptimizationResult } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import { PLATE_STACK_OUTPUTS } from "@floorcast/surrogate";
import type { EvaluationsToTarget } from "./bench-report-types.js";
import { exactEvaluator } from "./exact-evaluator.js";
import { profiledExactEvaluator } from "./profiled-exact-evaluator.js";
import { plateStackBayesianOptimization } from "../optimize/plate-stack-bayesian.js";
import { medianEvaluations } from "./median-evaluations.js";

/** Budgets of the evaluations-to-target runs. */
export interface TargetBudgets {
  /** Exact evaluations allowed to GA, PSO and random search (default 600). */
  readonly search: number;
  /** Exact evaluations allowed to Bayesian optimization (its GP refits each step; default 60). */
  readonly bo: number;
  /** Seeds per stochastic method (default 3). */
  readonly seeds: number;
  /** Seeds of Bayesian optimization, the costly one (default `seeds`). */
  readonly boSeeds?: number;
  /** Relative target (default 0.005: within 0.5% of the exact optimum). */
  readonly target?: number;
}

/** Relative shortfall of a best-so-far value from the optimum (≥ 0; Infinity before anything feasible). */
function shortfall(v: number, optimum: number, sense: "max" | "min"): number {
  if (!Number.isFinite(v)) return Infinity;
  return Math.max(0, (sense === "max" ? optimum - v : v - optimum) / Math.abs(optimum));
}

/**
 * Exact evaluations each optimizer needs to come within `target` of the exact optimum (0.005 =
 * 0.5%), on the exact evaluator: Bayesian optimization with EI (Jones, Schonlau & Welch 1998), and where the
 * evaluator reports plate profiles Bayesian optimization through the stacking rule ("bo-plate-stack"), the
 * genetic algorithm, particle swarm, random search — each over several seeds, counted from its
 * best-so-far trace — and the grid, as the smallest full-factorial grid (2, 3, … points per
 * continuous variable) whose best is within the target (its count is that grid's size).
 * @param problem - a single-objective problem.
 * @param optimum - the exact optimum value.
 * @param budgets - evaluation budgets and seeds.
 * @param onStep - called with each method's name as it starts.
 * @returns one entry per method.
 */
export async function evaluationsToTarget(
  problem: BenchProblem,
  optimum: number,
  budgets: TargetBudgets,
  onStep?: (method: string) => void,
): Promise<EvaluationsToTarget[]> {
  const op = problem.optimization;
  const sense = op.objectives[0]!.sense;
  const target = budgets.target ?? 0.005;
  const runs: [string, number, (seed: number) => Promise<OptimizationResult>][] = [
    ["bo", budgets.bo, (seed) => optimizerNamed("bo").run(op, exactEvaluator(problem), { seed, maxEvaluations: budgets.bo, candidates: 500, acquisitionStarts: 2 })],
    ["ga", budgets.search, (seed) => optimizerNamed("ga").run(op, exactEvaluator(problem), { seed, maxEvaluations: budgets.search })],
    ["pso", budgets.search, (seed) => optimizerNamed("pso").run(op, exactEvaluator(problem), { seed, maxEvaluations: budgets.search })],
    ["random", budgets.search, (seed) => optimizerNamed("random").run(op, exactEvaluator(problem), { seed, maxEvaluations: budgets.search })],
  ];
  if (problem.plateProfile !== undefined && plateStackOutputsOnly(problem)) {
    runs.splice(1, 0, [
      "bo-plate-stack",
      budgets.bo,
      (seed) => plateStackBayesianOptimization(op, profiledExactEvaluator(problem), { seed, maxEvaluations: budgets.bo }),
    ]);
  }
  const out: EvaluationsToTarget[] = [];
  for (const [method, budget, run] of runs) {
    onStep?.(method);
    const t0 = performance.now();
    const evaluations: (number | null)[] = [];
    let curve: [number, number][] = [];
    const seeds = method.startsWith("bo") ? (budgets.boSeeds ?? budgets.seeds) : budgets.seeds;
    for (let s = 0; s < seeds; s++) {
      const r = await run(s + 1);
      const gaps = r.trace.map((v) => shortfall(v, optimum, sense));
      if (s === 0) curve = thin(gaps);
      const hit = gaps.findIndex((g) => g <= target);
      evaluations.push(hit < 0 ? null : hit + 1);
    }
    out.push({ method, evaluations, median: medianEvaluations(evaluations), budget, curve, seconds: (performance.now() - t0) / 1000 });
  }
  onStep?.("grid");
  const t0 = performance.now();
  let found: number | null = null;
  const curve: [number, number][] = [];
  const cap = budgets.search * 20;
  for (let r = 2; ; r++) {
    const { count } = gridAxes(op, r);
    if (count > cap) break;
    const g = await gridSearch(op, exactEvaluator(problem), { resolution: r });
    const gap = shortfall(g.best?.objectives[0] ?? Number.NaN, optimum, sense);
    if (Number.isFinite(gap)) curve.push([count, gap]);
    if (gap <= target) {
      found = count;
      break;
    }
    if (gridAxes(op, r + 1).count === count) break; // every lattice value already evaluated
  }
  out.push({ method: "grid", evaluations: [found], median: found, budget: cap, curve, seconds: (performance.now() - t0) / 1000 });
  return out;
}

/** Whether every output the problem uses is one the plate stack predicts. */
function plateStackOutputsOnly(problem: BenchProblem): boolean {
  return problem.outputs.every((o) => (PLATE_STACK_OUTPUTS as readonly string[]).includes(o));
}

/** (evaluations, shortfall) pairs of a trace, at most ~100 of them, skipping the infeasible start. */
function thin(gaps: readonly number[]): [number, number][] {
  const step = Math.max(1, Math.ceil(gaps.length / 100));
  const out: [number, number][] = [];
  gaps.forEach((g, i) => {
    if (Number.isFinite(g) && (i % step === 0 || i === gaps.length - 1)) out.push([i + 1, g]);
  });
  return out;
}
