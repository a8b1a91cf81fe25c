import { optimizerNamed } from "../optimize/optimizers.js";
import type { EvaluatedDesign, OptimizationResult } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import type { EvaluationsToTarget } from "./bench-report-types.js";
import { exactEvaluator } from "./exact-evaluator.js";
import { medianEvaluations } from "./median-evaluations.js";
import { frontHypervolume } from "./front-hypervolume.js";
import type { TargetBudgets } from "./evaluations-to-target.js";

/** Hypervolume shortfall after each evaluation of a run's history: 1 − HV(feasible designs so far) / exact HV. */
function shortfalls(problem: BenchProblem, history: readonly EvaluatedDesign[], reference: readonly number[], exactHv: number): number[] {
  const op = problem.optimization;
  const front: number[][] = [];
  let hv = 0;
  return history.map((e) => {
    if (e.feasible) {
      front.push([...e.objectives]);
      hv = frontHypervolume(op, front, reference);
    }
    return Math.max(0, 1 - hv / exactHv);
  });
}

/**
 * For two objectives: exact evaluations NSGA-II (Deb et al. 2002) and random search need, on the
 * exact evaluator, before the hypervolume of their feasible designs comes within `target` of the
 * exact front's (same reference point), over several seeds.
 * @param problem - a two-objective problem.
 * @param reference - the reference point fixed from the exact front.
 * @param exactHv - the exact front's hypervolume.
 * @param budgets - seeds, target, and the search budget, of which fronts get five times as much
 *   (a front needs many more points than one optimum, and exact evaluations are cheap here).
 * @returns one entry per method; curves are (evaluations, hypervolume shortfall) of the first seed.
 */
export async function frontEvaluationsToTarget(
  problem: BenchProblem,
  reference: readonly number[],
  exactHv: number,
  budgets: TargetBudgets,
): Promise<EvaluationsToTarget[]> {
  const op = problem.optimization;
  const target = budgets.target ?? 0.005;
  const budget = 5 * budgets.search;
  const runs: [string, (seed: number) => Promise<OptimizationResult>][] = [
    ["nsga2", (seed) => optimizerNamed("nsga2").run(op, exactEvaluator(problem), { seed, maxEvaluations: budget, keepHistory: true })],
    ["random", (seed) => optimizerNamed("random").run(op, exactEvaluator(problem), { seed, maxEvaluations: budget, keepHistory: true })],
  ];
  const out: EvaluationsToTarget[] = [];
  for (const [method, run] of runs) {
    const t0 = performance.now();
    const evaluations: (number | null)[] = [];
    let curve: [number, number][] = [];
    for (let s = 0; s < budgets.seeds; s++) {
      const gaps = shortfalls(problem, (await run(s + 1)).history ?? [], reference, exactHv);
      if (s === 0) {
        const step = Math.max(1, Math.ceil(gaps.length / 100));
        curve = gaps.flatMap((g, i) => (i % step === 0 || i === gaps.length - 1 ? [[i + 1, g] as [number, number]] : []));
      }
      const hit = gaps.findIndex((g) => g <= target);
      evaluations.push(hit < 0 ? null : hit + 1);
    }
    out.push({ method, evaluations, median: medianEvaluations(evaluations), budget, curve, seconds: (performance.now() - t0) / 1000 });
  }
  return out;
}
