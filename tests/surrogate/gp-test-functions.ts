import seedrandom from "seedrandom";

/** Forrester et al. (2008): f(x) = (6x − 2)² sin(12x − 4) on [0, 1] (Virtual Library of Simulation Experiments). */
export const forrester = (x: readonly number[]): number => (6 * x[0]! - 2) ** 2 * Math.sin(12 * x[0]! - 4);

/** Branin with a = 1, b = 5.1/(4π²), c = 5/π, r = 6, s = 10, t = 1/(8π) on [−5, 10] × [0, 15] (VLSE). */
export const branin = (x: readonly number[]): number => {
  const [x1, x2] = [x[0]!, x[1]!];
  const b = 5.1 / (4 * Math.PI ** 2);
  const c = 5 / Math.PI;
  const t = 1 / (8 * Math.PI);
  return (x2 - b * x1 * x1 + c * x1 - 6) ** 2 + 10 * (1 - t) * Math.cos(x1) + 10;
};

/** Hartmann 3-D on [0, 1]³ (VLSE; α, A, P from memory, checked in the tests against the published minimum). */
export const hartmann3 = (x: readonly number[]): number => {
  const alpha = [1, 1.2, 3, 3.2];
  const a = [
    [3, 10, 30],
    [0.1, 10, 35],
    [3, 10, 30],
    [0.1, 10, 35],
  ];
  const p = [
    [3689, 1170, 2673],
    [4699, 4387, 7470],
    [1091, 8732, 5547],
    [381, 5743, 8828],
  ];
  let f = 0;
  for (let i = 0; i < 4; i++) {
    let s = 0;
    for (let j = 0; j < 3; j++) s += a[i]![j]! * (x[j]! - 1e-4 * p[i]![j]!) ** 2;
    f -= alpha[i]! * Math.exp(-s);
  }
  return f;
};

/**
 * A maximin Latin hypercube in a box: best of `tries` seeded random LHS by minimum pairwise distance
 * (McKay et al. 1979; Morris & Mitchell 1995). Test helper, independent of @floorcast/sampler.
 */
export function maximinLhs(n: number, lower: readonly number[], upper: readonly number[], seed: number, tries = 50): number[][] {
  const rng = seedrandom(`gp-test-design:${seed}`);
  const d = lower.length;
  let best: number[][] = [];
  let bestD = -1;
  for (let t = 0; t < tries; t++) {
    const cols = Array.from({ length: d }, () => {
      const perm = Array.from({ length: n }, (_, i) => i);
      for (let i = n - 1; i > 0; i--) {
        const j = Math.floor(rng() * (i + 1));
        [perm[i], perm[j]] = [perm[j]!, perm[i]!];
      }
      return perm.map((p) => (p + rng()) / n);
    });
    const pts = Array.from({ length: n }, (_, i) => cols.map((c) => c[i]!));
    let md = Infinity;
    for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) md = Math.min(md, pts[i]!.reduce((s, v, k) => s + (v - pts[j]![k]!) ** 2, 0));
    if (md > bestD) {
      bestD = md;
      best = pts;
    }
  }
  return best.map((row) => row.map((u, k) => lower[k]! + u * (upper[k]! - lower[k]!)));
}
