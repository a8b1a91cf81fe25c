import { describe, expect, it } from "vitest";
import * as tf from "@tensorflow/tfjs";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { fitMlp, mlpTrainer, useNnBackend } from "@floorcast/surrogate/nn";
import { createMlpPredictor, loadPredictor } from "@floorcast/surrogate/predict";

/** A smooth 3-input, 2-target test map (derived; any smooth map serves). */
function toyData(n: number, seed: string) {
  const rng = seedrandom(seed);
  const x: number[][] = [];
  const y: number[][] = [];
  for (let i = 0; i < n; i++) {
    const r = [rng() * 4, rng() * 2 - 1, 10 + rng() * 5];
    x.push(r);
    y.push([Math.sin(r[0]!) + r[1]! ** 2 + 0.1 * r[2]!, 50 * r[0]! * r[1]!]);
  }
  return { inputs: ["a", "b", "c"], targets: ["smooth", "product"], x, y };
}

const TINY = { layers: [8], epochs: 15, batchSize: 16 } as const;

describe("fitMlp", () => {
  it.each(["cpu", "wasm"] as const)("same seed and backend (%s) give identical weights; another seed differs", async (backend) => {
    const data = toyData(60, "det");
    const a = await fitMlp(data, { ...TINY, seed: 7, backend });
    const b = await fitMlp(data, { ...TINY, seed: 7, backend });
    const c = await fitMlp(data, { ...TINY, seed: 8, backend });
    expect(a.toJSON().payload).toEqual(b.toJSON().payload);
    expect(a.toJSON().payload).not.toEqual(c.toJSON().payload);
    expect((a.toJSON().training as { backend: string }).backend).toBe(backend);
  });

  it("leaves no tensors behind after fit, 1,000 predictions and gradients", async () => {
    await useNnBackend("cpu");
    const data = toyData(40, "leak");
    const before = tf.memory().numTensors;
    const m = await fitMlp(data, { ...TINY, seed: 1, backend: "cpu" });
    expect(tf.memory().numTensors).toBe(before);
    for (let i = 0; i < 1000; i++) m.predict([data.x[i % 40]!]);
    for (let i = 0; i < 20; i++) m.gradient(data.x[i]!);
    expect(tf.memory().numTensors).toBe(before);
    await expect(fitMlp({ ...data, x: [[1, 2, Number.NaN], ...data.x.slice(1)] })).rejects.toThrow(RangeError);
    expect(tf.memory().numTensors).toBe(before);
  });

  it("learns a smooth map several targets at once (test RMSE well under the target sd)", async () => {
    const train = toyData(300, "train");
    const test = toyData(200, "test");
    const m = await fitMlp(train, { layers: [32, 32], epochs: 120, seed: 3, backend: "wasm" });
    const p = m.predict(test.x).mean;
    for (let j = 0; j < 2; j++) {
      const sd = Math.sqrt(test.y.reduce((s, r) => s + r[j]! ** 2, 0) / 200 - (test.y.reduce((s, r) => s + r[j]!, 0) / 200) ** 2);
      const rmse = Math.sqrt(p.reduce((s, r, i) => s + (r[j]! - test.y[i]![j]!) ** 2, 0) / 200);
      // common practice: a fitted regressor should explain most variance; 0.2 sd ⇔ R² ≈ 0.96.
      expect(rmse).toBeLessThan(0.2 * sd);
    }
    const t = m.toJSON().training as { epochsRun: number; bestEpoch: number; nValidation: number };
    expect(t.nValidation).toBe(45);
    expect(t.bestEpoch).toBeLessThanOrEqual(t.epochsRun);
  });

  it("the predictor matches the tfjs predictions to 1e-5 relative (float32 vs float64 arithmetic)", async () => {
    const data = toyData(80, "match");
    const m = await fitMlp(data, { layers: [16, 16], epochs: 10, seed: 2, activation: "tanh" });
    const p = loadPredictor(JSON.parse(JSON.stringify(m.toJSON())));
    const a = m.predict(data.x).mean;
    const b = p.predict(data.x).mean;
    a.forEach((row, i) => row.forEach((v, j) => {
      const scale = Math.max(Math.abs(v), m.toJSON().outputScaling.std[j]!);
      expect(Math.abs(v - b[i]![j]!) / scale).toBeLessThan(1e-5);
    }));
  });

  it("gradient (tf.grad, original units) matches central finite differences of the float64 predictor", async () => {
    const data = toyData(80, "grad");
    const m = await fitMlp(data, { layers: [12], epochs: 20, seed: 4, activation: "tanh", backend: "cpu" });
    const p = loadPredictor(m.toJSON());
    const spans = [4, 2, 5];
    for (const x of data.x.slice(0, 5)) {
      const g = m.gradient(x);
      for (let k = 0; k < 3; k++) {
        const h = 1e-5 * spans[k]!;
        const up = x.slice();
        const dn = x.slice();
        up[k]! += h;
        dn[k]! -= h;
        const [pu, pd] = p.predict([up, dn]).mean;
        const backprop = createMlpPredictor(m.toJSON()).gradient(x);
        for (let j = 0; j < 2; j++) {
          const fd = (pu![j]! - pd![j]!) / (2 * h);
          const scale = m.toJSON().outputScaling.std[j]! / spans[k]!;
          // float32 autodiff vs float64 differences: 1e-4 of the target sd per input span (common practice).
          expect(Math.abs(g[j]![k]! - fd)).toBeLessThan(1e-4 * scale + 1e-4 * Math.abs(fd));
          // Float64 back-propagation of the file against the same differences (h² truncation: 1e-6).
          expect(Math.abs(backprop[j]![k]! - fd)).toBeLessThan(1e-6 * scale + 1e-6 * Math.abs(fd));
        }
      }
    }
  });

  it("edge cases: NaN names row and column, empty data, one row, constant targets", async () => {
    const data = toyData(20, "edge");
    const nan = { ...data, x: data.x.map((r, i) => (i === 3 ? [r[0]!, Number.NaN, r[2]!] : r)) };
    await expect(fitMlp(nan)).rejects.toThrow(/fitMlp: data\.x\[3\]\[1\] must be finite, got NaN/);
    const inf = { ...data, y: data.y.map((r, i) => (i === 5 ? [Infinity, r[1]!] : r)) };
    await expect(fitMlp(inf)).rejects.toThrow(/data\.y\[5\]\[0\]/);
    await expect(fitMlp({ ...data, x: [], y: [] })).rejects.toThrow(/at least one row/);
    const one = await fitMlp({ ...data, x: [data.x[0]!], y: [data.y[0]!] }, { ...TINY, epochs: 200 });
    expect((one.toJSON().training as { nValidation: number }).nValidation).toBe(0);
    const p1 = one.predict([data.x[0]!]).mean[0]!;
    // One row: outputs standardised with sd 1, so the net must fit z = 0; 0.05 absolute (common practice).
    expect(Math.abs(p1[0]! - data.y[0]![0]!)).toBeLessThan(0.05);
    expect(Math.abs(p1[1]! - data.y[0]![1]!)).toBeLessThan(0.05);
    const flat = await fitMlp({ ...data, y: data.y.map(() => [7, -3]) }, { ...TINY, epochs: 100 });
    expect(flat.toJSON().outputScaling.std).toEqual([1, 1]);
    // Constant targets are predicted exactly (output weights zeroed, documented in fitMlp).
    for (const r of flat.predict(data.x).mean) expect(r).toEqual([7, -3]);
  });

  it("validates options", async () => {
    const data = toyData(10, "opt");
    await expect(fitMlp(data, { layers: [0] })).rejects.toThrow(/options\.layers\[0\] must be an integer ≥ 1/);
    await expect(fitMlp(data, { backend: "gpu" as never })).rejects.toThrow(/options\.backend/);
    await expect(fitMlp(data, { learningRate: -1 })).rejects.toThrow(/options\.learningRate/);
    await expect(fitMlp(data, { validationFraction: 0.9 })).rejects.toThrow(/options\.validationFraction/);
    await expect(fitMlp(data, { epochs: 1.5 })).rejects.toThrow(RangeError);
    await expect(useNnBackend("webgl" as never)).rejects.toThrow(RangeError);
  });

  it("mlpTrainer passes its seed through (property: trainer(seed) ≡ fitMlp(seed))", async () => {
    const data = toyData(24, "trainer");
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 0, max: 1000 }), async (seed) => {
        const a = await mlpTrainer({ layers: [4], epochs: 3, backend: "cpu" })(data, seed);
        const b = await fitMlp(data, { layers: [4], epochs: 3, backend: "cpu", seed });
        expect(a.toJSON()).toMatchObject({ payload: (b.toJSON() as { payload: unknown }).payload });
      }),
      { numRuns: 4 },
    );
  });
});
