// Published test functions for the optimizer tests. Definitions and optima: Virtual Library of
// Simulation Experiments, Surjanovic & Bingham, http://www.sfu.ca/~ssurjano/ (forrester.html, branin.html,
// camel6.html, goldpr.html). ZDT1: Zitzler, Deb & Thiele (2000), Evolutionary Computation 8(2).
import type { Design, Evaluator, OptimizationProblem, Outputs } from "@floorcast/bench";

/** Branin–Hoo with a = 1, b = 5.1/(4π²), c = 5/π, r = 6, s = 10, t = 1/(8π) (VLSE). */
export function branin(x1: number, x2: number): number {
  const b = 5.1 / (4 * Math.PI ** 2);
  const c = 5 / Math.PI;
  const t = 1 / (8 * Math.PI);
  return (x2 - b * x1 * x1 + c * x1 - 6) ** 2 + 10 * (1 - t) * Math.cos(x1) + 10;
}
/** VLSE: minimum 5/(4π) = 0.39788735772973816. */
export const BRANIN_MIN = 5 / (4 * Math.PI);
/** VLSE: the three minimisers. */
export const BRANIN_MINIMISERS: readonly [number, number][] = [
  [-Math.PI, 12.275],
  [Math.PI, 2.275],
  [3 * Math.PI, 2.475],
];

/** Forrester et al. (2008): (6x − 2)² sin(12x − 4) on [0, 1] (VLSE). */
export function forrester(x: number): number {
  return (6 * x - 2) ** 2 * Math.sin(12 * x - 4);
}

/** Six-hump camel (VLSE), x1 ∈ [−3, 3], x2 ∈ [−2, 2]. */
export function camel(x1: number, x2: number): number {
  return (4 - 2.1 * x1 ** 2 + x1 ** 4 / 3) * x1 ** 2 + x1 * x2 + (-4 + 4 * x2 ** 2) * x2 ** 2;
}

/** Goldstein–Price (VLSE) on [−2, 2]²; minimum 3 at (0, −1). */
export function goldsteinPrice(x1: number, x2: number): number {
  const a = 1 + (x1 + x2 + 1) ** 2 * (19 - 14 * x1 + 3 * x1 ** 2 - 14 * x2 + 6 * x1 * x2 + 3 * x2 ** 2);
  const b = 30 + (2 * x1 - 3 * x2) ** 2 * (18 - 32 * x1 + 12 * x1 ** 2 + 48 * x2 - 36 * x1 * x2 + 27 * x2 ** 2);
  return a * b;
}

/** ZDT1 with n variables on [0, 1]ⁿ: f1 = x1, g = 1 + 9·Σx_{2..n}/(n − 1), f2 = g(1 − √(f1/g)). */
export function zdt1(x: readonly number[]): [number, number] {
  const f1 = x[0]!;
  const g = 1 + (9 * x.slice(1).reduce((a, b) => a + b, 0)) / (x.length - 1);
  return [f1, g * (1 - Math.sqrt(f1 / g))];
}

/** An evaluator from a plain function of a design (synchronous work wrapped in a promise). */
export function fnEvaluator(f: (d: Design) => Outputs): Evaluator & { calls: number; designs: number } {
  const ev = {
    calls: 0,
    designs: 0,
    async evaluate(batch: readonly Design[]): Promise<Outputs[]> {
      ev.calls++;
      ev.designs += batch.length;
      return batch.map(f);
    },
  };
  return ev;
}

export const braninProblem: OptimizationProblem = {
  variables: [
    { kind: "continuous", name: "x1", min: -5, max: 10 },
    { kind: "continuous", name: "x2", min: 0, max: 15 },
  ],
  objectives: [{ output: "f", sense: "min" }],
};
export const braninEvaluator = (): ReturnType<typeof fnEvaluator> =>
  fnEvaluator((d) => ({ f: branin(d.x1 as number, d.x2 as number) }));

export const camelProblem: OptimizationProblem = {
  variables: [
    { kind: "continuous", name: "x1", min: -3, max: 3 },
    { kind: "continuous", name: "x2", min: -2, max: 2 },
  ],
  objectives: [{ output: "f", sense: "min" }],
};
export const camelEvaluator = (): ReturnType<typeof fnEvaluator> =>
  fnEvaluator((d) => ({ f: camel(d.x1 as number, d.x2 as number) }));

export const forresterProblem: OptimizationProblem = {
  variables: [{ kind: "continuous", name: "x", min: 0, max: 1 }],
  objectives: [{ output: "f", sense: "min" }],
};
export const forresterEvaluator = (): ReturnType<typeof fnEvaluator> => fnEvaluator((d) => ({ f: forrester(d.x as number) }));

/** Distance from (x1, x2) to the nearest Branin minimiser, and which one. */
export function nearestBraninMinimiser(x1: number, x2: number): { index: number; distance: number } {
  let best = { index: -1, distance: Infinity };
  BRANIN_MINIMISERS.forEach(([a, b], index) => {
    const distance = Math.hypot(x1 - a, x2 - b);
    if (distance < best.distance) best = { index, distance };
  });
  return best;
}
