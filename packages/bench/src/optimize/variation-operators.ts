import type { VariableCodec } from "@floorcast/sampler";
import type { Rng } from "./unit-samples.js";

/** Settings of the mixed-variable SBX crossover and polynomial mutation. */
export interface VariationSettings {
  /** Probability that a pair is crossed (default 0.9; Deb et al. 2002). */
  readonly crossoverProbability: number;
  /** SBX distribution index ηc (default 15; larger keeps children nearer their parents). */
  readonly crossoverEta: number;
  /** Per-variable mutation probability (default min(0.5, 1/dims)). */
  readonly mutationProbability: number;
  /** Polynomial mutation distribution index ηm (default 20). */
  readonly mutationEta: number;
}

function sbxSpread(u: number, beta: number, eta: number): number {
  const alpha = 2 - Math.pow(beta, -(eta + 1));
  return u <= 1 / alpha ? Math.pow(u * alpha, 1 / (eta + 1)) : Math.pow(1 / (2 - u * alpha), 1 / (eta + 1));
}

/**
 * Simulated binary crossover of two coded parents (Deb & Agrawal 1995, Complex Systems 9;
 * bounded form as in Deb's NSGA-II code). Each numeric coordinate is crossed with probability
 * 0.5; lattice coordinates (integer, stepped) are snapped to the lattice inside the operator, so
 * children are always legal. Categorical coordinates are exchanged with probability 0.5
 * (uniform crossover), since levels have no order.
 * @returns two children.
 */
export function sbxCrossover(
  codec: VariableCodec,
  p1: readonly number[],
  p2: readonly number[],
  s: VariationSettings,
  rng: Rng,
): [number[], number[]] {
  const c1 = [...p1];
  const c2 = [...p2];
  if (rng() > s.crossoverProbability) return [c1, c2];
  for (let i = 0; i < codec.dims; i++) {
    if (codec.categorical[i]) {
      if (rng() < 0.5) [c1[i], c2[i]] = [p2[i]!, p1[i]!];
      continue;
    }
    if (rng() > 0.5 || Math.abs(p1[i]! - p2[i]!) < 1e-14) continue;
    const lo = codec.lower[i]!;
    const hi = codec.upper[i]!;
    const y1 = Math.min(p1[i]!, p2[i]!);
    const y2 = Math.max(p1[i]!, p2[i]!);
    const u = rng();
    const b1 = sbxSpread(u, 1 + (2 * (y1 - lo)) / (y2 - y1), s.crossoverEta);
    const b2 = sbxSpread(u, 1 + (2 * (hi - y2)) / (y2 - y1), s.crossoverEta);
    let a = codec.snap(i, 0.5 * (y1 + y2 - b1 * (y2 - y1)));
    let b = codec.snap(i, 0.5 * (y1 + y2 + b2 * (y2 - y1)));
    if (rng() < 0.5) [a, b] = [b, a];
    c1[i] = a;
    c2[i] = b;
  }
  return [c1, c2];
}

/**
 * Polynomial mutation (Deb & Agrawal 1995; Deb & Goyal 1996, bounded form) of a coded vector,
 * in place. Plain continuous coordinates get the polynomial perturbation; lattice coordinates
 * get it snapped to the lattice, and when that leaves the value unchanged they move one step up
 * or down at random, so integers mutate by integer steps; a categorical coordinate is resampled
 * uniformly among its other levels. With `only`, mutates just that coordinate, for certain.
 */
export function polynomialMutation(codec: VariableCodec, x: number[], s: VariationSettings, rng: Rng, only?: number): void {
  for (let i = 0; i < codec.dims; i++) {
    if (only === undefined ? rng() >= s.mutationProbability : i !== only) continue;
    const n = codec.count[i]!;
    if (n === 1) continue;
    if (codec.categorical[i]) {
      const k = Math.floor(rng() * (n - 1));
      x[i] = k >= x[i]! ? k + 1 : k;
      continue;
    }
    const lo = codec.lower[i]!;
    const hi = codec.upper[i]!;
    const y = x[i]!;
    const r = rng();
    const pow = 1 / (s.mutationEta + 1);
    let dq: number;
    if (r < 0.5) {
      const xy = 1 - (y - lo) / (hi - lo);
      dq = Math.pow(2 * r + (1 - 2 * r) * Math.pow(xy, s.mutationEta + 1), pow) - 1;
    } else {
      const xy = 1 - (hi - y) / (hi - lo);
      dq = 1 - Math.pow(2 * (1 - r) + 2 * (r - 0.5) * Math.pow(xy, s.mutationEta + 1), pow);
    }
    let v = codec.snap(i, y + dq * (hi - lo));
    const st = codec.step[i]!;
    if (st > 0 && v === y) {
      const up = y + st <= hi + 1e-12;
      const down = y - st >= lo - 1e-12;
      v = codec.snap(i, up && (!down || rng() < 0.5) ? y + st : y - st);
    }
    x[i] = v;
  }
}

/**
 * Duplicate avoidance (common practice for GAs on discrete spaces): while `x` equals a design in
 * `taken` (keys x.join(",")), mutates one randomly chosen coordinate for certain, up to `tries`
 * times; then records x in `taken`.
 */
export function avoidDuplicate(codec: VariableCodec, x: number[], taken: Set<string>, s: VariationSettings, rng: Rng, tries = 8): void {
  const movable = codec.count.flatMap((n, i) => (n > 1 ? [i] : []));
  for (let t = 0; t < tries && movable.length > 0 && taken.has(x.join(",")); t++) {
    polynomialMutation(codec, x, s, rng, movable[Math.floor(rng() * movable.length)]!);
  }
  taken.add(x.join(","));
}

/**
 * Makes `n` offspring (n even): pairs of parents from `pick`, SBX crossover, polynomial mutation,
 * duplicate avoidance against `existing` and each other (the GA's and NSGA-II's variation step).
 */
export function makeOffspring(
  codec: VariableCodec,
  n: number,
  pick: () => readonly number[],
  existing: readonly (readonly number[])[],
  s: VariationSettings,
  rng: Rng,
): number[][] {
  const children: number[][] = [];
  const taken = new Set(existing.map((x) => x.join(",")));
  while (children.length < n) {
    for (const c of sbxCrossover(codec, pick(), pick(), s, rng)) {
      polynomialMutation(codec, c, s, rng);
      avoidDuplicate(codec, c, taken, s, rng);
      children.push(c);
    }
  }
  return children;
}

/**
 * Reads the variation settings from options, with NSGA-II's usual defaults (Deb et al. 2002).
 * @param fn - public function name, for messages.
 */
export function variationSettings(
  fn: string,
  dims: number,
  o: Partial<VariationSettings>,
): VariationSettings {
  const prob = (name: keyof VariationSettings, v: number | undefined, d: number): number => {
    if (v === undefined) return d;
    if (typeof v !== "number" || !(v >= 0 && v <= 1)) throw new RangeError(`${fn}: options.${name} must be in [0, 1], got ${v}`);
    return v;
  };
  const eta = (name: keyof VariationSettings, v: number | undefined, d: number): number => {
    if (v === undefined) return d;
    if (typeof v !== "number" || !(v >= 0 && Number.isFinite(v))) throw new RangeError(`${fn}: options.${name} must be ≥ 0, got ${v}`);
    return v;
  };
  return {
    crossoverProbability: prob("crossoverProbability", o.crossoverProbability, 0.9),
    crossoverEta: eta("crossoverEta", o.crossoverEta, 15),
    // 1/dims (Deb et al. 2002), at most 0.5 as pymoo's Mutation.get_prob_var has it: with one
    // variable, mutating every child would spread each one over the whole range and stall refinement.
    mutationProbability: prob("mutationProbability", o.mutationProbability, Math.min(0.5, 1 / dims)),
    mutationEta: eta("mutationEta", o.mutationEta, 20),
  };
}
