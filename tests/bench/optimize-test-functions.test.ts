// Optimizers against the published optima of the Virtual Library of Simulation Experiments
// (Surjanovic & Bingham, http://www.sfu.ca/~ssurjano/).
import { describe, expect, it } from "vitest";
import {
  geneticAlgorithm,
  gridSearch,
  particleSwarm,
  patternSearch,
  projectedGradient,
  randomSearch,
  type Design,
  type OptimizationProblem,
} from "@floorcast/bench";
import {
  BRANIN_MIN,
  BRANIN_MINIMISERS,
  branin,
  braninEvaluator,
  braninProblem,
  camel,
  camelEvaluator,
  camelProblem,
  fnEvaluator,
  forrester,
  forresterEvaluator,
  forresterProblem,
  goldsteinPrice,
  nearestBraninMinimiser,
} from "./optimize-test-functions.js";

// VLSE values.
const FORRESTER_MIN = -6.0207400558;
const FORRESTER_ARGMIN = 0.7572487585;
const CAMEL_MIN = -1.0316284535;
const CAMEL_ARGMIN = [0.08984201, -0.71265641];

describe("the test functions themselves match VLSE's published values", () => {
  it("Branin at its three minimisers, Forrester's endpoints and symmetry, camel, Goldstein–Price", () => {
    for (const [a, b] of BRANIN_MINIMISERS) expect(Math.abs(branin(a, b) - 0.39788735772973816)).toBeLessThan(1e-12);
    expect(forrester(0)).toBeCloseTo(3.0272099812, 9);
    expect(forrester(1)).toBeCloseTo(15.8297319461, 9);
    expect(forrester(FORRESTER_ARGMIN)).toBeCloseTo(FORRESTER_MIN, 9);
    expect(forrester(2 / 3 - 0.1)).toBeCloseTo(-forrester(0.1), 12);
    expect(camel(CAMEL_ARGMIN[0]!, CAMEL_ARGMIN[1]!)).toBeCloseTo(CAMEL_MIN, 9);
    expect(goldsteinPrice(0, -1)).toBe(3);
  });
});

const relErr = (v: number, ref: number): number => Math.abs(v - ref) / Math.abs(ref);

describe("Branin (VLSE minimum 0.397887 at (−π, 12.275), (π, 2.275), (3π, 2.475))", () => {
  // Tolerances: PSO and the gradient method converge to ~1e-8 relative or better at these budgets
  // (measured on seeds 100–119: worst 1.2e-8 and 8e-12), so 1e-6 is generous; the GA 1e-3 relative: its
  // mutation narrows as the budget is spent (mutationEtaGrowth), measured over seeds 0–99 at 2000 evaluations
  // median 1.0e-6, worst 4.9e-5 (with a constant ηm = 20: median 3.2e-5, worst 1.6e-3).
  it.each([
    ["particleSwarm", (s: number) => particleSwarm(braninProblem, braninEvaluator(), { seed: s, maxEvaluations: 2000 }), 1e-6, 1e-3],
    ["geneticAlgorithm", (s: number) => geneticAlgorithm(braninProblem, braninEvaluator(), { seed: s, maxEvaluations: 2000 }), 1e-3, 0.05],
    ["projectedGradient", (s: number) => projectedGradient(braninProblem, braninEvaluator(), { seed: s, starts: 1, maxEvaluations: 600 }), 1e-6, 1e-3],
  ])("%s reaches the minimum and, across seeds, all three minimisers", async (_, run, tolF, tolX) => {
    const found = new Set<number>();
    for (let seed = 0; seed < 12 && found.size < 3; seed++) {
      const r = await run(seed);
      expect(relErr(r.best!.objectives[0]!, BRANIN_MIN)).toBeLessThan(tolF);
      const near = nearestBraninMinimiser(r.best!.design.x1 as number, r.best!.design.x2 as number);
      expect(near.distance).toBeLessThan(tolX * 15);
      found.add(near.index);
    }
    expect(found.size).toBe(3);
  });

  it("grid at 301² points plus exact pattern-search refinement reaches 1e-9 relative", async () => {
    const grid = await gridSearch(braninProblem, braninEvaluator(), { resolution: 301 });
    expect(grid.evaluations).toBe(301 * 301);
    expect(relErr(grid.best!.objectives[0]!, BRANIN_MIN)).toBeLessThan(1e-3);
    const ref = await patternSearch(braninProblem, braninEvaluator(), grid.best!.design, { maxEvaluations: 400, initialStep: 0.01 });
    expect(relErr(ref.best!.objectives[0]!, BRANIN_MIN)).toBeLessThan(1e-9);
    expect(ref.best!.objectives[0]!).toBeLessThanOrEqual(grid.best!.objectives[0]!);
  });

  it("random and Latin-hypercube search get within 10% at 20000 evaluations; LHS columns are Latin", async () => {
    // Derived bound: count the fraction p of a 1001² grid with f ≤ 1.1·min; 20000 independent draws
    // all miss that set with probability (1 − p)^20000, which must be negligible for the check to be fair.
    let hits = 0;
    for (let i = 0; i <= 1000; i++) {
      for (let j = 0; j <= 1000; j++) if (branin(-5 + 0.015 * i, 0.015 * j) <= 1.1 * BRANIN_MIN) hits++;
    }
    const p = hits / 1001 ** 2;
    expect((1 - p) ** 20000).toBeLessThan(1e-6);
    for (let seed = 0; seed < 5; seed++) {
      const r = await randomSearch(braninProblem, braninEvaluator(), { seed, maxEvaluations: 20000 });
      const l = await randomSearch(braninProblem, braninEvaluator(), { seed, maxEvaluations: 20000, design: "lhs", keepHistory: true });
      expect(r.best!.objectives[0]! / BRANIN_MIN).toBeLessThan(1.1);
      expect(l.best!.objectives[0]! / BRANIN_MIN).toBeLessThan(1.1);
      // Latin property (McKay, Beckman & Conover 1979): each of the 20000 strata of each axis holds one point.
      for (const [name, lo] of [["x1", -5], ["x2", 0]] as const) {
        const strata = new Set(l.history!.map((e) => Math.floor((((e.design[name] as number) - lo) / 15) * 20000)));
        expect(strata.size).toBe(20000);
      }
    }
  });
});

describe("Forrester (VLSE: −6.0207400558 at 0.7572487585)", () => {
  // Tolerances in f: 1e-6 relative for all three. The curvature at the minimum is f'' ≈ 1068 (derived
  // by central differences), so a relative error ε in f bounds |Δx| ≤ √(2·6.02·ε/1068): 1.1e-4 at 1e-6.
  // The GA reaches it because with one variable it mutates half of the children, not all (per-variable
  // probability min(0.5, 1/dims), pymoo 0.6 Mutation.get_prob_var), and its mutation narrows as the budget is
  // spent: measured over seeds 0–59 at 1000 evaluations, median 2.0e-9, worst 2.1e-7 (seed 1: 6.3e-8; with a
  // constant ηm = 20: median 4.8e-8, worst 3.0e-6; with every child mutated, median 4.4e-7).
  it.each([
    ["particleSwarm", () => particleSwarm(forresterProblem, forresterEvaluator(), { seed: 1, maxEvaluations: 1000 }), 1e-6, 1.1e-4],
    ["geneticAlgorithm", () => geneticAlgorithm(forresterProblem, forresterEvaluator(), { seed: 1, maxEvaluations: 1000 }), 1e-6, 1.1e-4],
    ["projectedGradient", () => projectedGradient(forresterProblem, forresterEvaluator(), { seed: 1, maxEvaluations: 1000 }), 1e-6, 1.1e-4],
  ])("%s", async (_, run, tolF, tolX) => {
    const r = await run();
    expect(relErr(r.best!.objectives[0]!, FORRESTER_MIN)).toBeLessThan(tolF);
    expect(Math.abs((r.best!.design.x as number) - FORRESTER_ARGMIN)).toBeLessThan(tolX);
  });
  it("pattern search from the local minimum's basin stays local (a local method), from the global basin converges", async () => {
    const local = await patternSearch(forresterProblem, forresterEvaluator(), { x: 0.1 }, { maxEvaluations: 200, initialStep: 0.01 });
    expect(local.best!.objectives[0]!).toBeCloseTo(-0.9863254063, 8); // VLSE local minimum at 0.1425891889
    const global = await patternSearch(forresterProblem, forresterEvaluator(), { x: 0.7 }, { maxEvaluations: 200, initialStep: 0.01 });
    expect(global.best!.objectives[0]!).toBeCloseTo(FORRESTER_MIN, 8);
    expect(global.stopped).toBe("converged");
  });
});

describe("six-hump camel (VLSE: −1.0316284535 at ±(0.08984201, −0.71265641))", () => {
  it("PSO and the gradient method find both minimisers across seeds", async () => {
    const signs = new Set<number>();
    for (let seed = 0; seed < 10; seed++) {
      for (const r of [
        await particleSwarm(camelProblem, camelEvaluator(), { seed, maxEvaluations: 1500 }),
        await projectedGradient(camelProblem, camelEvaluator(), { seed, starts: 8, maxEvaluations: 3000 }),
      ]) {
        expect(relErr(r.best!.objectives[0]!, CAMEL_MIN)).toBeLessThan(1e-6);
        const x = [r.best!.design.x1 as number, r.best!.design.x2 as number];
        const s = Math.sign(x[0]!);
        expect(Math.hypot(x[0]! - s * CAMEL_ARGMIN[0]!, x[1]! - s * CAMEL_ARGMIN[1]!)).toBeLessThan(1e-3);
        signs.add(s);
      }
    }
    expect(signs).toEqual(new Set([1, -1]));
  });
  it("the analytic gradient gives the same optimum with fewer evaluations than finite differences", async () => {
    const plain = camelEvaluator();
    const withGrad = {
      evaluate: plain.evaluate,
      async gradient(batch: readonly Design[]) {
        return batch.map((d) => {
          const [a, b] = [d.x1 as number, d.x2 as number];
          // ∂/∂x of the VLSE camel formula (derived).
          return { f: { x1: 8 * a - 8.4 * a ** 3 + 2 * a ** 5 + b, x2: a - 8 * b + 16 * b ** 3 } };
        });
      },
    };
    const fd = await projectedGradient(camelProblem, camelEvaluator(), { seed: 4, maxEvaluations: 5000 });
    const an = await projectedGradient(camelProblem, withGrad, { seed: 4, maxEvaluations: 5000 });
    expect(relErr(an.best!.objectives[0]!, CAMEL_MIN)).toBeLessThan(1e-8);
    expect(an.gradientCalls).toBeGreaterThan(0);
    expect(fd.gradientCalls).toBe(0);
    expect(an.evaluations).toBeLessThan(fd.evaluations);
  });
});

describe("Goldstein–Price (VLSE: 3 at (0, −1)), maximised as −f to exercise sense = max", () => {
  const problem: OptimizationProblem = {
    variables: [
      { kind: "continuous", name: "x1", min: -2, max: 2 },
      { kind: "continuous", name: "x2", min: -2, max: 2 },
    ],
    objectives: [{ output: "negf", sense: "max" }],
  };
  const ev = () => fnEvaluator((d) => ({ negf: -goldsteinPrice(d.x1 as number, d.x2 as number) }));
  it("PSO reaches −3 at (0, −1)", async () => {
    const r = await particleSwarm(problem, ev(), { seed: 3, maxEvaluations: 3000 });
    expect(relErr(r.best!.objectives[0]!, -3)).toBeLessThan(1e-6);
    expect(Math.hypot(r.best!.design.x1 as number, (r.best!.design.x2 as number) + 1)).toBeLessThan(1e-3);
  });
});
