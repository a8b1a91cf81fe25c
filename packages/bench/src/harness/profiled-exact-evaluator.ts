import type { Evaluator } from "@floorcast/sampler";
import type { Design, Outputs } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";

/**
 * The exact evaluator of a massing problem reporting the plate profile beside its outputs (the numeric columns of
 * `sample --plate-profile`), as Bayesian optimization through the stacking rule needs. A design that cannot be
 * evaluated gives the problem's NaN outputs without a profile.
 * @param problem - a massing problem (with plateProfile).
 * @returns the evaluator.
 */
export function profiledExactEvaluator(problem: BenchProblem): Evaluator<Outputs> {
  const profileOf = problem.plateProfile;
  if (profileOf === undefined) throw new RangeError(`profiledExactEvaluator: ${problem.name} reports no plate profile`);
  return {
    name: `exact with plate profile: ${problem.name}`,
    concurrency: 1,
    close: async () => {},
    evaluate(batch: readonly Design[]): Promise<readonly Outputs[]> {
      return Promise.resolve(
        batch.map((d) => {
          const out = problem.evaluate(d);
          if (!Object.values(out).every(Number.isFinite)) return out;
          const profile = profileOf(d);
          const numeric = Object.fromEntries(Object.entries(profile).filter((e): e is [string, number] => typeof e[1] === "number"));
          return { ...numeric, ...out };
        }),
      );
    },
  };
}
