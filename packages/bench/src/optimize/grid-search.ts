import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { createVariableCodec, type VariableCodec } from "@floorcast/sampler";
import { EvaluationSession } from "./evaluation-session.js";
import { numberOption, validateProblem } from "./validate-problem.js";

/** Options of {@link gridSearch}. */
export interface GridSearchOptions extends CommonOptions {
  /**
   * Points per variable: one number for all, or a record by variable name. Plain continuous
   * variables get that many evenly spaced points including both bounds; lattice variables
   * (integer, stepped) get every lattice value when there are at most that many, else that many
   * evenly spaced lattice values including both ends; categoricals always get every level.
   * Default 11.
   */
  readonly resolution?: number | Readonly<Record<string, number>>;
  /** Designs per evaluator call (default 256). */
  readonly batchSize?: number;
}

function axisValues(codec: VariableCodec, i: number, res: number): number[] {
  const lo = codec.lower[i]!;
  const hi = codec.upper[i]!;
  const n = codec.count[i]!;
  if (codec.categorical[i]) return Array.from({ length: n }, (_, k) => k);
  if (n <= res) return Array.from({ length: n }, (_, k) => codec.snap(i, lo + k * codec.step[i]!));
  if (res === 1 || hi === lo) return [codec.snap(i, (lo + hi) / 2)];
  const vals = Array.from({ length: res }, (_, k) => codec.snap(i, lo + ((hi - lo) * k) / (res - 1)));
  return [...new Set(vals)];
}

/**
 * The axis values of the full-factorial grid gridSearch would evaluate.
 * @param problem - the problem (validated by the caller).
 * @param resolution - as in {@link GridSearchOptions.resolution}.
 * @returns one array of coded values per variable and the total count (their product).
 */
export function gridAxes(
  problem: OptimizationProblem,
  resolution: GridSearchOptions["resolution"] = 11,
): { axes: number[][]; count: number } {
  const codec = createVariableCodec(problem.variables);
  const axes = problem.variables.map((v, i) => {
    const r = typeof resolution === "number" ? resolution : (resolution[v.name] ?? 11);
    if (!Number.isInteger(r) || r < 1) {
      throw new RangeError(`gridSearch: options.resolution for ${v.name} must be an integer ≥ 1, got ${r}`);
    }
    return axisValues(codec, i, r);
  });
  return { axes, count: axes.reduce((p, a) => p * a.length, 1) };
}

/**
 * Exhaustive grid search: evaluates every point of a full-factorial grid (step-aware; see
 * {@link GridSearchOptions.resolution}) in batches, reporting progress after each batch. The
 * baseline every other optimizer is measured against (common practice).
 * Throws RangeError when the grid has more points than `maxEvaluations`, rather than
 * evaluating a biased part of it.
 * @param problem - variables, objectives, constraints (any number of objectives).
 * @param evaluator - the function evaluated.
 * @param options - resolution, batchSize, maxEvaluations, keepHistory, onProgress.
 * @returns the result; `evaluations` equals the grid's count.
 */
export async function gridSearch(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: GridSearchOptions = {},
): Promise<OptimizationResult> {
  validateProblem("gridSearch", problem, evaluator, options);
  const batchSize = numberOption("gridSearch", "batchSize", options.batchSize, 256, 1, true);
  const { axes, count } = gridAxes(problem, options.resolution);
  const budget = options.maxEvaluations ?? Infinity;
  if (budget === 0) return new EvaluationSession("grid", problem, evaluator, options, 0).result("budget");
  if (count > budget) {
    throw new RangeError(`gridSearch: the grid has ${count} points, more than options.maxEvaluations ${budget}`);
  }
  const session = new EvaluationSession("grid", problem, evaluator, options, count);
  const idx = axes.map(() => 0);
  let batch: number[][] = [];
  for (let n = 0; n < count; n++) {
    batch.push(idx.map((k, i) => axes[i]![k]!));
    for (let i = idx.length - 1; i >= 0; i--) {
      idx[i]!++;
      if (idx[i]! < axes[i]!.length) break;
      idx[i] = 0;
    }
    if (batch.length === batchSize || n === count - 1) {
      await session.evaluate(batch);
      batch = [];
    }
  }
  return session.result("complete");
}
