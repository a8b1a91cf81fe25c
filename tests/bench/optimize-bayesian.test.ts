import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { bayesianOptimization, expectedImprovement, probabilityOfFeasibility, type OptimizationProblem } from "@floorcast/bench";
import { referenceAvailable, runReference } from "../reference/python.js";
import { BRANIN_MIN, branin, braninEvaluator, braninProblem, fnEvaluator, forresterEvaluator, forresterProblem } from "./optimize-test-functions.js";

const hasRef = referenceAvailable(["scipy"]);

describe.skipIf(!hasRef)("expected improvement and probability of feasibility against scipy (numerical integration)", () => {
  it("matches E[max(0, best − Y)] and P(Y ≤ 0) from scipy.integrate.quad / scipy.stats.norm to 1e-9", () => {
    const cases: [number, number, number][] = [
      [0, 1, 0],
      [1, 0.5, 0.2],
      [-3, 2, 1],
      [10, 3, -2],
      [0.4, 1e-3, 0.4005],
      [-1e3, 50, -900],
    ];
    const ref = runReference<{ scipy: string; ei: number[]; pof: number[] }>("expected_improvement_scipy.py", { cases });
    cases.forEach(([m, s, b], i) => {
      // quad's requested accuracy is 1e-12 relative; 1e-9 absolute + relative leaves room for the closed form's Φ.
      expect(Math.abs(expectedImprovement(m, s, b) - ref.ei[i]!)).toBeLessThan(1e-9 * (1 + Math.abs(ref.ei[i]!)));
      expect(Math.abs(probabilityOfFeasibility(m, s) - ref.pof[i]!)).toBeLessThan(1e-12);
    });
  });
});

describe("expected improvement: limits and properties", () => {
  it("σ = 0 gives max(0, best − μ); NaN gives 0; EI(0, 1, 0) = φ(0) = 1/√(2π) (derived)", () => {
    expect(expectedImprovement(1, 0, 3)).toBe(2);
    expect(expectedImprovement(5, 0, 3)).toBe(0);
    expect(expectedImprovement(NaN, 1, 0)).toBe(0);
    expect(expectedImprovement(0, 1, 0)).toBeCloseTo(1 / Math.sqrt(2 * Math.PI), 14);
    expect(probabilityOfFeasibility(-1, 0)).toBe(1);
    expect(probabilityOfFeasibility(1, 0)).toBe(0);
    expect(probabilityOfFeasibility(NaN, 1)).toBe(0);
    expect(probabilityOfFeasibility(0, 2)).toBe(0.5);
  });
  it("EI ≥ max(0, best − μ), grows with σ and falls with μ (fast-check)", () => {
    const num = fc.double({ min: -100, max: 100, noNaN: true });
    const sd = fc.double({ min: 1e-3, max: 50, noNaN: true });
    fc.assert(
      fc.property(num, sd, num, (m, s, b) => {
        const e = expectedImprovement(m, s, b);
        expect(e).toBeGreaterThanOrEqual(Math.max(0, b - m) - 1e-9);
        expect(expectedImprovement(m, s * 1.5, b)).toBeGreaterThanOrEqual(e - 1e-9);
        expect(expectedImprovement(m + 1, s, b)).toBeLessThanOrEqual(e + 1e-9);
      }),
    );
  });
});

describe("Bayesian optimization with exact evaluations in the loop", () => {
  it("Branin: within 1% of 0.397887 (VLSE) in a number of evaluations comparable to EGO's", async () => {
    // Jones, Schonlau & Welch (1998), J. Global Optim. 13: EGO needed about 28 evaluations on Branin
    // (21 initial + 7 iterations, stopping when EI fell below 1% of the best) — from memory.
    // "Comparable" asserted as: every seed within 1% inside 40 evaluations, median ≤ 35 (28 + 25%).
    const hits: number[] = [];
    for (const seed of [1, 2, 3]) {
      const r = await bayesianOptimization(braninProblem, braninEvaluator(), { seed, maxEvaluations: 40, initialSamples: 10 });
      const k = r.trace.findIndex((v) => v <= BRANIN_MIN * 1.01);
      expect(k).toBeGreaterThanOrEqual(0);
      hits.push(k + 1);
      expect(r.evaluations).toBe(40);
      // The reported optimum is an exact evaluation of the reported design.
      expect(r.best!.objectives[0]).toBe(branin(r.best!.design.x1 as number, r.best!.design.x2 as number));
    }
    hits.sort((a, b) => a - b);
    expect(hits[1]!).toBeLessThanOrEqual(35);
  }, 60_000);

  it("Forrester: −6.0207401 at 0.7572488 (VLSE) to 1e-4 relative within 15 evaluations", async () => {
    const r = await bayesianOptimization(forresterProblem, forresterEvaluator(), { seed: 4, maxEvaluations: 15, initialSamples: 5 });
    expect(Math.abs(r.best!.objectives[0]! + 6.0207400558) / 6.0207400558).toBeLessThan(1e-4);
    expect(Math.abs((r.best!.design.x as number) - 0.7572487585)).toBeLessThan(5e-3);
  }, 60_000);

  it("the trace is the running best of the exact values, non-increasing for a minimisation", async () => {
    const r = await bayesianOptimization(forresterProblem, forresterEvaluator(), { seed: 1, maxEvaluations: 10, initialSamples: 4, keepHistory: true });
    let best = Infinity;
    r.history!.forEach((e, i) => {
      best = Math.min(best, e.objectives[0]!);
      expect(r.trace[i]).toBe(best);
    });
  }, 60_000);

  it("eiTolerance stops early with 'converged' (Jones et al.'s stopping rule: EI below a fraction of the best)", async () => {
    const r = await bayesianOptimization(forresterProblem, forresterEvaluator(), { seed: 2, maxEvaluations: 40, initialSamples: 5, eiTolerance: 1e-3 });
    expect(r.stopped).toBe("converged");
    expect(r.evaluations).toBeLessThan(40);
  }, 60_000);

  it("all-infeasible start: the probability of feasibility alone guides it into a small feasible region", async () => {
    // Branin restricted to the disc of radius 1 around (π, 2.275), the feasible set is ≈ 1.4% of the box (derived):
    // an initial design of 6 points usually misses it (probability ≈ 0.986⁶ ≈ 0.92, derived).
    const p: OptimizationProblem = { ...braninProblem, constraints: [{ output: "r", op: "<=", value: 1 }] };
    const ev = fnEvaluator((d) => {
      const [a, b] = [d.x1 as number, d.x2 as number];
      return { f: branin(a, b), r: Math.hypot(a - Math.PI, b - 2.275) };
    });
    const r = await bayesianOptimization(p, ev, { seed: 5, maxEvaluations: 30, initialSamples: 6 });
    expect(r.best).not.toBeNull();
    expect(r.best!.feasible).toBe(true);
    expect(Math.hypot((r.best!.design.x1 as number) - Math.PI, (r.best!.design.x2 as number) - 2.275)).toBeLessThanOrEqual(1);
    expect(r.best!.objectives[0]! / BRANIN_MIN).toBeLessThan(1.05);
  }, 60_000);

  it("a custom fitModel is used (and called once per iteration)", async () => {
    let fits = 0;
    const { fitGaussianProcess } = await import("@floorcast/surrogate");
    const r = await bayesianOptimization(forresterProblem, forresterEvaluator(), {
      seed: 3,
      maxEvaluations: 9,
      initialSamples: 5,
      fitModel: (data, seed) => {
        fits++;
        return fitGaussianProcess(data, { seed, kernel: "matern32" });
      },
    });
    expect(r.evaluations).toBe(9);
    expect(fits).toBe(4);
  }, 60_000);
});
