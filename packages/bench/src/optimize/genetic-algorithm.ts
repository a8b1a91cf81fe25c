import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, EvaluatedDesign, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { EvaluationSession } from "./evaluation-session.js";
import { compareFeasibility } from "./feasibility-rules.js";
import { createRng, unitSamples } from "./unit-samples.js";
import { numberOption, validateProblem } from "./validate-problem.js";
import { makeOffspring, variationSettings, type VariationSettings } from "./variation-operators.js";

/** Options of {@link geneticAlgorithm}. */
export interface GeneticAlgorithmOptions extends CommonOptions, Partial<VariationSettings> {
  /** Population size (even, ≥ 4; default max(20, 10·dims) rounded up to even). */
  readonly populationSize?: number;
  /** Tournament size for parent selection (≥ 2, default 2: binary tournament). */
  readonly tournamentSize?: number;
  /**
   * Growth of the polynomial mutation's distribution index over the run (≥ 0, default 200): generation by
   * generation ηm rises linearly from `mutationEta` to `mutationEta + mutationEtaGrowth` as the budget is spent,
   * so mutation explores early and refines late. 0 keeps ηm constant (the plain operator).
   */
  readonly mutationEtaGrowth?: number;
}

interface Member {
  readonly x: number[];
  readonly e: EvaluatedDesign;
}

/**
 * Real-coded genetic algorithm: Latin-hypercube initial population, tournament selection by
 * Deb's feasibility rules (Deb 2000, CMAME 186: feasible beats infeasible, feasible by objective,
 * infeasible by total violation), SBX crossover and polynomial mutation (Deb & Agrawal 1995),
 * and (μ + λ) survival of the best by the same rules. Integers and stepped variables stay on
 * their lattice inside the operators (mutation moves whole steps); categoricals are crossed
 * uniformly and mutated by resampling levels. A child equal to a population member or an earlier
 * child is mutated again (duplicate avoidance), so the budget is not spent re-evaluating designs. The mutation
 * narrows as the budget is spent (ηm rising linearly by `mutationEtaGrowth`; the time-dependent mutation idea of
 * Michalewicz 1992, "Genetic Algorithms + Data Structures = Evolution Programs", non-uniform mutation, applied to
 * the polynomial operator), which lets the elitist population refine an optimum it has found instead of
 * scattering its children over the range. Stops when `maxEvaluations` is spent.
 * @param problem - single-objective problem.
 * @param evaluator - the function evaluated.
 * @param options - maxEvaluations (default 50 generations), seed, populationSize, tournamentSize, variation settings,
 *   mutationEtaGrowth.
 * @returns the result.
 */
export async function geneticAlgorithm(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: GeneticAlgorithmOptions = {},
): Promise<OptimizationResult> {
  const fn = "geneticAlgorithm";
  validateProblem(fn, problem, evaluator, options, "single");
  const dims = problem.variables.length;
  const defPop = Math.max(20, 10 * dims);
  const pop = numberOption(fn, "populationSize", options.populationSize, defPop + (defPop % 2), 4, true);
  if (pop % 2 !== 0) throw new RangeError(`${fn}: options.populationSize must be even, got ${pop}`);
  const tsize = numberOption(fn, "tournamentSize", options.tournamentSize, 2, 2, true);
  const growth = numberOption(fn, "mutationEtaGrowth", options.mutationEtaGrowth, 200, 0);
  const settings = variationSettings(fn, dims, options);
  const session = new EvaluationSession("genetic-algorithm", problem, evaluator, {
    ...options,
    maxEvaluations: options.maxEvaluations ?? pop * 50,
  });
  const rng = createRng(options.seed);
  const cmp = (a: Member, b: Member): number => compareFeasibility(problem, a.e, b.e);
  const xs0 = unitSamples(pop, dims, "lhs", rng).map((u) => session.codec.fromUnit(u));
  const e0 = await session.evaluate(xs0);
  let population: Member[] = e0.map((e, i) => ({ x: xs0[i]!, e }));
  const tournament = (): Member => {
    let winner = population[Math.floor(rng() * population.length)]!;
    for (let t = 1; t < tsize; t++) {
      const c = population[Math.floor(rng() * population.length)]!;
      if (cmp(c, winner) < 0) winner = c;
    }
    return winner;
  };
  const budget = session.remaining; // after the initial population (Infinity without maxEvaluations: ηm stays put)
  while (session.remaining > 0 && population.length > 0) {
    const spent = Number.isFinite(budget) ? (budget - session.remaining) / budget : 0;
    const step = { ...settings, mutationEta: settings.mutationEta + growth * spent };
    const children = makeOffspring(session.codec, pop, () => tournament().x, population.map((m) => m.x), step, rng);
    const scored = await session.evaluate(children);
    const merged = [...population, ...scored.map((e, i) => ({ x: children[i]!, e }))];
    merged.sort(cmp);
    population = merged.slice(0, pop);
  }
  return session.result("budget");
}
