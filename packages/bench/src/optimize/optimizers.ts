import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { bayesianOptimization, type BayesianOptimizationOptions } from "./bayesian-optimization.js";
import { geneticAlgorithm } from "./genetic-algorithm.js";
import { gridSearch } from "./grid-search.js";
import { nsga2 } from "./nsga2.js";
import { particleSwarm } from "./particle-swarm.js";
import { projectedGradient } from "./projected-gradient.js";
import { randomSearch } from "./random-search.js";

/** Options every registered optimizer takes: the common ones, a grid resolution and the method's own extras. */
export type OptimizerRunOptions = CommonOptions & { readonly gridPoints?: number } & Readonly<Record<string, unknown>>;

/** One registered optimizer: its `--optimizer` name, how many objectives it optimizes, and how to run it. */
export interface OptimizerEntry {
  readonly name: string;
  /** "single": the first objective (Deb's feasibility rules); "two": a front of two objectives. */
  readonly objectives: "single" | "two";
  /** One line for the help text and the README table. */
  readonly summary: string;
  run(problem: OptimizationProblem, evaluator: Evaluator, options: OptimizerRunOptions): Promise<OptimizationResult>;
}

/**
 * Every optimizer the CLI (`optimize --optimizer`), the benchmark harness and the benchmarks run, by name. Adding
 * one: its file under `optimize/` and one line here.
 */
export const OPTIMIZERS: readonly OptimizerEntry[] = [
  { name: "grid", objectives: "single", summary: "exhaustive grid", run: (p, e, o) => gridSearch(p, e, { ...withoutBudget(o), resolution: o.gridPoints ?? 21 }) },
  { name: "random", objectives: "single", summary: "random search", run: (p, e, o) => randomSearch(p, e, o) },
  { name: "lhs", objectives: "single", summary: "Latin-hypercube search", run: (p, e, o) => randomSearch(p, e, { ...o, design: "lhs" }) },
  { name: "gradient", objectives: "single", summary: "multi-start projected gradient", run: (p, e, o) => projectedGradient(p, e, o) },
  { name: "pso", objectives: "single", summary: "particle swarm", run: (p, e, o) => particleSwarm(p, e, o) },
  { name: "ga", objectives: "single", summary: "real-coded genetic algorithm", run: (p, e, o) => geneticAlgorithm(p, e, o) },
  { name: "nsga2", objectives: "two", summary: "NSGA-II front", run: (p, e, o) => nsga2(p, e, o) },
  { name: "bo", objectives: "single", summary: "Bayesian optimization (expected improvement)", run: (p, e, o) => bayesianOptimization(p, e, o as BayesianOptimizationOptions) },
];

/**
 * The registered optimizer of a name.
 * @param name - e.g. "ga".
 * @returns the entry.
 * @throws RangeError naming the registered names when there is none.
 */
export function optimizerNamed(name: string): OptimizerEntry {
  const entry = OPTIMIZERS.find((o) => o.name === name);
  if (!entry) throw new RangeError(`optimizerNamed: no optimizer "${name}"; use one of ${OPTIMIZERS.map((o) => o.name).join(", ")}`);
  return entry;
}

/** A grid evaluates its own count: the budget does not cut it short. */
function withoutBudget(o: OptimizerRunOptions): OptimizerRunOptions {
  const rest: Record<string, unknown> = { ...o };
  delete rest.maxEvaluations;
  return rest as OptimizerRunOptions;
}
