import { describe, expect, it } from "vitest";
import { fitGaussianProcess, gpMemoryBytes, loadSurrogate, type GaussianProcess } from "@floorcast/surrogate";

const data = (x: number[][], y: number[][]) => ({ inputs: x[0] ? x[0].map((_, k) => `x${k}`) : ["x0"], targets: y[0] ? y[0].map((_, k) => `y${k}`) : ["y0"], x, y });

describe("fitGaussianProcess edge cases", () => {
  it("NaN / ±Infinity in x or y → RangeError naming row and column", () => {
    const x = [[0, 1], [1, 0], [0.5, 0.5]];
    const y = [[1], [2], [3]];
    expect(() => fitGaussianProcess(data([[0, 1], [1, NaN], [0.5, 0.5]], y))).toThrow(/data\.x\[1\]\[1\] must be finite, got NaN/);
    expect(() => fitGaussianProcess(data([[0, 1], [1, 0], [Infinity, 0.5]], y))).toThrow(/data\.x\[2\]\[0\]/);
    expect(() => fitGaussianProcess(data(x, [[1], [-Infinity], [3]]))).toThrow(/data\.y\[1\]\[0\] must be finite, got -Infinity/);
    expect(() => fitGaussianProcess(data(x, [[1], [2]]))).toThrow(RangeError);
    expect(() => fitGaussianProcess(data([[0, 1], [1], [0, 0]], y))).toThrow(/data\.x\[1\]/);
  });

  it("empty data → RangeError; wrong types → TypeError; bad options → RangeError naming the option", () => {
    expect(() => fitGaussianProcess({ inputs: ["a"], targets: ["b"], x: [], y: [] })).toThrow(/at least one row/);
    expect(() => fitGaussianProcess(null as never)).toThrow(TypeError);
    expect(() => fitGaussianProcess({ inputs: ["a"], targets: ["b"], x: [["1" as unknown as number]], y: [[1]] })).toThrow(TypeError);
    const ok = data([[0], [1]], [[0], [1]]);
    expect(() => fitGaussianProcess(ok, { kernel: "cubic" as never })).toThrow(/options\.kernel/);
    expect(() => fitGaussianProcess(ok, { restarts: 0 })).toThrow(/options\.restarts/);
    expect(() => fitGaussianProcess(ok, { noiseVariance: -1 })).toThrow(/options\.noiseVariance/);
    expect(() => fitGaussianProcess(ok, { hyperparameters: [] })).toThrow(/options\.hyperparameters/);
  });

  it("n = 1: predicts the single value with finite sd", () => {
    const gp = fitGaussianProcess(data([[0.3, 0.7]], [[5]]));
    const p = gp.predict([[0.3, 0.7], [0.9, 0.1]]);
    expect(p.mean[0]![0]).toBeCloseTo(5, 6);
    expect(p.mean[1]![0]).toBeCloseTo(5, 6); // standardised prior mean is the data mean (common practice)
    for (const row of p.sd) expect(Number.isFinite(row[0])).toBe(true);
    expect(gp.leaveOneOut().mean[0]![0]).toBeCloseTo(5, 6);
  });

  it("constant target: no NaN anywhere, predictions equal the constant", () => {
    const x = [[0, 0], [1, 0], [0, 1], [1, 1], [0.5, 0.5]];
    const gp = fitGaussianProcess(data(x, x.map(() => [7])));
    const p = gp.predict([[0.2, 0.9], [3, -1]]);
    for (const row of p.mean) expect(row[0]).toBeCloseTo(7, 10);
    for (const row of p.sd) expect(Number.isFinite(row[0])).toBe(true);
    expect(Number.isFinite(gp.logMarginalLikelihood()[0])).toBe(true);
    for (const v of gp.gradient([0.5, 0.5])[0]!) expect(v).toBeCloseTo(0, 10);
    const loo = gp.leaveOneOut();
    for (const row of loo.mean) expect(row[0]).toBeCloseTo(7, 10);
  });

  it("duplicate inputs: fits without NaN (learned noise, and noise fixed at 0 → jitter recorded, near-singular warning)", () => {
    const x = [[0, 0], [0, 0], [1, 0], [0, 1], [1, 1], [1, 1]];
    const y = [[1], [1.01], [2], [3], [4], [3.98]];
    const learned = fitGaussianProcess(data(x, y));
    expect(learned.predict([[0.5, 0.5]]).mean[0]!.every(Number.isFinite)).toBe(true);
    const exact = fitGaussianProcess(data(x, y), { noiseVariance: 0 });
    const d = exact.diagnostics.targets[0]!;
    expect(d.jitter).toBeGreaterThan(0);
    expect(d.warnings.join(" ")).toMatch(/near-singular/);
    const p = exact.predict([[0, 0], [0.4, 0.6]]);
    for (const row of [...p.mean, ...p.sd]) expect(Number.isFinite(row[0])).toBe(true);
    expect(exact.toJSON().payload.components[0]!.jitter).toBe(d.jitter);
  });

  it("constant input column, and a column outside declared bounds, stay finite", () => {
    const x = [[1, 0], [1, 0.5], [1, 1]];
    const gp = fitGaussianProcess(data(x, [[0], [1], [0]]));
    expect(Number.isFinite(gp.predict([[2, 0.2]]).mean[0]![0]!)).toBe(true);
    expect(gp.gradient([1, 0.5])[0]!.every(Number.isFinite)).toBe(true);
  });

  it("predict/gradient validate their rows", () => {
    const gp = fitGaussianProcess(data([[0], [1]], [[0], [1]]));
    expect(() => gp.predict([[NaN]])).toThrow(/x\[0\]\[0\] must be finite/);
    expect(() => gp.predict([[1, 2]])).toThrow(RangeError);
    expect(() => gp.gradient([Infinity])).toThrow(RangeError);
    expect(gp.predict([])).toEqual({ mean: [], sd: [], sdLatent: [] });
  });

  it("memory budget: beyond it, a RangeError BEFORE allocating (n = 20,000 would need ~6 GiB)", () => {
    const n = 20_000;
    const x = Array.from({ length: n }, (_, i) => [i / n]);
    const y = x.map((r) => [r[0]!]);
    expect(gpMemoryBytes(n, 1, 1, 600)).toBeGreaterThan(2 * 1024 ** 3);
    expect(() => fitGaussianProcess(data(x, y))).toThrow(/memory budget of 2\.00 GiB/);
    expect(() => fitGaussianProcess(data(x.slice(0, 100), y.slice(0, 100)), { memoryBudgetBytes: 1000 })).toThrow(RangeError);
  });

  it("hyperparameter subset: fitted on a maximin subset of m rows, conditioned on all rows", () => {
    const x = Array.from({ length: 120 }, (_, i) => [Math.abs(Math.sin(i * 1.7)), Math.abs(Math.cos(i * 2.3))]);
    const y = x.map((r) => [Math.sin(3 * r[0]!) + r[1]!]);
    const gp = fitGaussianProcess(data(x, y), { hyperparameterSubset: 40 });
    expect(gp.diagnostics.hyperparameterRows).toBe(40);
    expect(gp.diagnostics.polishIterations).toBe(10);
    // The polish starts at the subset optimum and only accepts likelihood increases (derived: monotone line search).
    const unpolished = fitGaussianProcess(data(x, y), { hyperparameterSubset: 40, polishIterations: 0 });
    expect(unpolished.diagnostics.polishIterations).toBe(0);
    expect(gp.logMarginalLikelihood()[0]!).toBeGreaterThanOrEqual(unpolished.logMarginalLikelihood()[0]!);
    expect(gp.toJSON().payload.trainingInputs).toHaveLength(120);
    // The polish start is named in the diagnostics and survives the model file; without a polish there is none.
    const start = gp.diagnostics.targets[0]!.polishStart;
    expect(start).toMatch(/^(subset optimum|lengthscale\[x\d\] (× 1\/(4|16)|= 1(\/4)?))/);
    const loaded = loadSurrogate(JSON.stringify(gp.toJSON())) as GaussianProcess;
    expect(loaded.diagnostics.targets[0]!.polishStart).toBe(start);
    expect(unpolished.diagnostics.targets[0]!.polishStart).toBeUndefined();
    expect(() => fitGaussianProcess(data(x, y), { probeLengthscales: "yes" as unknown as boolean })).toThrow(
      /^fitGaussianProcess: options\.probeLengthscales must be a boolean/,
    );
    const full = fitGaussianProcess(data(x, y), { hyperparameterSubset: false });
    expect(full.diagnostics.hyperparameterRows).toBe(120);
    // Both interpolate the training rows (noise ≥ 1e-6 floor): training-row error tiny relative to the range (derived).
    const p = gp.predict(x);
    x.forEach((_, i) => expect(Math.abs(p.mean[i]![0]! - y[i]![0]!)).toBeLessThan(1e-2));
  });
});
