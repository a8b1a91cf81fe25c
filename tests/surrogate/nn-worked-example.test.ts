import { describe, expect, it } from "vitest";
import { MlpSurrogate, useNnBackend, type MlpModelFile } from "@floorcast/surrogate/nn";
import { createMlpPredictor, loadPredictor } from "@floorcast/surrogate/predict";
import { loadSurrogate } from "@floorcast/surrogate";

/**
 * A 2-2-1 network with hand-set weights (derived: worked by hand below).
 * Inputs x1 ∈ [0, 10], x2 ∈ [0, 4] map to z = 2(x − lower)/(upper − lower) − 1.
 * W1 (inputs × hidden) = [[1, −1], [0.5, 2]], b1 = [0, 0.5]; W2 = [[2], [−1]], b2 = [0.25];
 * target y = 100 + 20 · out.
 * x = (5, 3): z = (0, 0.5); pre-activations h = (0·1 + 0.5·0.5 + 0, 0·(−1) + 0.5·2 + 0.5) = (0.25, 1.5).
 *   relu: out = 2·0.25 − 1.5 + 0.25 = −0.75 → y = 85.
 *   tanh: out = 2·tanh 0.25 − tanh 1.5 + 0.25 = 2·0.2449187 − 0.9051483 + 0.25 = −0.1653109 → y = 96.693781.
 * x = (10, 0): z = (1, −1); h = (1 − 0.5, −1 − 2 + 0.5) = (0.5, −2.5).
 *   relu: out = 2·0.5 − 0 + 0.25 = 1.25 → y = 125.
 * Gradient at (5, 3), relu (both units active): dy/dx1 = 20·(2·1 + (−1)(−1))·(2/10) = 12,
 *   dy/dx2 = 20·(2·0.5 + (−1)·2)·(2/4) = −10.
 * tanh: derivatives scaled by 1 − tanh²: dy/dx1 = 8.2429453, dy/dx2 = 5.7860157.
 */
function file(activation: "relu" | "tanh"): MlpModelFile {
  return {
    kind: "floorcast.surrogate",
    formatVersion: 1,
    modelType: "mlp",
    inputs: ["x1", "x2"],
    targets: ["y"],
    inputScaling: { lower: [0, 0], upper: [10, 4] },
    outputScaling: { mean: [100], std: [20] },
    payload: {
      activation,
      layers: [
        { shape: [2, 2], weights: [1, -1, 0.5, 2], bias: [0, 0.5] },
        { shape: [2, 1], weights: [2, -1], bias: [0.25] },
      ],
    },
    training: { n: 0, seed: 0, fitTimeMs: 0 },
  };
}

// float32 tfjs arithmetic: ~1e-7 relative per operation, a few operations deep (common practice: 1e-6).
const F32 = 1e-6;

describe("hand-set 2-2-1 network reproduces the worked example", () => {
  it.each(["cpu", "wasm"] as const)("tfjs path (%s backend)", async (backend) => {
    await useNnBackend(backend);
    const relu = new MlpSurrogate(file("relu"));
    const p = relu.predict([[5, 3], [10, 0]]).mean;
    expect(p[0]![0]).toBeCloseTo(85, 4);
    expect(Math.abs(p[1]![0]! - 125) / 125).toBeLessThan(F32);
    const g = relu.gradient([5, 3]);
    expect(Math.abs(g[0]![0]! - 12) / 12).toBeLessThan(F32 * 10);
    expect(Math.abs(g[0]![1]! + 10) / 10).toBeLessThan(F32 * 10);
    const tanh = new MlpSurrogate(file("tanh"));
    expect(Math.abs(tanh.predict([[5, 3]]).mean[0]![0]! - 96.69378142325104) / 96.7).toBeLessThan(F32);
    const gt = tanh.gradient([5, 3]);
    expect(gt[0]![0]).toBeCloseTo(8.242945346145618, 4);
    expect(gt[0]![1]).toBeCloseTo(5.786015709590808, 4);
  });

  it("dependency-free predictor and main-entry loader (float64: 1e-12)", () => {
    for (const load of [(f: unknown) => loadPredictor(f), (f: unknown) => loadSurrogate(f)]) {
      const relu = load(JSON.parse(JSON.stringify(file("relu"))));
      const p = relu.predict([[5, 3], [10, 0], [5, 3]]).mean;
      expect(Math.abs(p[0]![0]! - 85)).toBeLessThan(1e-12);
      expect(Math.abs(p[1]![0]! - 125)).toBeLessThan(1e-12);
      expect(p[2]![0]).toBe(p[0]![0]);
      const tanh = load(file("tanh"));
      expect(Math.abs(tanh.predict([[5, 3]]).mean[0]![0]! - 96.69378142325104)).toBeLessThan(1e-10);
    }
    // Float64 back-propagation of the loaded file: the hand-worked gradients.
    const g = (loadSurrogate(file("relu")) as unknown as { gradient(x: number[]): number[][] }).gradient([5, 3]);
    expect(g[0]![0]).toBeCloseTo(12, 12);
    expect(g[0]![1]).toBeCloseTo(-10, 12);
    const gt = createMlpPredictor(file("tanh")).gradient([5, 3]);
    expect(gt[0]![0]).toBeCloseTo(8.242945346145618, 12);
    expect(gt[0]![1]).toBeCloseTo(5.786015709590808, 12);
    expect(() => createMlpPredictor(file("tanh")).gradient([5, Number.NaN])).toThrow(/x\[0\]\[1\]/);
  });

  it("a zero-width input bound maps that input to 0 (documented in mlp-payload.ts)", () => {
    const f = { ...file("relu"), inputScaling: { lower: [5, 0], upper: [5, 4] } };
    // x1 is ignored (z1 = 0), so (123, 3) predicts as (5, 3) did: 85.
    expect(loadPredictor(f).predict([[123, 3]]).mean[0]![0]).toBeCloseTo(85, 12);
  });

  it("rejects malformed files with the field named", () => {
    const bad = JSON.parse(JSON.stringify(file("relu")));
    bad.payload.layers[1].weights = [2];
    expect(() => loadPredictor(bad)).toThrow(/payload\.layers\[1\]\.weights must have 2 values/);
    expect(() => loadSurrogate(bad, "m.json")).toThrow(/m\.json: payload\.layers\.1\.weights/);
    const wrongKind = { ...file("relu"), kind: "other" };
    expect(() => loadPredictor(wrongKind)).toThrow(/kind must be "floorcast.surrogate"/);
    expect(() => loadPredictor({ ...file("relu"), formatVersion: 2 })).toThrow(/formatVersion 2/);
    const chain = JSON.parse(JSON.stringify(file("relu")));
    chain.payload.layers[1].shape = [3, 1];
    chain.payload.layers[1].weights = [1, 2, 3];
    expect(() => loadPredictor(chain)).toThrow(/layers\[1\]\.shape must be \[2, width ≥ 1\]/);
    expect(() => loadPredictor({ ...file("relu"), payload: { ...file("relu").payload, activation: "sigmoid" } })).toThrow(/activation/);
  });

  it("predict rejects NaN, ±Infinity and ragged rows naming row and column", () => {
    const p = loadPredictor(file("relu"));
    expect(() => p.predict([[1, 2], [Number.NaN, 1]])).toThrow(/x\[1\]\[0\]/);
    expect(() => p.predict([[1, Infinity]])).toThrow(/x\[0\]\[1\]/);
    expect(() => p.predict([[1]])).toThrow(/x\[0\] must have 2 values/);
    expect(p.predict([]).mean).toEqual([]);
    const s = new MlpSurrogate(file("relu"));
    expect(() => s.predict([[1, -Infinity]])).toThrow(/x\[0\]\[1\]/);
    expect(() => s.gradient([Number.NaN, 1])).toThrow(RangeError);
  });
});
