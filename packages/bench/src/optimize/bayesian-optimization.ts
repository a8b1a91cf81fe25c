import type { Evaluator } from "@floorcast/sampler";
import { fitGaussianProcess, type GivenHyperparameters, type Prediction, type TrainingData } from "@floorcast/surrogate";
import type { CommonOptions, EvaluatedDesign, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { createVariableCodec, type VariableCodec } from "@floorcast/sampler";
import { EvaluationSession } from "./evaluation-session.js";
import { expectedImprovement, probabilityOfFeasibility } from "./expected-improvement.js";
import { objectiveLoss } from "./feasibility-rules.js";
import { maximiseAcquisition } from "./maximise-acquisition.js";
import { randomUnseenDesign } from "./random-unseen-design.js";
import { createRng, unitSamples } from "./unit-samples.js";
import { numberOption, validateProblem } from "./validate-problem.js";

/** A model of the objective and constraints: anything with a Gaussian predict (a fitted GP). */
export interface AcquisitionModel {
  predict(x: readonly (readonly number[])[]): Prediction;
}

/** Options of {@link bayesianOptimization}. */
export interface BayesianOptimizationOptions extends CommonOptions {
  /** Initial Latin-hypercube designs (default max(5, 5·d), d = variables with more than one value; at most maxEvaluations). */
  readonly initialSamples?: number;
  /** Random candidates scored per iteration before local refinement of the best (default 1000). */
  readonly candidates?: number;
  /** Acquisition starts refined by pattern search on the model (default 5). */
  readonly acquisitionStarts?: number;
  /** Stop when the largest EI falls below this fraction of max(1, |best|) (default 0: spend the budget). */
  readonly eiTolerance?: number;
  /**
   * Default model only: hyperparameters are re-learned at every iteration while the GP has at most
   * 40 points, then whenever the number of points has grown by this factor since the last search
   * (default 1.2; 1 re-learns every iteration); in between the GP is conditioned on all points with
   * the last learned hyperparameters (one factorisation instead of a likelihood search).
   */
  readonly refitGrowth?: number;
  /**
   * Fits the model to (unit-coded inputs, [loss, g₁, …]) — default a Matérn-5/2 ARD GP from
   * fitGaussianProcess with its own seeded restarts; each target gets its own GP.
   */
  readonly fitModel?: (data: TrainingData, seed: number) => AcquisitionModel | Promise<AcquisitionModel>;
}

/** Coded vector → model input: unit coordinates for numeric variables, one-hot columns per categorical. */
function modelRow(codec: VariableCodec, x: readonly number[]): number[] {
  const u = codec.toUnit(x);
  const row: number[] = [];
  for (let i = 0; i < codec.dims; i++) {
    if (codec.categorical[i]) for (let k = 0; k < codec.count[i]!; k++) row.push(k === x[i] ? 1 : 0);
    else row.push(u[i]!);
  }
  return row;
}

/** Targets modelled: the loss, then each constraint as g = ±(output − value)/max(1, |value|) (≤ 0 feasible). */
function targetsOf(problem: OptimizationProblem, e: EvaluatedDesign): number[] {
  const g = (problem.constraints ?? []).map((c) => {
    const v = e.outputs[c.output]!;
    return (c.op === "<=" ? v - c.value : c.value - v) / Math.max(1, Math.abs(c.value));
  });
  return [objectiveLoss(problem, e), ...g];
}

function defaultFit(growth: number): (data: TrainingData, seed: number) => AcquisitionModel {
  let last: GivenHyperparameters[] | undefined;
  let lastSearchSize = 0;
  return (data, seed) => {
    const n = data.x.length;
    const reuse = last !== undefined && n > 40 && n < growth * lastSearchSize;
    if (!reuse) lastSearchSize = n;
    const gp = fitGaussianProcess(data, {
      seed,
      kernel: "matern52",
      inputBounds: { lower: data.inputs.map(() => 0), upper: data.inputs.map(() => 1) },
      noiseFloor: 1e-8,
      ...(reuse ? { hyperparameters: last } : {}),
    });
    last = gp.hyperparameters();
    return gp;
  };
}

/**
 * Bayesian optimization with expected improvement (EGO; Jones, Schonlau & Welch 1998, J. Global
 * Optim. 13:455–492) and exact evaluations in the loop: a Latin-hypercube initial design, then per
 * iteration fit one GP to the loss and one per constraint (independent GPs), and evaluate the
 * design maximising EI × Π P(gᵢ ≤ 0) (probability of feasibility; Schonlau, Welch & Jones 1998;
 * Gardner et al. 2014), or Π P(gᵢ ≤ 0) alone while nothing feasible is known. The acquisition is
 * maximised by multi-start on the GP: `candidates` legal random designs scored in one batch, the
 * best `acquisitionStarts` refined by mixed-variable pattern search on the model (lattice values
 * by whole steps, categoricals by level swaps; categoricals enter the GP one-hot). Invalid (NaN)
 * results are recorded as infeasible and left out of the fit; designs already evaluated are never
 * proposed again. `trace` holds the best feasible value after every exact evaluation.
 * @param problem - single-objective problem.
 * @param evaluator - the (exact) function evaluated.
 * @param options - maxEvaluations (required, finite), seed, initialSamples, candidates, acquisitionStarts, eiTolerance, fitModel.
 * @returns the result.
 */
export async function bayesianOptimization(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: BayesianOptimizationOptions,
): Promise<OptimizationResult> {
  const fn = "bayesianOptimization";
  validateProblem(fn, problem, evaluator, options ?? {}, "single");
  const budget = numberOption(fn, "maxEvaluations", options.maxEvaluations, NaN, 0, true);
  if (Number.isNaN(budget)) throw new RangeError(`${fn}: options.maxEvaluations must be given (finite)`);
  const dims = problem.variables.length;
  const free = createVariableCodec(problem.variables).count.filter((c) => c > 1).length;
  const n0 = Math.min(budget, numberOption(fn, "initialSamples", options.initialSamples, Math.max(5, 5 * free), 1, true));
  const nCand = numberOption(fn, "candidates", options.candidates, 1000, 1, true);
  const nStarts = numberOption(fn, "acquisitionStarts", options.acquisitionStarts, 5, 1, true);
  const eiTol = numberOption(fn, "eiTolerance", options.eiTolerance, 0, 0);
  if (options.fitModel !== undefined && typeof options.fitModel !== "function") throw new TypeError(`${fn}: options.fitModel must be a function`);
  const fit = options.fitModel ?? defaultFit(numberOption(fn, "refitGrowth", options.refitGrowth, 1.2, 1));
  const session = new EvaluationSession("bayesian-optimization", problem, evaluator, options, budget);
  const { codec } = session;
  const rng = createRng(options.seed);
  const seen = new Set<string>();
  const xs: number[][] = [];
  const ys: number[][] = [];
  const add = (x: number[], e: EvaluatedDesign): void => {
    seen.add(x.join(","));
    if (e.valid) {
      xs.push(modelRow(codec, x));
      ys.push(targetsOf(problem, e));
    }
  };
  const init = unitSamples(n0, dims, "lhs", rng).map((u) => codec.fromUnit(u));
  (await session.evaluate(init)).forEach((e, i) => add(init[i]!, e));
  const nTargets = 1 + (problem.constraints?.length ?? 0);
  const inputs = xs[0]?.map((_, j) => `u${j}`) ?? modelRow(codec, init[0] ?? codec.lower.slice()).map((_, j) => `u${j}`);
  const targets = Array.from({ length: nTargets }, (_, j) => (j === 0 ? "loss" : `g${j}`));
  for (let iter = 0; session.remaining > 0; iter++) {
    let next: number[] | undefined;
    if (xs.length >= 2) {
      const model = await fit({ inputs, targets, x: xs, y: ys }, (Number(options.seed ?? 0) | 0) + 1009 * iter);
      const best = session.best ? objectiveLoss(problem, session.best) : NaN;
      const score = (cands: readonly (readonly number[])[]): number[] => {
        const p = model.predict(cands.map((c) => modelRow(codec, c)));
        const sd = ("sdLatent" in p ? (p as { sdLatent: number[][] }).sdLatent : p.sd) ?? p.mean.map((r) => r.map(() => 0));
        return cands.map((c, r) => {
          if (seen.has(c.join(","))) return -1;
          let pof = 1;
          for (let j = 1; j < nTargets; j++) pof *= probabilityOfFeasibility(p.mean[r]![j]!, sd[r]![j]!);
          return Number.isNaN(best) ? pof : expectedImprovement(p.mean[r]![0]!, sd[r]![0]!, best) * pof;
        });
      };
      // multi-start pattern search on the model from every start at once (one predict call per step)
      const found = maximiseAcquisition(codec, score, rng, { candidates: nCand, starts: nStarts, maxSteps: 60, positiveOnly: false });
      const bestScore = found.score;
      next = found.x;
      if (eiTol > 0 && session.best && bestScore < eiTol * Math.max(1, Math.abs(best))) return session.result("converged");
      if (bestScore <= 0) next = undefined;
    }
    if (next === undefined) {
      next = randomUnseenDesign(codec, rng, seen);
      if (next === undefined) return session.result("complete");
    }
    const [e] = await session.evaluate([next]);
    if (e === undefined) break;
    add(next, e);
  }
  return session.result("budget");
}
