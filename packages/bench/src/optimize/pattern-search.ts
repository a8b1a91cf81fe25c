import type { CommonOptions, Design, EvaluatedDesign, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import type { Evaluator, VariableCodec } from "@floorcast/sampler";
import { EvaluationSession } from "./evaluation-session.js";
import { compareFeasibility } from "./feasibility-rules.js";
import { numberOption, validateProblem } from "./validate-problem.js";

/** Options of {@link patternSearch}. */
export interface PatternSearchOptions extends CommonOptions {
  /** Initial poll size as a fraction of each variable's range (default 0.1). */
  readonly initialStep?: number;
  /** Stop when the poll size falls below this fraction and no lattice move helps (default 1e-6). */
  readonly minStep?: number;
}

/** Poll points around x: ±Δ per numeric coordinate (≥ one lattice step), every other level per categorical. */
export function pollPoints(codec: VariableCodec, x: readonly number[], delta: number): number[][] {
  const out: number[][] = [];
  const seen = new Set<string>([x.join(",")]);
  const push = (y: number[]): void => {
    const key = y.join(",");
    if (!seen.has(key)) {
      seen.add(key);
      out.push(y);
    }
  };
  for (let i = 0; i < codec.dims; i++) {
    if (codec.categorical[i]) {
      for (let k = 0; k < codec.count[i]!; k++) if (k !== x[i]) push(x.map((v, j) => (j === i ? k : v)));
      continue;
    }
    const range = codec.upper[i]! - codec.lower[i]!;
    if (range === 0) continue;
    const s = codec.step[i]!;
    const d = s > 0 ? Math.max(1, Math.round(delta * (codec.count[i]! - 1))) * s : delta * range;
    for (const sign of [1, -1]) push(x.map((v, j) => (j === i ? codec.snap(i, v + sign * d) : v)));
  }
  return out;
}

/**
 * Exact local refinement by generalised pattern search (compass search; Torczon 1997, SIAM J.
 * Optim. 7(1); Kolda, Lewis & Torczon 2003, SIAM Review 45(3)) adapted to mixed variables:
 * each iteration polls ±Δ along every numeric coordinate (lattice variables move by whole
 * steps, at least one) and every other level of each categorical, all in one evaluator call;
 * moves to the best poll point by Deb's feasibility rules if it improves, else halves Δ.
 * Intended for a small budget of exact evaluations after a surrogate search.
 * @param problem - single-objective problem.
 * @param evaluator - usually the exact evaluator.
 * @param start - the design to refine (evaluated first; counts in the budget).
 * @param options - maxEvaluations (required, finite), initialStep, minStep.
 * @returns the result; `best` is the best feasible design met (null if none).
 */
export async function patternSearch(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  start: Design,
  options: PatternSearchOptions,
): Promise<OptimizationResult> {
  const fn = "patternSearch";
  validateProblem(fn, problem, evaluator, options ?? {}, "single");
  const budget = numberOption(fn, "maxEvaluations", options.maxEvaluations, NaN, 0, true);
  if (Number.isNaN(budget)) throw new RangeError(`${fn}: options.maxEvaluations must be given (finite)`);
  let delta = numberOption(fn, "initialStep", options.initialStep, 0.1, Number.MIN_VALUE);
  const minStep = numberOption(fn, "minStep", options.minStep, 1e-6, 0);
  if (typeof start !== "object" || start === null) throw new TypeError(`${fn}: start must be a design object`);
  const session = new EvaluationSession("pattern-search", problem, evaluator, options, budget);
  let x = session.codec.fromDesign(fn, start);
  const first = await session.evaluate([x]);
  if (first.length === 0) return session.result("budget");
  let current: EvaluatedDesign = first[0]!;
  const cache = new Map<string, EvaluatedDesign>([[x.join(","), current]]);
  for (;;) {
    const polls = pollPoints(session.codec, x, delta);
    if (polls.length === 0) return session.result("converged");
    const fresh = polls.filter((p) => !cache.has(p.join(",")));
    const got = await session.evaluate(fresh);
    got.forEach((e, i) => cache.set(fresh[i]!.join(","), e));
    if (got.length < fresh.length) polls.splice(0, polls.length, ...polls.filter((p) => cache.has(p.join(","))));
    const scored = polls.map((p) => cache.get(p.join(","))!);
    let bestIdx = -1;
    scored.forEach((e, i) => {
      if (compareFeasibility(problem, e, bestIdx < 0 ? current : scored[bestIdx]!) < 0) bestIdx = i;
    });
    if (bestIdx >= 0) {
      x = polls[bestIdx]!;
      current = scored[bestIdx]!;
    } else {
      if (delta < minStep) return session.result("converged");
      delta /= 2;
    }
    if (session.remaining === 0 && fresh.length > 0) return session.result("budget");
  }
}
