import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { EvaluationSession } from "./evaluation-session.js";
import { createRng, unitSamples } from "./unit-samples.js";
import { numberOption, validateProblem } from "./validate-problem.js";

/** Options of {@link randomSearch}. */
export interface RandomSearchOptions extends CommonOptions {
  /** Sampling design: independent uniform ("random", default) or Latin hypercube ("lhs"). */
  readonly design?: "random" | "lhs";
  /** Designs per evaluator call (default 256). */
  readonly batchSize?: number;
}

/**
 * Random search (Brooks 1958; Bergstra & Bengio 2012) or Latin-hypercube search (McKay,
 * Beckman & Conover 1979): evaluates `maxEvaluations` designs drawn from the unit cube and
 * mapped to the variables — lattice (integer, stepped) values and categorical levels by equal
 * strata, so an LHS column is balanced over the levels. Any number of objectives.
 * @param problem - the problem.
 * @param evaluator - the function evaluated.
 * @param options - maxEvaluations (required, finite), design, seed, batchSize.
 * @returns the result with `evaluations` = maxEvaluations.
 */
export async function randomSearch(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: RandomSearchOptions,
): Promise<OptimizationResult> {
  const fn = "randomSearch";
  validateProblem(fn, problem, evaluator, options ?? {});
  const n = numberOption(fn, "maxEvaluations", options.maxEvaluations, NaN, 0, true);
  if (Number.isNaN(n)) throw new RangeError(`${fn}: options.maxEvaluations must be given (finite)`);
  if (options.design !== undefined && options.design !== "random" && options.design !== "lhs") {
    throw new RangeError(`${fn}: options.design must be "random" or "lhs"`);
  }
  const batchSize = numberOption(fn, "batchSize", options.batchSize, 256, 1, true);
  const design = options.design ?? "random";
  const session = new EvaluationSession(design === "lhs" ? "latin-hypercube" : "random", problem, evaluator, options, n);
  const rows = unitSamples(n, problem.variables.length, design, createRng(options.seed)).map((u) => session.codec.fromUnit(u));
  for (let i = 0; i < rows.length; i += batchSize) await session.evaluate(rows.slice(i, i + batchSize));
  return session.result(n === 0 ? "budget" : "complete");
}
