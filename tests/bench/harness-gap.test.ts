import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { optimumGap } from "../../packages/bench/src/harness/optimum-gap.js";
import { formatPercent } from "../../packages/bench/src/harness/format-percent.js";
import { reevaluateSurrogateOptimum } from "../../packages/bench/src/harness/reevaluate-surrogate-optimum.js";
import { runSingleTrial } from "../../packages/bench/src/harness/run-single-trial.js";
import { sampleTrainingSet } from "../../packages/bench/src/harness/sample-training-set.js";
import { scoreOutputs } from "../../packages/bench/src/optimize/evaluation-session.js";
import type { Evaluator } from "@floorcast/sampler";
import type { Design, OptimizationProblem, Outputs } from "../../packages/bench/src/optimize/optimization-problem.js";
import type { BenchProblem } from "../../packages/bench/src/problem/bench-problem.js";
import type { BenchTrainer } from "../../packages/bench/src/harness/bench-trainer.js";
import { problemDataset } from "../../packages/bench/src/problem/problem-dataset.js";

describe("optimumGap", () => {
  it("a hand-made case: exact optimum 12,960 m², surrogate-driven design 11,880 m² → 1080/12960 = 0.08333 (derived)", () => {
    expect(optimumGap(12960, 11880)).toBeCloseTo(1080 / 12960, 15);
    expect(optimumGap(12960, 12960)).toBe(0);
  });
  it("minimised objectives: 31.2 m optimum, 35.1 m reached → (35.1 − 31.2)/31.2 = 0.125 (derived)", () => {
    expect(optimumGap(31.2, 35.1, "minimise")).toBeCloseTo(0.125, 14);
    expect(optimumGap(31.2, 35.1, "min")).toBeCloseTo(0.125, 14);
  });
  it("a negative optimum (published minimisation test functions) keeps a loss positive", () => {
    // Forrester: −6.0207 optimum (VLSE); reaching −5.0 loses (−5 − (−6.0207))/6.0207
    expect(optimumGap(-6.0207400558, -5, "minimise")).toBeCloseTo(1.0207400558 / 6.0207400558, 12);
  });
  it("rejects undefined cases", () => {
    expect(() => optimumGap(0, 1)).toThrow(/exactOptimum must be finite and non-zero/);
    expect(() => optimumGap(Number.NaN, 1)).toThrow(RangeError);
    expect(() => optimumGap(1, Number.POSITIVE_INFINITY)).toThrow(/exactAtSurrogate must be finite/);
    expect(() => optimumGap("1" as unknown as number, 1)).toThrow(TypeError);
    expect(() => optimumGap(1, 1, "up" as "max")).toThrow(/sense/);
  });
  it("property: the gap is ≥ 0 whenever the surrogate-driven value is no better, and scale-free", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (opt, frac, k) => {
        const g = optimumGap(opt, opt * frac);
        expect(g).toBeGreaterThanOrEqual(0);
        expect(optimumGap(opt * k, opt * frac * k)).toBeCloseTo(g, 9);
      }),
    );
  });
});

// A hand-made problem: maximise f = x subject to g = x ≤ 0.5, on x ∈ [0, 1].
const problem: OptimizationProblem = {
  variables: [{ kind: "continuous", name: "x", min: 0, max: 1 }],
  objectives: [{ output: "f", sense: "max" }],
  constraints: [{ output: "g", op: "<=", value: 0.5 }],
};
const exactOutputs = (d: Design): Outputs => ({ f: d.x as number, g: d.x as number });
const exact: Evaluator = { evaluate: (b) => Promise.resolve(b.map(exactOutputs)) };
// an over-optimistic surrogate: it believes g = x − 0.3, so designs up to 0.8 look feasible
const surrogateScore = (x: number) => scoreOutputs(problem, { x }, { f: x, g: x - 0.3 });

describe("the harness never reports an exactly infeasible design as optimal", () => {
  it("falls back down the surrogate's ranked list to the best exactly-feasible candidate", async () => {
    const searched = [0.8, 0.7, 0.6, 0.45, 0.3, 0.1].map(surrogateScore);
    const r = await reevaluateSurrogateOptimum(problem, searched, exact);
    expect(r.predicted!.design.x).toBe(0.8); // the surrogate's own choice
    expect(r.source).toBe("ranked-list");
    expect(r.exact!.design.x).toBe(0.45); // best exactly feasible of the list
    expect(r.exact!.feasible).toBe(true);
    expect(r.evaluations).toBe(6); // first choice, then the other five
  });
  it("the ranked list skips near-copies of a design already on it", async () => {
    // twenty near-copies of the infeasible 0.8 (within 0.02 of each other), then 0.49 further down
    const searched = [...Array.from({ length: 20 }, (_, i) => 0.8 - i * 0.0005), 0.49].map(surrogateScore);
    const r = await reevaluateSurrogateOptimum(problem, searched, exact);
    expect(r.exact!.design.x).toBe(0.49);
    expect(r.evaluations).toBe(2);
    const plain = await reevaluateSurrogateOptimum(problem, searched, exact, [], 10, 0);
    expect(plain.exact).toBeNull(); // without the spacing the list is ten copies of one infeasible point
  });
  it("falls back to the training set when the whole list is infeasible, and to nothing when that is too", async () => {
    const searched = [0.9, 0.8].map(surrogateScore);
    const training = [0.2, 0.4, 0.7].map((x) => scoreOutputs(problem, { x }, exactOutputs({ x })));
    const r = await reevaluateSurrogateOptimum(problem, searched, exact, training);
    expect(r.source).toBe("training-set");
    expect(r.exact!.design.x).toBe(0.4);
    const none = await reevaluateSurrogateOptimum(problem, searched, exact, [training[2]!]);
    expect(none.source).toBe("none");
    expect(none.exact).toBeNull();
  });
  it("reports the surrogate's first choice when it is exactly feasible, at one exact evaluation", async () => {
    const r = await reevaluateSurrogateOptimum(problem, [0.5, 0.4].map(surrogateScore), exact);
    expect(r.source).toBe("surrogate-optimum");
    expect(r.evaluations).toBe(1);
  });
  it("property: whatever the surrogate believes, the reported design is exactly feasible or absent", async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 30 }), fc.double({ min: -0.5, max: 0.5, noNaN: true }), async (xs, bias) => {
        const searched = xs.map((x) => scoreOutputs(problem, { x }, { f: x, g: x + bias }));
        const r = await reevaluateSurrogateOptimum(problem, searched, exact);
        if (r.exact) expect(r.exact.design.x as number).toBeLessThanOrEqual(0.5);
      }),
    );
  });
  it("a full trial with a lying surrogate still reports an exactly feasible optimum and its true gap", async () => {
    const bench: BenchProblem = {
      name: "hand",
      title: "hand",
      description: "hand",
      suites: [],
      file: "",
      kind: "single",
      optimization: problem,
      exact: { gridPoints: 11, refineEvaluations: 0 },
      outputs: ["f", "g"],
      trainingVariables: problem.variables,
      evaluate: exactOutputs,
      dataset: problemDataset({ name: "hand", title: "hand", description: "hand", fileName: "hand.json", contents: {} }, problem.variables, undefined, { name: "hand", evaluate: exactOutputs }),
    };
    const liar: BenchTrainer = {
      name: "liar",
      fit: (data) => Promise.resolve({ targets: data.targets, predict: (x: readonly (readonly number[])[]) => ({ mean: x.map((r) => [r[0]!, r[0]! - 0.3]) }) }),
    };
    const workDir = mkdtempSync(join(tmpdir(), "floorcast-gap-"));
    const test = await sampleTrainingSet(bench, 10, "t", workDir, undefined, "random");
    const r = await runSingleTrial(bench, { trainer: liar, trainingSize: 8, seed: 1, test, exactValue: 0.5, refineBudget: 0, workDir });
    rmSync(workDir, { recursive: true, force: true });
    expect(r.source).not.toBe("surrogate-optimum");
    expect(r.result!.g as number).toBeLessThanOrEqual(0.5);
    expect(r.gap).toBeCloseTo(optimumGap(0.5, r.value!), 15);
    expect(r.gap!).toBeGreaterThanOrEqual(0);
    expect(r.evaluations).toBe(8 + r.evaluationsBreakdown.reevaluation);
  });
});

describe("formatPercent", () => {
  it("formats shares, never prints -0.00%, and marks undefined values", () => {
    expect(formatPercent(0.0523)).toBe("5.23%");
    expect(formatPercent(-1e-9)).toBe("0.00%");
    expect(formatPercent(-0.25)).toBe("-25.00%");
    for (const v of [null, undefined, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) expect(formatPercent(v)).toBe("—");
  });
});
