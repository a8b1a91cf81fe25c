// The harness's surrogate evaluator passes a GP's analytic mean gradient on to gradient-based optimizers.
import { describe, expect, it } from "vitest";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { createDesign } from "@floorcast/sampler";
import { projectedGradient, surrogateEvaluator, type OptimizationProblem } from "@floorcast/bench";

// Six-hump camel (Virtual Library of Simulation Experiments): minima −1.0316285 at ±(0.0898, −0.7127).
const camel = (a: number, b: number): number => (4 - 2.1 * a * a + a ** 4 / 3) * a * a + a * b + (-4 + 4 * b * b) * b * b;

describe("surrogateEvaluator with an analytic gradient", () => {
  const unit = createDesign({ n: 50, dims: 2, design: "lhs-maximin", seed: 5 });
  const x = unit.map(([a, b]) => [-2 + 4 * a!, -1 + 2 * b!]);
  const gp = fitGaussianProcess({ inputs: ["a", "b"], targets: ["f"], x, y: x.map(([a, b]) => [camel(a!, b!)]) }, { seed: 3 });
  const problem: OptimizationProblem = {
    variables: [
      { kind: "continuous", name: "a", min: -2, max: 2 },
      { kind: "continuous", name: "b", min: -1, max: 1 },
    ],
    objectives: [{ output: "f", sense: "min" }],
  };
  const evaluator = surrogateEvaluator(gp, problem.variables);

  it("returns the GP's own gradient, keyed by output and variable", async () => {
    expect(evaluator.gradient).toBeDefined();
    const [g] = await evaluator.gradient!([{ a: 0.3, b: -0.4 }]);
    const ref = gp.gradient([0.3, -0.4])[0]!;
    expect(g!.f!.a).toBe(ref[0]);
    expect(g!.f!.b).toBe(ref[1]);
  });

  it("lets projected gradient use it (gradient calls > 0) and reach a camel minimum of the surrogate", async () => {
    const r = await projectedGradient(problem, evaluator, { seed: 4, maxEvaluations: 2000 });
    expect(r.gradientCalls).toBeGreaterThan(0);
    const d = r.best!.design as { a: number; b: number };
    // The 50-point GP's minimum is not the function's: measured on seeds 1–6, the found point lies
    // 0.026 from the published minimiser and 0.0043 above the published minimum; the bounds are about twice that.
    const nearest = Math.min(Math.hypot(d.a - 0.0898, d.b + 0.7127), Math.hypot(d.a + 0.0898, d.b - 0.7127));
    expect(nearest).toBeLessThan(0.05);
    expect(camel(d.a, d.b)).toBeLessThan(-1.0316285 + 0.01);
  });

  it("has no gradient when the model has none", () => {
    const plain = surrogateEvaluator({ targets: ["f"], predict: (rows) => ({ mean: rows.map(() => [0]) }) }, problem.variables);
    expect(plain.gradient).toBeUndefined();
  });
});
