import { hypervolume } from "../optimize/hypervolume.js";
import type { OptimizationProblem } from "../optimize/optimization-problem.js";

/**
 * The reference point of a two-objective comparison, fixed from the exact front: each objective's
 * worst front value moved 10% of the front's range further out (common practice, so the front's
 * extreme points still count).
 * @param problem - the problem (its senses).
 * @param exactFront - exact front objective vectors (non-empty).
 */
export function frontReference(problem: OptimizationProblem, exactFront: readonly (readonly number[])[]): number[] {
  return problem.objectives.map((o, k) => {
    const v = exactFront.map((p) => p[k]!);
    const lo = Math.min(...v);
    const hi = Math.max(...v);
    const margin = 0.1 * (hi - lo || Math.abs(hi) || 1);
    return o.sense === "max" ? lo - margin : hi + margin;
  });
}

/**
 * Hypervolume of a front for a problem's senses against a reference point (exact 2-D sweep of
 * `hypervolume`, Zitzler & Thiele 1998).
 * @param problem - the problem.
 * @param points - objective vectors.
 * @param reference - from {@link frontReference}.
 */
export function frontHypervolume(
  problem: OptimizationProblem,
  points: readonly (readonly number[])[],
  reference: readonly number[],
): number {
  return hypervolume(points, reference, problem.objectives.map((o) => o.sense));
}
