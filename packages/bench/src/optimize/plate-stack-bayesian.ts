import type { Evaluator } from "@floorcast/sampler";
import { PLATE_STACK_OUTPUTS, fitPlateStack, plateStackColumns, type GaussianProcessOptions, type PlateStackSurrogate } from "@floorcast/surrogate";
import type { CommonOptions, EvaluatedDesign, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { EvaluationSession } from "./evaluation-session.js";
import { maximiseAcquisition } from "./maximise-acquisition.js";
import { randomUnseenDesign } from "./random-unseen-design.js";
import { createRng, unitSamples } from "./unit-samples.js";
import { numberOption, validateProblem } from "./validate-problem.js";

/** Options of {@link plateStackBayesianOptimization}. */
export interface PlateStackBayesianOptions extends CommonOptions {
  /** Initial Latin-hypercube designs (default max(6, 2·d)). */
  readonly initialSamples?: number;
  /** Random candidates scored per iteration before pattern search on the acquisition (default 500). */
  readonly candidates?: number;
  /** Acquisition starts refined by pattern search (default 3). */
  readonly acquisitionStarts?: number;
  /** Quasi-Monte Carlo draws through the rule (default 64). */
  readonly draws?: number;
  /** Options of the inner GPs (default: 2 restarts, 100 iterations). */
  readonly gp?: GaussianProcessOptions;
}

/**
 * Bayesian optimization through the stacking rule (composite-function BO: Astudillo & Frazier 2019, ICML): after a
 * Latin-hypercube start, each iteration fits a plate-stack surrogate to every exact evaluation so far — the
 * evaluator must report the plate profile (`sample --plate-profile` columns) beside its outputs — and evaluates the
 * design maximising the expected improvement computed by quasi-Monte Carlo through the rule:
 * EI(x) = (1/S) Σ_s max(0, ±(f_s(x) − best)) · 1[constraints hold in draw s], where each draw s passes one
 * standard-normal sample of every inner model's posterior through the exact arithmetic (the probability of
 * feasibility alone while nothing feasible is known). Expected improvement: Jones, Schonlau & Welch (1998).
 * The acquisition is maximised by random candidates and pattern search on the model.
 * @param problem - single-objective problem; its outputs must be plate-stack outputs (gfa, floors, height, …).
 * @param evaluator - the exact evaluator, reporting the plate profile with its outputs.
 * @param options - maxEvaluations (required), seed, initialSamples, candidates, acquisitionStarts, draws, gp.
 * @returns the result; `trace` holds the best feasible value after every exact evaluation.
 */
export async function plateStackBayesianOptimization(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: PlateStackBayesianOptions,
): Promise<OptimizationResult> {
  const fn = "plateStackBayesianOptimization";
  validateProblem(fn, problem, evaluator, options ?? {}, "single");
  const budget = numberOption(fn, "maxEvaluations", options.maxEvaluations, NaN, 0, true);
  if (Number.isNaN(budget)) throw new RangeError(`${fn}: options.maxEvaluations must be given (finite)`);
  const outputs = [...new Set([...problem.objectives.map((o) => o.output), ...(problem.constraints ?? []).map((c) => c.output)])];
  const cols = outputs.map((o) => (PLATE_STACK_OUTPUTS as readonly string[]).indexOf(o));
  if (cols.some((c) => c < 0)) throw new RangeError(`${fn}: the plate stack predicts ${PLATE_STACK_OUTPUTS.join(", ")}; the problem asks ${outputs.join(", ")}`);
  const session = new EvaluationSession("bo-plate-stack", problem, evaluator, options, budget);
  const { codec } = session;
  const dims = problem.variables.length;
  const free = codec.count.filter((c) => c > 1).length;
  const n0 = Math.min(budget, numberOption(fn, "initialSamples", options.initialSamples, Math.max(6, 2 * free), 1, true));
  const nCand = numberOption(fn, "candidates", options.candidates, 500, 1, true);
  const nStarts = numberOption(fn, "acquisitionStarts", options.acquisitionStarts, 3, 1, true);
  const draws = numberOption(fn, "draws", options.draws, 64, 1, true);
  const rng = createRng(options.seed);
  const inputs = problem.variables.map((v) => v.name);
  const seen = new Set<string>();
  const xs: number[][] = [];
  const profiles: Record<string, number>[] = [];
  const add = (x: number[], e: EvaluatedDesign): void => {
    seen.add(x.join(","));
    if (!e.valid) return;
    if (typeof e.outputs.plateArea_1 !== "number") {
      throw new RangeError(`${fn}: the evaluator reports no plate profile (plateArea_k, plateWidth_k, rule_* beside its outputs)`);
    }
    xs.push(x);
    profiles.push(e.outputs as Record<string, number>);
  };
  const init = unitSamples(n0, dims, "lhs", rng).map((u) => codec.fromUnit(u));
  (await session.evaluate(init)).forEach((e, i) => add(init[i]!, e));
  const sense = problem.objectives[0]!.sense === "max" ? 1 : -1;
  const objCol = cols[0]!;
  const cons = (problem.constraints ?? []).map((c) => ({ col: cols[outputs.indexOf(c.output)]!, op: c.op, value: c.value }));
  for (let iter = 0; session.remaining > 0; iter++) {
    let next: number[] | undefined;
    if (xs.length >= 2) {
      const { columns, missing } = plateStackColumns(Object.keys(profiles[0]!));
      if (missing.length > 0) throw new RangeError(`${fn}: the evaluator reports no ${missing.join(", ")} (a plate profile is needed)`);
      const model: PlateStackSurrogate = await fitPlateStack(
        { inputs, x: xs, columns: Object.fromEntries(columns.map((c) => [c, profiles.map((p) => p[c]!)])) },
        { seed: (Number(options.seed ?? 0) | 0) + 1009 * iter, draws, gp: options.gp ?? { restarts: 2, maxIterations: 100 } },
      );
      const best = session.best?.feasible ? session.best.objectives[0]! : NaN;
      const score = (cands: readonly (readonly number[])[]): number[] => {
        const samples = model.predictMassing(cands, true).samples!;
        return cands.map((c, r) => {
          if (seen.has(c.join(","))) return -1;
          let acc = 0;
          for (const s of samples[r]!) {
            const ok = cons.every((k) => (k.op === "<=" ? s[k.col]! <= k.value : s[k.col]! >= k.value));
            if (!ok) continue;
            acc += Number.isNaN(best) ? 1 : Math.max(0, sense * (s[objCol]! - best));
          }
          return acc / samples[r]!.length;
        });
      };
      const found = maximiseAcquisition(codec, score, rng, { candidates: nCand, starts: nStarts, maxSteps: 40, positiveOnly: true });
      if (found.score > 0) next = found.x;
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
