import type { Evaluator } from "@floorcast/sampler";
import type { EvaluatedDesign, OptimizationProblem } from "../optimize/optimization-problem.js";
import { scoreOutputs } from "../optimize/evaluation-session.js";
import { compareFeasibility } from "../optimize/feasibility-rules.js";

/** Where the reported design came from. */
export type ReportedSource = "surrogate-optimum" | "ranked-list" | "training-set" | "none";

/** The surrogate-driven design the benchmark reports, exactly re-evaluated. */
export interface ReevaluatedOptimum {
  /** The exactly evaluated design reported as optimal; always exactly feasible, or null when none was. */
  readonly exact: EvaluatedDesign | null;
  /** What the surrogate predicted for its own first choice. */
  readonly predicted: EvaluatedDesign | null;
  readonly source: ReportedSource;
  /** Exact evaluations spent re-evaluating. */
  readonly evaluations: number;
}

/** Distance of two designs in the unit cube of the problem's variables (a categorical counts 0 or 1). */
function unitDistance(problem: OptimizationProblem, a: EvaluatedDesign, b: EvaluatedDesign): number {
  let s = 0;
  for (const v of problem.variables) {
    const x = a.design[v.name];
    const y = b.design[v.name];
    if (v.kind === "categorical") s += x === y ? 0 : 1;
    else s += (((x as number) - (y as number)) / (v.max - v.min || 1)) ** 2;
  }
  return Math.sqrt(s);
}

/**
 * The harness's rule: every design reported as an optimum is re-evaluated exactly, and an exactly
 * infeasible design is never reported. The surrogate's best is evaluated first; when it is exactly
 * infeasible, the next `listLength − 1` distinct designs of the surrogate search (ranked by the
 * surrogate with Deb's feasibility rules) are evaluated and the best exactly-feasible one is
 * reported; failing that, the best exactly-feasible design of `fallback` (already exact, e.g. the
 * training set) is; failing that, nothing is. The list skips designs within `minDistance` (unit-cube
 * distance) of one already on it, so it is not ten copies of one infeasible point.
 * @param problem - single-objective problem (the first objective ranks).
 * @param searched - the surrogate search's evaluated designs (history or final population), surrogate-scored.
 * @param exact - the exact evaluator.
 * @param fallback - exactly evaluated designs to fall back on.
 * @param listLength - length of the ranked list tried (default 10).
 * @param minDistance - least unit-cube distance between listed designs (default 0.02).
 */
export async function reevaluateSurrogateOptimum(
  problem: OptimizationProblem,
  searched: readonly EvaluatedDesign[],
  exact: Evaluator,
  fallback: readonly EvaluatedDesign[] = [],
  listLength = 10,
  minDistance = 0.02,
): Promise<ReevaluatedOptimum> {
  const ranked: EvaluatedDesign[] = [];
  for (const e of [...searched].filter((e) => e.valid).sort((a, b) => compareFeasibility(problem, a, b))) {
    if (ranked.some((r) => unitDistance(problem, r, e) < minDistance)) continue;
    ranked.push(e);
    if (ranked.length >= listLength) break;
  }
  const predicted = ranked[0] ?? null;
  let evaluations = 0;
  const score = async (list: readonly EvaluatedDesign[]): Promise<EvaluatedDesign[]> => {
    evaluations += list.length;
    const outs = await exact.evaluate(list.map((e) => e.design));
    return list.map((e, i) => scoreOutputs(problem, e.design, outs[i]!));
  };
  const bestFeasible = (list: readonly EvaluatedDesign[]): EvaluatedDesign | null =>
    list.filter((e) => e.feasible).sort((a, b) => compareFeasibility(problem, a, b))[0] ?? null;
  if (predicted) {
    const [first] = await score([predicted]);
    if (first!.feasible) return { exact: first!, predicted, source: "surrogate-optimum", evaluations };
    const rest = bestFeasible(await score(ranked.slice(1)));
    if (rest) return { exact: rest, predicted, source: "ranked-list", evaluations };
  }
  const fromTraining = bestFeasible(fallback);
  if (fromTraining) return { exact: fromTraining, predicted, source: "training-set", evaluations };
  return { exact: null, predicted, source: "none", evaluations };
}
