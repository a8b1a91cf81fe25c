import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, EvaluatedDesign, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { EvaluationSession } from "./evaluation-session.js";
import { objectiveLoss } from "./feasibility-rules.js";
import { crowdingDistance, fastNonDominatedSort } from "./nondominated-sort.js";
import { createRng, unitSamples } from "./unit-samples.js";
import { numberOption, validateProblem } from "./validate-problem.js";
import { makeOffspring, variationSettings, type VariationSettings } from "./variation-operators.js";

/** Options of {@link nsga2}. */
export interface Nsga2Options extends CommonOptions, Partial<VariationSettings> {
  /** Population size N (even, ≥ 4; default max(40, 10·dims) rounded up to even). */
  readonly populationSize?: number;
}

interface Individual {
  readonly x: number[];
  readonly e: EvaluatedDesign;
  readonly losses: number[];
  readonly violation: number;
  rank: number;
  crowding: number;
}

/**
 * NSGA-II (Deb, Pratap, Agarwal & Meyarivan 2002, IEEE TEC 6(2)) for two or more objectives:
 * fast non-dominated sort and crowding distance under constrained domination (§VI), binary
 * tournament by the crowded-comparison operator, SBX crossover and polynomial mutation (with the
 * mixed-variable handling of the genetic algorithm: lattice values stay on the lattice,
 * categoricals are exchanged and resampled, duplicates mutated again), and elitist (N + N) survival. Invalid (NaN)
 * designs carry infinite violation, so they rank last.
 * @param problem - problem with ≥ 2 objectives.
 * @param evaluator - the function evaluated.
 * @param options - maxEvaluations (default 100 generations), seed, populationSize, variation settings.
 * @returns the result; `front` is the feasible non-dominated set of every design evaluated.
 */
export async function nsga2(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: Nsga2Options = {},
): Promise<OptimizationResult> {
  const fn = "nsga2";
  validateProblem(fn, problem, evaluator, options, "multi");
  const dims = problem.variables.length;
  const defPop = Math.max(40, 10 * dims);
  const n = numberOption(fn, "populationSize", options.populationSize, defPop + (defPop % 2), 4, true);
  if (n % 2 !== 0) throw new RangeError(`${fn}: options.populationSize must be even, got ${n}`);
  const settings = variationSettings(fn, dims, options);
  const session = new EvaluationSession("nsga2", problem, evaluator, {
    ...options,
    maxEvaluations: options.maxEvaluations ?? n * 100,
  });
  const rng = createRng(options.seed);
  const m = problem.objectives.length;
  const make = (x: number[], e: EvaluatedDesign): Individual => ({
    x,
    e,
    losses: Array.from({ length: m }, (_, k) => (e.valid ? objectiveLoss(problem, e, k) : Infinity)),
    violation: e.feasible ? 0 : e.violation > 0 ? e.violation : Infinity,
    rank: 0,
    crowding: 0,
  });
  const rankAndSelect = (all: Individual[], keep: number): Individual[] => {
    const out: Individual[] = [];
    fastNonDominatedSort(all).forEach((front, r) => {
      if (out.length >= keep) return;
      const members = front.map((i) => all[i]!);
      const cd = crowdingDistance(members.map((p) => p.losses.map((v) => (Number.isFinite(v) ? v : 0))));
      members.forEach((p, j) => {
        p.rank = r;
        p.crowding = cd[j]!;
      });
      if (out.length + members.length > keep) members.sort((a, b) => b.crowding - a.crowding);
      out.push(...members.slice(0, keep - out.length));
    });
    return out;
  };
  const xs0 = unitSamples(n, dims, "lhs", rng).map((u) => session.codec.fromUnit(u));
  const e0 = await session.evaluate(xs0);
  let pop = rankAndSelect(e0.map((e, i) => make(xs0[i]!, e)), n);
  const tournament = (): Individual => {
    const a = pop[Math.floor(rng() * pop.length)]!;
    const b = pop[Math.floor(rng() * pop.length)]!;
    if (a.rank !== b.rank) return a.rank < b.rank ? a : b;
    return a.crowding >= b.crowding ? a : b;
  };
  while (session.remaining > 0 && pop.length > 0) {
    const children = makeOffspring(session.codec, n, () => tournament().x, pop.map((p) => p.x), settings, rng);
    const scored = await session.evaluate(children);
    pop = rankAndSelect([...pop, ...scored.map((e, i) => make(children[i]!, e))], n);
  }
  return session.result("budget");
}
