import type { CommonOptions, EvaluatedDesign, Evaluator, OptimisationProblem, OptimisationResult } from "./optimisation-problem.js";
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
 * Particle swarm optimisation (Kennedy & Eberhart 1995) with the constriction coefficient of
 * Clerc & Kennedy (2002, IEEE TEC 6(1)): v ← χ[v + c1·r1·(p − x) + c2·r2·(g − x)], x ← x + v with
 * χ ≈ 0.7298 and c1 = c2 = 2.05 (φ = 4.1), global-best topology, velocities clamped to each
 * variable's range and absorbing walls. Personal and global bests compare by Deb's feasibility rules.
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
  problem: OptimisationProblem,
  evaluator: Evaluator,
  options: ParticleSwarmOptions = {},
): Promise<OptimisationResult> {
  const fn = "particleSwarm";
  validateProblem(fn, problem, evaluator, options, "single");
  const dims = problem.variables.length;
  const n = numberOption(fn, "swarmSize", options.swarmSize, Math.max(20, 5 * dims), 2, true);
  const chi = numberOption(fn, "constriction", options.constriction, 0.7298, 0);
  const c = numberOption(fn, "acceleration", options.acceleration, 2.05, 0);
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
  while (session.remaining > 0 && swarm.length > 0) {
    const g = leader().best;
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
    const scored = await session.evaluate(swarm.map((p) => p.x));
    scored.forEach((e, k) => {
      const p = swarm[k]!;
      if (compareFeasibility(problem, e, p.bestE) < 0) {
        p.bestE = e;
        p.best = [...p.x];
      }
    });
  }
  return session.result("budget");
}
