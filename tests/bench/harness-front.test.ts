import { describe, expect, it } from "vitest";
import { frontHypervolume, frontReference } from "../../packages/bench/src/harness/front-hypervolume.js";
import { frontEvaluationsToTarget } from "../../packages/bench/src/harness/front-evaluations-to-target.js";
import { findExactOptimum } from "../../packages/bench/src/harness/find-exact-optimum.js";
import type { Design, OptimizationProblem, Outputs } from "../../packages/bench/src/optimize/optimization-problem.js";
import { problemDataset } from "../../packages/bench/src/problem/problem-dataset.js";
import type { BenchProblem } from "../../packages/bench/src/problem/bench-problem.js";

// maximise f1 = x and f2 = 1 − x² on x ∈ [0, 1]: every x is Pareto-optimal (derived)
const op: OptimizationProblem = {
  variables: [{ kind: "continuous", name: "x", min: 0, max: 1 }],
  objectives: [
    { output: "f1", sense: "max" },
    { output: "f2", sense: "max" },
  ],
};
function toyFront(d: Design): Outputs {
  return { f1: d.x as number, f2: 1 - (d.x as number) ** 2 };
}
const problem: BenchProblem = {
  name: "toy-front",
  title: "toy",
  description: "toy",
  suites: [],
  file: "",
  kind: "two-objective",
  optimization: op,
  exact: { gridPoints: 101, refineEvaluations: 0 },
  outputs: ["f1", "f2"],
  trainingVariables: op.variables,
  evaluate: toyFront,
  dataset: problemDataset({ name: "toy-front", title: "toy", description: "toy", fileName: "toy.json", contents: {} }, op.variables, undefined, { name: "toy-front", evaluate: toyFront }),
};

describe("front hypervolume and its reference point", () => {
  it("a hand-computed staircase: maximised points (1,3), (2,2), (3,1) from (0,0) cover 3 + 2 + 1 = 6 (derived)", () => {
    expect(frontHypervolume(op, [[1, 3], [2, 2], [3, 1]], [0, 0])).toBeCloseTo(6, 12);
  });
  it("the reference lies 10% of the front's range beyond its worst point in each objective (derived)", () => {
    expect(frontReference(op, [[1, 3], [2, 2], [3, 1]])).toEqual([0.8, 0.8]);
    const min: OptimizationProblem = { ...op, objectives: op.objectives.map((o) => ({ ...o, sense: "min" as const })) };
    expect(frontReference(min, [[1, 3], [3, 1]])).toEqual([3.2, 3.2]);
  });
  it("the exact front of the toy problem is the whole grid, and its hypervolume approaches the integral", async () => {
    const exact = await findExactOptimum(problem);
    expect(exact.front.length).toBe(101);
    // from (0, 0): ∫₀¹ (1 − x²) dx = 2/3 (derived); the 101-point staircase is within 1/100 of it
    const hv = frontHypervolume(op, exact.front.map((e) => [...e.objectives]), [0, 0]);
    expect(hv).toBeLessThanOrEqual(2 / 3);
    expect(hv).toBeGreaterThan(2 / 3 - 0.01);
  });
  it("counts exact evaluations until a run's hypervolume is within the target of the exact front's", async () => {
    const exact = await findExactOptimum(problem);
    const points = exact.front.map((e) => [...e.objectives]);
    const reference = frontReference(op, points);
    const hv = frontHypervolume(op, points, reference);
    const r = await frontEvaluationsToTarget(problem, reference, hv, { search: 100, bo: 0, seeds: 2, target: 0.05 });
    expect(r.map((e) => e.method)).toEqual(["nsga2", "random"]);
    for (const e of r) {
      expect(e.budget).toBe(500);
      for (const v of e.evaluations) if (v !== null) expect(v).toBeLessThanOrEqual(500);
      // the shortfall never grows as designs accumulate
      for (let i = 1; i < e.curve.length; i++) expect(e.curve[i]![1]).toBeLessThanOrEqual(e.curve[i - 1]![1] + 1e-15);
    }
    // random search on a one-variable front gets within 5% of the 101-point front's hypervolume in 500 draws
    expect(r[1]!.evaluations.every((v) => v !== null)).toBe(true);
  });
});
