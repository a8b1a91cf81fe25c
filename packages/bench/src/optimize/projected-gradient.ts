import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, EvaluatedDesign, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { EvaluationSession } from "./evaluation-session.js";
import { compareFeasibility, objectiveLoss } from "./feasibility-rules.js";
import { pollPoints } from "./pattern-search.js";
import { createRng, unitSamples } from "./unit-samples.js";
import { numberOption, validateProblem } from "./validate-problem.js";

/** Options of {@link projectedGradient}. */
export interface ProjectedGradientOptions extends CommonOptions {
  /** Number of starts from a Latin hypercube (default 8). */
  readonly starts?: number;
  /** Gradient iterations per start and discrete round (default 100). */
  readonly maxIterations?: number;
  /** Quadratic penalty weight μ on normalised violations, relative to |loss| at the start (default 100). */
  readonly penalty?: number;
  /** Finite-difference step in unit coordinates when the evaluator has no gradient (default 1e-6). */
  readonly fdStep?: number;
}

/** Penalised merit F = loss + μ·Σ(max(0, gᵢ)/sᵢ)², sᵢ = max(1, |valueᵢ|); Infinity when invalid. */
function merit(problem: OptimizationProblem, e: EvaluatedDesign, mu: number): number {
  if (!e.valid) return Infinity;
  let pen = 0;
  for (const c of problem.constraints ?? []) {
    const v = e.outputs[c.output]!;
    const g = (c.op === "<=" ? v - c.value : c.value - v) / Math.max(1, Math.abs(c.value));
    if (g > 0) pen += g * g;
  }
  return objectiveLoss(problem, e) + mu * pen;
}

/**
 * Multi-start projected gradient descent with an Armijo backtracking line search (Bertsekas 1976,
 * IEEE TAC 21(2); Nocedal & Wright 2006, §3.1, §16.7) whose first trial step is the spectral
 * Barzilai–Borwein step (Birgin, Martínez & Raydan 2000, SIAM J. Optim. 10(4)), on the penalised merit
 * F = loss + μ·Σ max(0, gᵢ)²: steps x ← P(x − α∇F) with P the projection onto the box, in unit
 * coordinates. The gradient comes from `evaluator.gradient` (e.g. a surrogate's analytic
 * gradient) or, without it, from central finite differences (one-sided at a bound), whose 2·d
 * designs per gradient count as evaluations. Only plain continuous variables move by gradient;
 * integer, stepped and categorical variables are held at their start values and, once the
 * gradient phase stalls (relative decrease below 1e-12), polled by whole steps and other levels; an improving discrete move
 * restarts the gradient phase. The reported best is the best feasible design evaluated.
 * @param problem - single-objective problem.
 * @param evaluator - the function evaluated (with or without gradient).
 * @param options - maxEvaluations (default 2000), seed, starts, maxIterations, penalty, fdStep.
 * @returns the result; `gradientCalls` counts evaluator.gradient calls.
 */
export async function projectedGradient(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: ProjectedGradientOptions = {},
): Promise<OptimizationResult> {
  const fn = "projectedGradient";
  validateProblem(fn, problem, evaluator, options, "single");
  const starts = numberOption(fn, "starts", options.starts, 8, 1, true);
  const maxIter = numberOption(fn, "maxIterations", options.maxIterations, 100, 1, true);
  const penalty = numberOption(fn, "penalty", options.penalty, 100, 0);
  const h = numberOption(fn, "fdStep", options.fdStep, 1e-6, Number.MIN_VALUE);
  const session = new EvaluationSession("projected-gradient", problem, evaluator, {
    ...options,
    maxEvaluations: options.maxEvaluations ?? 2000,
  });
  const { codec } = session;
  const free = codec.step.map((s, i) => s === 0 && codec.upper[i]! > codec.lower[i]!);
  const range = codec.lower.map((lo, i) => codec.upper[i]! - lo);
  const dims = codec.dims;
  const objective = problem.objectives[0]!;
  const sign = objective.sense === "max" ? -1 : 1;

  const gradient = async (x: number[], e: EvaluatedDesign, mu: number): Promise<number[] | null> => {
    const g = new Array<number>(dims).fill(0);
    if (session.hasGradient) {
      const [grad] = await session.gradient([x]);
      if (grad === undefined) return null;
      for (let j = 0; j < dims; j++) {
        if (!free[j]) continue;
        const name = codec.variables[j]!.name;
        let d = sign * (grad[objective.output]?.[name] ?? NaN);
        for (const c of problem.constraints ?? []) {
          const s = Math.max(1, Math.abs(c.value));
          const v = e.outputs[c.output]!;
          const viol = (c.op === "<=" ? v - c.value : c.value - v) / s;
          if (viol > 0) d += (2 * mu * viol * (c.op === "<=" ? 1 : -1) * (grad[c.output]?.[name] ?? NaN)) / s;
        }
        g[j] = d * range[j]!;
      }
      return g.every(Number.isFinite) ? g : null;
    }
    const pts: number[][] = [];
    const widths: number[] = [];
    for (let j = 0; j < dims; j++) {
      if (!free[j]) continue;
      const step = h * range[j]!;
      const hi = Math.min(codec.upper[j]!, x[j]! + step);
      const lo = Math.max(codec.lower[j]!, x[j]! - step);
      pts.push(x.map((v, k) => (k === j ? hi : v)), x.map((v, k) => (k === j ? lo : v)));
      widths.push((hi - lo) / range[j]!);
    }
    const ev = await session.evaluate(pts);
    if (ev.length < pts.length) return null;
    let k = 0;
    for (let j = 0; j < dims; j++) {
      if (!free[j]) continue;
      g[j] = (merit(problem, ev[2 * k]!, mu) - merit(problem, ev[2 * k + 1]!, mu)) / widths[k]!;
      k++;
    }
    return g.every(Number.isFinite) ? g : null;
  };

  const descend = async (x0: number[], e0: EvaluatedDesign, mu: number): Promise<[number[], EvaluatedDesign]> => {
    let x = x0;
    let e = e0;
    let f = merit(problem, e, mu);
    let alpha = NaN;
    let prev: { x: number[]; g: number[] } | null = null;
    for (let it = 0; it < maxIter && session.remaining > 0 && Number.isFinite(f); it++) {
      const g = await gradient(x, e, mu);
      if (g === null || g.every((v) => v === 0)) break;
      if (prev === null) alpha = 0.1 / Math.max(...g.map(Math.abs));
      else {
        // Spectral (Barzilai–Borwein) first trial step sᵀs/sᵀy in unit coordinates.
        let ss = 0;
        let sy = 0;
        for (let j = 0; j < dims; j++) {
          const sj = (x[j]! - prev.x[j]!) / (range[j]! || 1);
          ss += sj * sj;
          sy += sj * (g[j]! - prev.g[j]!);
        }
        alpha = sy > 0 ? Math.min(1e10, Math.max(1e-12, ss / sy)) : alpha * 4;
      }
      prev = { x, g };
      let moved = false;
      for (let bt = 0; bt < 30 && session.remaining > 0; bt++, alpha /= 2) {
        const y = x.map((v, j) => (free[j] ? codec.snap(j, v - alpha * g[j]! * range[j]!) : v));
        const decrease = y.reduce((s, v, j) => s + (g[j]! * (v - x[j]!)) / (range[j]! || 1), 0);
        if (decrease === 0) break;
        const [ey] = await session.evaluate([y]);
        if (ey === undefined) break;
        const fy = merit(problem, ey, mu);
        if (fy <= f + 1e-4 * decrease) {
          moved = f - fy > 1e-12 * Math.max(1, Math.abs(f));
          [x, e, f] = [y, ey, fy];
          break;
        }
      }
      if (!moved) break;
    }
    return [x, e];
  };

  const rng = createRng(options.seed);
  const startPoints = unitSamples(starts, dims, "lhs", rng).map((u) => codec.fromUnit(u));
  for (const s of startPoints) {
    const [e0] = await session.evaluate([s]);
    if (e0 === undefined) break;
    const mu = penalty * Math.max(1, Math.abs(objectiveLoss(problem, e0)) || 1);
    let [x, e] = await descend(s, e0, mu);
    for (let round = 0; round < maxIter && session.remaining > 0; round++) {
      const polls = pollPoints(codec, x, 0).filter((p) => p.some((v, j) => !free[j] && v !== x[j]));
      if (polls.length === 0) break;
      const ev = await session.evaluate(polls);
      let bi = -1;
      ev.forEach((c, i) => {
        if (merit(problem, c, mu) < merit(problem, bi < 0 ? e : ev[bi]!, mu) || (bi < 0 && compareFeasibility(problem, c, e) < 0 && !e.valid)) bi = i;
      });
      if (bi < 0) break;
      [x, e] = await descend(polls[bi]!, ev[bi]!, mu);
    }
  }
  return session.result(session.remaining === 0 ? "budget" : "complete");
}
