import type { EvaluatedDesign, OptimizationProblem } from "./optimization-problem.js";

/**
 * The objective as a loss to minimise: the value for "min", its negation for "max".
 * @param problem - the problem (its objectives give the senses).
 * @param e - an evaluated design.
 * @param k - objective index (default 0).
 */
export function objectiveLoss(problem: OptimizationProblem, e: EvaluatedDesign, k = 0): number {
  const v = e.objectives[k]!;
  return problem.objectives[k]!.sense === "max" ? -v : v;
}

/**
 * Deb's feasibility rules (Deb 2000, "An efficient constraint handling method for genetic
 * algorithms", CMAME 186): a feasible design beats an infeasible one; two feasible designs
 * compare by objective; two infeasible ones by total constraint violation.
 * @returns negative when `a` is better, positive when `b` is, 0 when tied.
 */
export function compareFeasibility(problem: OptimizationProblem, a: EvaluatedDesign, b: EvaluatedDesign): number {
  if (a.feasible && b.feasible) return objectiveLoss(problem, a) - objectiveLoss(problem, b);
  if (a.feasible) return -1;
  if (b.feasible) return 1;
  if (a.violation === b.violation) return 0;
  return a.violation < b.violation ? -1 : 1;
}
