import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { loadProblem } from "../../packages/bench/src/problem/load-problem.js";
import { fileURLToPath } from "node:url";
// the repository's problem files (the package finds its shipped copies relative to its built dist/)
const DEFAULT_PROBLEMS_DIR = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));
import { benchPlans } from "../../packages/bench/src/harness/bench-plans.js";
import { benchSettings } from "../../packages/bench/src/harness/bench-settings.js";
import { floorcastTrainer } from "../../packages/bench/src/harness/floorcast-trainer.js";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { profiledExactEvaluator } from "../../packages/bench/src/harness/profiled-exact-evaluator.js";
import { plateStackBayesianOptimization } from "../../packages/bench/src/optimize/plate-stack-bayesian.js";
import { sampleTrainingSet } from "../../packages/bench/src/harness/sample-training-set.js";

const larkspur = await loadProblem(join(DEFAULT_PROBLEMS_DIR, "larkspur-fit-gfa.json"));
const branin = await loadProblem(join(DEFAULT_PROBLEMS_DIR, "standard-branin.json"));
// FAR 1.2 × 12 m × 35 m = 504 m² (max GFA = FAR × lot area, DC Zoning Handbook "Floor Area Ratio")
const LARKSPUR_OPTIMUM = 504;

describe("plate-stack in the bench", () => {
  it("is planned by default where the evaluator reports plate profiles, and not on a test function", () => {
    const s = benchSettings(true, 1);
    expect(benchPlans(larkspur, s, true, null).map((p) => p.trainer.name)).toEqual(["gp", "nn", "plate-stack"]);
    expect(benchPlans(branin, s, true, null).map((p) => p.trainer.name)).toEqual(["gp", "nn"]);
  });
  it("trains through the training CSV's plate profile and the model file, and predicts held-out designs closely", async () => {
    const dir = mkdtempSync(join(tmpdir(), "fc-ps-bench-"));
    const train = await sampleTrainingSet(larkspur, 20, "train-1", dir);
    const model = await floorcastTrainer("plate-stack", true).fit(train, 1, join(dir, "ps.json"));
    expect((model as { kind?: string }).kind).toBe("plate-stack");
    const test = await sampleTrainingSet(larkspur, 100, "test-1", dir, undefined, "random");
    const p = await model.predict(test.x);
    let within = 0;
    test.y.forEach((y, i) => {
      if (Math.abs(p.mean[i]![0]! - y[0]!) <= 0.01 * LARKSPUR_OPTIMUM) within++;
    });
    // one smooth geometry input (the side yard): the learned plate is nearly exact, so the gfa of ≥ 90% of the
    // held-out designs is within 1% of the FAR cap's scale
    expect(within).toBeGreaterThanOrEqual(90);
  }, 600_000);
});

describe("Bayesian optimization through the stacking rule", () => {
  it("reaches the larkspur optimum (504 m²) within 0.5% in at most 25 exact evaluations, the same way for a seed", async () => {
    const run = () => plateStackBayesianOptimization(larkspur.optimization, profiledExactEvaluator(larkspur), { seed: 1, maxEvaluations: 25 });
    const r = await run();
    const hit = r.trace.findIndex((v) => Number.isFinite(v) && (LARKSPUR_OPTIMUM - v) / LARKSPUR_OPTIMUM <= 0.005);
    expect(hit).toBeGreaterThanOrEqual(0);
    expect(r.best!.outputs.height).toBeLessThanOrEqual(10);
    expect((await run()).trace).toEqual(r.trace);
  }, 600_000);
  it("refuses an evaluator without a plate profile and outputs the plate stack does not give", async () => {
    const plain = { evaluate: async (b: readonly Record<string, number | string>[]) => b.map((d) => larkspur.evaluate(d)) };
    await expect(plateStackBayesianOptimization(larkspur.optimization, plain, { seed: 1, maxEvaluations: 12 })).rejects.toThrow(/reports no .*plate profile/);
    const other = { ...larkspur.optimization, objectives: [{ output: "facadeLength", sense: "max" as const }] };
    await expect(plateStackBayesianOptimization(other, profiledExactEvaluator(larkspur), { seed: 1, maxEvaluations: 12 })).rejects.toThrow(/facadeLength/);
  });
});
