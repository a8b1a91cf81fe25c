import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  bayesianOptimization,
  geneticAlgorithm,
  gridAxes,
  gridSearch,
  nsga2,
  particleSwarm,
  patternSearch,
  projectedGradient,
  randomSearch,
  scoreOutputs,
  type OptimizationProblem,
} from "@floorcast/bench";
import { createVariableCodec } from "@floorcast/sampler";
import { braninEvaluator, braninProblem, fnEvaluator, forrester, forresterProblem } from "./optimize-test-functions.js";

const single = [
  ["gridSearch", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => gridSearch(p, e, { maxEvaluations: m, resolution: 5 })],
  ["randomSearch", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => randomSearch(p, e, { maxEvaluations: m, seed: 1 })],
  ["lhs", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => randomSearch(p, e, { maxEvaluations: m, seed: 1, design: "lhs" })],
  ["geneticAlgorithm", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => geneticAlgorithm(p, e, { maxEvaluations: m, seed: 1 })],
  ["particleSwarm", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => particleSwarm(p, e, { maxEvaluations: m, seed: 1 })],
  ["projectedGradient", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => projectedGradient(p, e, { maxEvaluations: m, seed: 1 })],
  ["patternSearch", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => patternSearch(p, e, { x1: 0, x2: 5 }, { maxEvaluations: m })],
  ["bayesianOptimization", (p: OptimizationProblem, e: ReturnType<typeof fnEvaluator>, m: number) => bayesianOptimization(p, e, { maxEvaluations: m, seed: 1 })],
] as const;

describe("optimizer entry points: validation (common practice: TypeError for types, RangeError for values)", () => {
  it("rejects an empty variable list, min > max, bad steps, duplicate names and levels", async () => {
    const ev = braninEvaluator();
    const obj = braninProblem.objectives;
    await expect(randomSearch({ variables: [], objectives: obj }, ev, { maxEvaluations: 5 })).rejects.toThrow(/randomSearch: problem.variables must not be empty/);
    await expect(
      geneticAlgorithm({ variables: [{ kind: "continuous", name: "x1", min: 2, max: 1 }], objectives: obj }, ev),
    ).rejects.toThrow(/geneticAlgorithm: problem.variables\[0\].min must be ≤ max, got min 2 > max 1/);
    await expect(
      particleSwarm({ variables: [{ kind: "continuous", name: "x1", min: 0, max: 1, step: 0 }], objectives: obj }, ev),
    ).rejects.toThrow(RangeError);
    await expect(
      gridSearch({ variables: [{ kind: "continuous", name: "x1", min: 0, max: NaN }], objectives: obj }, ev),
    ).rejects.toThrow(/must be finite/);
    await expect(
      gridSearch({ variables: [{ kind: "integer", name: "n", min: 0.5, max: 3 }], objectives: obj }, ev),
    ).rejects.toThrow(/must be integers/);
    await expect(
      gridSearch({ variables: [{ kind: "categorical", name: "c", levels: [] }], objectives: obj }, ev),
    ).rejects.toThrow(/levels must not be empty/);
    await expect(
      gridSearch({ variables: [{ kind: "categorical", name: "c", levels: ["a", "a"] }], objectives: obj }, ev),
    ).rejects.toThrow(/must not repeat/);
    await expect(
      gridSearch({ variables: [...braninProblem.variables, braninProblem.variables[0]!], objectives: obj }, ev),
    ).rejects.toThrow(/duplicate/);
    await expect(gridSearch({ variables: braninProblem.variables, objectives: [] }, ev)).rejects.toThrow(/objectives must not be empty/);
    await expect(gridSearch(braninProblem, {} as never)).rejects.toThrow(TypeError);
    await expect(gridSearch(braninProblem, ev, { maxEvaluations: -1 })).rejects.toThrow(/maxEvaluations must be an integer ≥ 0/);
    await expect(gridSearch(braninProblem, ev, { maxEvaluations: 10, resolution: 5 })).rejects.toThrow(/the grid has 25 points/);
    await expect(randomSearch(braninProblem, ev, {} as never)).rejects.toThrow(/maxEvaluations must be given/);
    await expect(
      gridSearch({ ...braninProblem, constraints: [{ output: "f", op: "<" as never, value: 1 }] }, ev),
    ).rejects.toThrow(/op must be/);
  });

  it("geneticAlgorithm's mutationEtaGrowth: a number ≥ 0; 0 keeps ηm constant and changes the run", async () => {
    const ev = braninEvaluator();
    await expect(geneticAlgorithm(braninProblem, ev, { maxEvaluations: 40, mutationEtaGrowth: -1 })).rejects.toThrow(/geneticAlgorithm: options.mutationEtaGrowth must be ≥ 0, got -1/);
    await expect(geneticAlgorithm(braninProblem, ev, { maxEvaluations: 40, mutationEtaGrowth: Number.NaN })).rejects.toThrow(RangeError);
    await expect(geneticAlgorithm(braninProblem, ev, { maxEvaluations: 40, mutationEtaGrowth: "2" as never })).rejects.toThrow(TypeError);
    // the first generation mutates with ηm itself; later ones differ once the growth has moved it
    const run = (growth: number) => geneticAlgorithm(braninProblem, braninEvaluator(), { seed: 4, maxEvaluations: 400, mutationEtaGrowth: growth, keepHistory: true });
    const [grown, flat] = await Promise.all([run(200), run(0)]);
    expect(grown.history!.slice(0, 40)).toEqual(flat.history!.slice(0, 40));
    expect(grown.history!.slice(40)).not.toEqual(flat.history!.slice(40));
  });

  it("single-objective methods refuse two objectives; NSGA-II refuses one", async () => {
    const two: OptimizationProblem = { ...braninProblem, objectives: [{ output: "f", sense: "min" }, { output: "g", sense: "max" }] };
    await expect(geneticAlgorithm(two, braninEvaluator())).rejects.toThrow(/exactly one objective, got 2/);
    await expect(bayesianOptimization(two, braninEvaluator(), { maxEvaluations: 5 })).rejects.toThrow(RangeError);
    await expect(nsga2(braninProblem, braninEvaluator())).rejects.toThrow(/at least two objectives, got 1/);
  });

  it("an evaluator returning the wrong number of outputs is a RangeError", async () => {
    const bad = { evaluate: async () => [{ f: 1 }] };
    await expect(randomSearch(braninProblem, bad, { maxEvaluations: 3 })).rejects.toThrow(/returned 1 outputs for 3 designs/);
  });

  it.each(single)("%s with budget 0 evaluates nothing and reports no optimum", async (_, run) => {
    const ev = braninEvaluator();
    const r = await run(braninProblem, ev, 0);
    expect(r.evaluations).toBe(0);
    expect(ev.designs).toBe(0);
    expect(r.best).toBeNull();
    expect(r.front).toEqual([]);
  });

  it.each(single)("%s never exceeds its budget and counts designs and calls exactly", async (_, run) => {
    const ev = braninEvaluator();
    const r = await run(braninProblem, ev, 25);
    expect(r.evaluations).toBeLessThanOrEqual(25);
    expect(r.evaluations).toBe(ev.designs);
    expect(r.evaluatorCalls).toBe(ev.calls);
    expect(r.trace).toHaveLength(r.evaluations);
  });
});

describe("NaN outputs are infeasible, counted and never reported", () => {
  // f is NaN on the left half of [0, 1]; the Forrester minimum −6.0207 at 0.757 lies in the right half (VLSE).
  const ev = () => fnEvaluator((d) => ({ f: (d.x as number) < 0.5 ? NaN : forrester(d.x as number) }));
  it.each([
    ["grid", () => gridSearch(forresterProblem, ev(), { resolution: 101 })],
    ["GA", () => geneticAlgorithm(forresterProblem, ev(), { seed: 2, maxEvaluations: 400 })],
    ["PSO", () => particleSwarm(forresterProblem, ev(), { seed: 2, maxEvaluations: 400 })],
    ["gradient", () => projectedGradient(forresterProblem, ev(), { seed: 2, maxEvaluations: 400 })],
    ["BO", () => bayesianOptimization(forresterProblem, ev(), { seed: 2, maxEvaluations: 15 })],
  ])("%s", async (_, run) => {
    const r = await run();
    expect(r.invalid).toBeGreaterThan(0);
    expect(r.best).not.toBeNull();
    expect(r.best!.valid).toBe(true);
    expect(Number.isFinite(r.best!.objectives[0])).toBe(true);
    expect(r.best!.design.x as number).toBeGreaterThanOrEqual(0.5);
  });
  it("scoreOutputs marks NaN, missing and infinite outputs invalid with infinite violation", () => {
    const p: OptimizationProblem = { ...forresterProblem, constraints: [{ output: "h", op: "<=", value: 2 }] };
    for (const o of [{ f: NaN, h: 1 }, { f: 1 }, { f: 1, h: Infinity }, { f: -Infinity, h: 0 }]) {
      const e = scoreOutputs(p, { x: 0.1 }, o);
      expect(e.valid).toBe(false);
      expect(e.feasible).toBe(false);
      expect(e.violation).toBe(Infinity);
    }
    const ok = scoreOutputs(p, { x: 0.1 }, { f: 1, h: 3 });
    expect(ok.valid).toBe(true);
    expect(ok.violation).toBeCloseTo(0.5, 12); // (3 − 2)/max(1, 2), derived from the documented scaling
  });
});

describe("determinism by seed", () => {
  it.each([
    ["GA", (s: number) => geneticAlgorithm(braninProblem, braninEvaluator(), { seed: s, maxEvaluations: 200 })],
    ["PSO", (s: number) => particleSwarm(braninProblem, braninEvaluator(), { seed: s, maxEvaluations: 200 })],
    ["LHS", (s: number) => randomSearch(braninProblem, braninEvaluator(), { seed: s, maxEvaluations: 50, design: "lhs" })],
    ["gradient", (s: number) => projectedGradient(braninProblem, braninEvaluator(), { seed: s, maxEvaluations: 200 })],
    ["BO", (s: number) => bayesianOptimization(braninProblem, braninEvaluator(), { seed: s, maxEvaluations: 14 })],
  ])("%s: same seed, same run; another seed, another run", async (_, run) => {
    const a = await run(7);
    const b = await run(7);
    const c = await run(8);
    expect(b.trace).toEqual(a.trace);
    expect(b.best?.design).toEqual(a.best?.design);
    expect(c.trace).not.toEqual(a.trace);
  });
});

describe("grid: step-aware axes and a degenerate bound", () => {
  it("counts lattice values, levels and fixed variables (derived by hand)", () => {
    const p: OptimizationProblem = {
      variables: [
        { kind: "continuous", name: "a", min: 0, max: 1 },
        { kind: "continuous", name: "b", min: 0, max: 1, step: 0.25 },
        { kind: "integer", name: "n", min: 2, max: 40 },
        { kind: "categorical", name: "c", levels: ["x", "y", "z"] },
        { kind: "continuous", name: "fixed", min: 3, max: 3 },
      ],
      objectives: [{ output: "f", sense: "max" }],
    };
    const { axes, count } = gridAxes(p, 5);
    expect(axes[0]).toEqual([0, 0.25, 0.5, 0.75, 1]);
    expect(axes[1]).toEqual([0, 0.25, 0.5, 0.75, 1]); // 5 lattice values, all kept
    expect(axes[2]).toEqual([2, 12, 21, 31, 40]); // 39 integers > 5: five evenly spaced lattice values
    expect(axes[3]).toEqual([0, 1, 2]); // every level
    expect(axes[4]).toEqual([3]);
    expect(count).toBe(5 * 5 * 5 * 3 * 1);
  });
  it("reports progress after each batch up to its count", async () => {
    const seen: [number, number][] = [];
    const r = await gridSearch(braninProblem, braninEvaluator(), { resolution: 21, batchSize: 100, onProgress: (d, t) => seen.push([d, t]) });
    expect(r.evaluations).toBe(441);
    expect(seen.map((s) => s[0])).toEqual([100, 200, 300, 400, 441]);
    expect(seen.every((s) => s[1] === 441)).toBe(true);
  });
});

describe("a degenerate bound (min = max) is a fixed variable, not an error", () => {
  // Branin plus a variable fixed at 3 that the function ignores: the optimum stays 5/(4π) (VLSE).
  const p: OptimizationProblem = { ...braninProblem, variables: [...braninProblem.variables, { kind: "continuous", name: "fixed", min: 3, max: 3 }] };
  it.each([
    ["GA", () => geneticAlgorithm(p, braninEvaluator(), { seed: 1, maxEvaluations: 300, keepHistory: true })],
    ["PSO", () => particleSwarm(p, braninEvaluator(), { seed: 1, maxEvaluations: 300, keepHistory: true })],
    ["gradient", () => projectedGradient(p, braninEvaluator(), { seed: 1, maxEvaluations: 300, keepHistory: true })],
    ["BO", () => bayesianOptimization(p, braninEvaluator(), { seed: 1, maxEvaluations: 15, keepHistory: true })],
    ["pattern", () => patternSearch(p, braninEvaluator(), { x1: 0, x2: 5, fixed: 3 }, { maxEvaluations: 100, keepHistory: true })],
  ])("%s keeps it at 3 and still optimizes the rest", async (_, run) => {
    const r = await run();
    expect(r.history!.every((e) => e.design.fixed === 3)).toBe(true);
    expect(r.best!.objectives[0]!).toBeLessThan(5); // the box's range of Branin is ≈ 0.4 … 308 (VLSE plot)
  }, 30_000);
});

describe("codec property: every coded vector is legal (fast-check)", () => {
  it("fromUnit and snap stay in bounds, on the lattice, on a level", () => {
    const p: OptimizationProblem = {
      variables: [
        { kind: "continuous", name: "a", min: -2, max: 5, step: 0.5 },
        { kind: "integer", name: "n", min: -3, max: 4 },
        { kind: "categorical", name: "c", levels: ["p", "q"] },
        { kind: "continuous", name: "z", min: 1, max: 2 },
      ],
      objectives: [{ output: "f", sense: "min" }],
    };
    const codec = createVariableCodec(p.variables);
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1, max: 2, noNaN: true }), { minLength: 4, maxLength: 4 }), (u) => {
        for (const x of [codec.fromUnit(u), codec.snapAll(u.map((v) => v * 10 - 3))]) {
          expect(x[0]! >= -2 && x[0]! <= 5 && Number.isInteger(x[0]! * 2)).toBe(true);
          expect(Number.isInteger(x[1]) && x[1]! >= -3 && x[1]! <= 4).toBe(true);
          expect(["p", "q"]).toContain(codec.toDesign(x).c);
          expect(x[3]! >= 1 && x[3]! <= 2).toBe(true);
        }
      }),
    );
  });
});

describe("one evaluator contract: the sampler's evaluators plug straight into the optimizers", () => {
  it("randomSearch on massingEvaluator finds a design whose outputs are the rule's; string outputs are left out", async () => {
    const { loadScenario, massingEvaluator } = await import("@floorcast/sampler");
    const scenario = await loadScenario(new URL("../../datasets/scenarios/larkspur-terraces.json", import.meta.url).pathname);
    const exact = massingEvaluator(scenario);
    const withFixed = {
      ...exact,
      evaluate: (batch: readonly Record<string, number | string | boolean>[]) => exact.evaluate(batch.map((d) => ({ ...scenario.fixed, ...d }))),
    };
    const problem: OptimizationProblem = { variables: scenario.parameters, objectives: [{ output: "gfa", sense: "max" }] };
    const r = await randomSearch(problem, withFixed, { maxEvaluations: 30, seed: 3, keepHistory: true });
    expect(r.evaluations).toBe(30);
    expect(r.best).not.toBeNull();
    const [again] = exact.evaluate([{ ...scenario.fixed, ...r.best!.design }]) as readonly Record<string, number | string | boolean>[];
    expect(r.best!.outputs["gfa"]).toBe(again!["gfa"]); // the same rule, the same number (derived)
    expect(typeof again!["limitedBy"]).toBe("string");
    expect("limitedBy" in r.best!.outputs).toBe(false);
    expect(Math.max(...r.history!.map((e) => e.outputs["gfa"]!))).toBe(r.best!.outputs["gfa"]);
  });
});
