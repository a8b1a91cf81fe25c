import type { Evaluator } from "@floorcast/sampler";
import type { CommonOptions, EvaluatedDesign, OptimizationProblem, OptimizationResult } from "./optimization-problem.js";
import { EvaluationSession } from "./evaluation-session.js";
import { compareFeasibility } from "./feasibility-rules.js";
import { createRng, unitSamples, type Rng } from "./unit-samples.js";
import { numberOption, validateProblem } from "./validate-problem.js";

/** Options of {@link particleSwarm}. */
export interface ParticleSwarmOptions extends CommonOptions {
  /** Number of particles (≥ 2, default max(20, 5·dims)). */
  readonly swarmSize?: number;
  /** Constriction coefficient χ (default 0.7298; Clerc & Kennedy 2002). */
  readonly constriction?: number;
  /** Cognitive and social acceleration c1 = c2 (default 2.05; Clerc & Kennedy 2002). */
  readonly acceleration?: number;
  /** Iterations in which no personal best improves before every particle but the leader restarts (default 10; 0 never). */
  readonly stallIterations?: number;
}

interface Particle {
  x: number[];
  v: number[];
  /** Level probabilities and their velocities, per categorical coordinate (empty arrays elsewhere). */
  q: number[][];
  w: number[][];
  best: number[];
  bestE: EvaluatedDesign;
}

function sampleLevel(q: readonly number[], rng: Rng): number {
  const total = q.reduce((a, b) => a + b, 0);
  if (!(total > 0)) return Math.floor(rng() * q.length);
  let r = rng() * total;
  for (let k = 0; k < q.length; k++) {
    r -= q[k]!;
    if (r < 0) return k;
  }
  return q.length - 1;
}

/**
 * Particle swarm optimization (Kennedy & Eberhart 1995) with the constriction coefficient of
 * Clerc & Kennedy (2002, IEEE TEC 6(1)): v ← χ[v + c1·r1·(p − x) + c2·r2·(g − x)], x ← x + v with
 * χ ≈ 0.7298 and c1 = c2 = 2.05 (φ = 4.1), global-best topology, velocities clamped to each
 * variable's range and absorbing walls. Personal and global bests compare by Deb's feasibility rules.
 * After `stallIterations` iterations in which no personal best improves, or once the swarm has
 * collapsed onto the leader’s best (within 1e-4 of each range), all particles but the leader
 * restart from a fresh Latin hypercube (a lattice swarm otherwise freezes once it collapses, and a
 * continuous one has spent its diversity).
 * A position already evaluated in the run is looked up rather than re-evaluated (no budget spent);
 * the run ends "converged" after 100 iterations without a new design.
 * Mixed variables: lattice coordinates (integer, stepped) are snapped to the lattice inside every
 * position update; each categorical keeps a probability vector over its levels that moves by the
 * same constricted update towards the one-hot vectors of the personal and global best levels,
 * clipped to [0, 1], and the particle's level is drawn from it each iteration (after Strasser et al.
 * 2016, GECCO, "A new discrete particle swarm optimization algorithm").
 * @param problem - single-objective problem.
 * @param evaluator - the function evaluated.
 * @param options - maxEvaluations (default 50 iterations), seed, swarmSize, constriction, acceleration.
 * @returns the result.
 */
export async function particleSwarm(
  problem: OptimizationProblem,
  evaluator: Evaluator,
  options: ParticleSwarmOptions = {},
): Promise<OptimizationResult> {
  const fn = "particleSwarm";
  validateProblem(fn, problem, evaluator, options, "single");
  const dims = problem.variables.length;
  const n = numberOption(fn, "swarmSize", options.swarmSize, Math.max(20, 5 * dims), 2, true);
  const chi = numberOption(fn, "constriction", options.constriction, 0.7298, 0);
  const c = numberOption(fn, "acceleration", options.acceleration, 2.05, 0);
  const stallLimit = numberOption(fn, "stallIterations", options.stallIterations, 10, 0, true);
  const session = new EvaluationSession("particle-swarm", problem, evaluator, {
    ...options,
    maxEvaluations: options.maxEvaluations ?? n * 50,
  });
  const { codec } = session;
  const rng = createRng(options.seed);
  const range = codec.lower.map((lo, i) => codec.upper[i]! - lo);
  const start = unitSamples(n, dims, "lhs", rng).map((u) => codec.fromUnit(u));
  const partner = unitSamples(n, dims, "random", rng).map((u) => codec.fromUnit(u));
  const first = await session.evaluate(start);
  const swarm: Particle[] = first.map((e, p) => {
    const x = start[p]!;
    const q = x.map((xi, i) => (codec.categorical[i] ? Array.from({ length: codec.count[i]! }, (_, k) => (k === xi ? 1 : 0)) : []));
    return {
      x,
      v: x.map((xi, i) => (codec.categorical[i] ? 0 : (partner[p]![i]! - xi) / 2)),
      q,
      w: q.map((qi) => qi.map(() => 0)),
      best: [...x],
      bestE: e,
    };
  });
  const leader = (): Particle => swarm.reduce((a, b) => (compareFeasibility(problem, b.bestE, a.bestE) < 0 ? b : a));
  let stall = 0;
  let idle = 0;
  // Positions already evaluated are looked up, not re-evaluated: a lattice swarm revisits points often.
  const cache = new Map<string, EvaluatedDesign>();
  first.forEach((e, k) => cache.set(start[k]!.join(","), e));
  const evaluateCached = async (xs: number[][]): Promise<EvaluatedDesign[] & { fresh: number }> => {
    const keys = xs.map((x) => x.join(","));
    const todo = [...new Set(keys.filter((k) => !cache.has(k)))];
    const got = await session.evaluate(todo.map((k) => xs[keys.indexOf(k)]!));
    got.forEach((e, i) => cache.set(todo[i]!, e));
    const out = keys.flatMap((k) => (cache.has(k) ? [cache.get(k)!] : []));
    return Object.assign(out, { fresh: got.length });
  };
  while (session.remaining > 0 && swarm.length > 0) {
    const lead = leader();
    const g = lead.best;
    if (stallLimit > 0 && stall >= stallLimit) {
      // Restart on stagnation (common practice): fresh positions for all but the leader, whose
      // personal bests are then replaced by wherever they land.
      stall = 0;
      const fresh = unitSamples(swarm.length, dims, "lhs", rng).map((u) => codec.fromUnit(u));
      const others = swarm.filter((p) => p !== lead);
      others.forEach((p, k) => {
        p.x = fresh[k]!;
        p.v = p.x.map((xi, i) => (codec.categorical[i] ? 0 : (fresh[swarm.length - 1]![i]! - xi) / 2));
        p.q = p.x.map((xi, i) => (codec.categorical[i] ? Array.from({ length: codec.count[i]! }, (_, l) => (l === xi ? 1 : 0)) : []));
        p.w = p.q.map((qi) => qi.map(() => 0));
      });
      const scored = await evaluateCached(others.map((p) => p.x));
      scored.forEach((e, k) => {
        others[k]!.bestE = e;
        others[k]!.best = [...others[k]!.x];
      });
      continue;
    }
    for (const p of swarm) {
      for (let i = 0; i < dims; i++) {
        if (codec.categorical[i]) {
          const q = p.q[i]!;
          const w = p.w[i]!;
          const r1 = rng();
          const r2 = rng();
          for (let k = 0; k < q.length; k++) {
            const pb = p.best[i] === k ? 1 : 0;
            const gb = g[i] === k ? 1 : 0;
            w[k] = chi * (w[k]! + c * r1 * (pb - q[k]!) + c * r2 * (gb - q[k]!));
            q[k] = Math.min(1, Math.max(0, q[k]! + w[k]!));
          }
          p.x[i] = sampleLevel(q, rng);
          continue;
        }
        const vmax = range[i]!;
        let v = chi * (p.v[i]! + c * rng() * (p.best[i]! - p.x[i]!) + c * rng() * (g[i]! - p.x[i]!));
        v = Math.min(vmax, Math.max(-vmax, v));
        const moved = p.x[i]! + v;
        const next = codec.snap(i, moved);
        if (moved < codec.lower[i]! || moved > codec.upper[i]!) v = 0;
        p.v[i] = v;
        p.x[i] = next;
      }
    }
    const scored = await evaluateCached(swarm.map((p) => p.x));
    if (scored.length < swarm.length) break;
    idle = scored.fresh === 0 ? idle + 1 : 0;
    if (idle > 100) return session.result("converged");
    let improved = false;
    scored.forEach((e, k) => {
      const p = swarm[k]!;
      if (compareFeasibility(problem, e, p.bestE) < 0) {
        p.bestE = e;
        p.best = [...p.x];
        improved = true;
      }
    });
    stall = improved ? 0 : stall + 1;
    // A collapsed swarm (every particle within 1e-4 of the range of the leader's best) also restarts.
    const g2 = leader().best;
    const collapsed = swarm.every((p) => p.x.every((v, i) => (codec.categorical[i] ? v === g2[i] : Math.abs(v - g2[i]!) <= 1e-4 * (range[i]! || 1))));
    if (collapsed) stall = stallLimit;
  }
  return session.result("budget");
}
