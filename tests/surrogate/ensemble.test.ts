import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { EnsembleSurrogate, calibrateConformal, fitEnsemble, fitGaussianProcess, loadSurrogate } from "@floorcast/surrogate";
import { mlpTrainer } from "@floorcast/surrogate/nn";
import { loadPredictor } from "@floorcast/surrogate/predict";
import { mixtureOfMembers } from "../../packages/surrogate/src/predict/mixture-of-members.js";

function data(n: number, seed: string) {
  const rng = seedrandom(seed);
  const x = Array.from({ length: n }, () => [rng() * 3, rng()]);
  return { inputs: ["a", "b"], targets: ["u", "v"], x, y: x.map(([a, b]) => [Math.cos(a!) + b!, a! * b!]) };
}

describe("mixtureOfMembers (Lakshminarayanan, Pritzel & Blundell 2017, §2.4)", () => {
  it("worked example: means 1 and 3 → μ 2, σ 1; with member sds 1 → σ √2 (derived)", () => {
    const a = mixtureOfMembers([{ mean: [[1]] }, { mean: [[3]] }]);
    expect(a.mean[0]![0]).toBe(2);
    expect(a.sd[0]![0]).toBe(1);
    const b = mixtureOfMembers([{ mean: [[1]], sd: [[1]] }, { mean: [[3]], sd: [[1]] }]);
    expect(b.sd[0]![0]).toBeCloseTo(Math.SQRT2, 15);
    expect(mixtureOfMembers([{ mean: [[5, 6]] }]).sd).toEqual([[0, 0]]);
  });
});

describe("fitEnsemble", () => {
  it("k MLP members from different seeds: mean = member average, sd = spread; file round-trips", async () => {
    const d = data(80, "ens");
    const e = await fitEnsemble(mlpTrainer({ layers: [8], epochs: 10 }), d, { members: 3, seed: 11 });
    expect(e.members).toHaveLength(3);
    const seeds = (e.toJSON().training as { memberSeeds: number[] }).memberSeeds;
    expect(new Set(seeds).size).toBe(3);
    const q = d.x.slice(0, 7);
    const p = e.predict(q);
    const m = e.members.map((s) => s.predict(q).mean);
    p.mean.forEach((row, i) => row.forEach((v, j) => {
      const mu = (m[0]![i]![j]! + m[1]![i]![j]! + m[2]![i]![j]!) / 3;
      expect(v).toBeCloseTo(mu, 12);
      const sd = Math.sqrt(m.reduce((s, mm) => s + (mm[i]![j]! - mu) ** 2, 0) / 3);
      expect(p.sd![i]![j]).toBeCloseTo(sd, 12);
    }));
    expect(e.gradient!(q[0]!)).toHaveLength(2);
    const json = JSON.parse(JSON.stringify(e.toJSON()));
    const loaded = loadSurrogate(json);
    expect(loaded.kind).toBe("ensemble");
    const viaPredictor = loadPredictor(json).predict(q);
    const viaFile = loaded.predict(q);
    viaFile.mean.forEach((row, i) => row.forEach((v, j) => {
      expect(viaPredictor.mean[i]![j]).toBeCloseTo(v, 12);
      // tfjs float32 members vs float64 file arithmetic: 1e-5 of the target scale.
      expect(Math.abs(v - p.mean[i]![j]!)).toBeLessThan(1e-5 * Math.max(1, Math.abs(v)));
    }));
  });

  it("wraps GP members too (each member's sd enters the mixture), and a conformal wrapper nests the ensemble", async () => {
    const d = data(40, "ens-gp");
    const e = await fitEnsemble(async (t, seed) => fitGaussianProcess(t, { seed, restarts: 1 }), d, { members: 2, seed: 3 });
    const p = e.predict(d.x.slice(0, 3));
    const ps = e.members.map((m) => m.predict(d.x.slice(0, 3)));
    const v = (ps[0]!.sd![0]![0]! ** 2 + ps[1]!.sd![0]![0]! ** 2 + (ps[0]!.mean[0]![0]! - p.mean[0]![0]!) ** 2 + (ps[1]!.mean[0]![0]! - p.mean[0]![0]!) ** 2) / 2;
    expect(p.sd![0]![0]).toBeCloseTo(Math.sqrt(v), 12);
    const c = calibrateConformal(e, data(60, "ens-cal"), { coverage: 0.8 });
    expect(c.calibration.score).toBe("normalised");
    const json = JSON.parse(JSON.stringify(c.toJSON()));
    expect(json.payload.base.modelType).toBe("ensemble");
    expect(json.payload.base.payload.members[0].modelType).toBe("gp");
    const a = loadPredictor(json).predict(d.x.slice(0, 5));
    const b = c.predict(d.x.slice(0, 5));
    a.interval!.upper.forEach((r, i) => r.forEach((u, j) => expect(Math.abs(u - b.interval!.upper[i]![j]!)).toBeLessThan(1e-9 * (1 + Math.abs(u)))));
  });

  it("edge cases: zero members, mismatched members, bad member file named", async () => {
    const d = data(10, "ens-edge");
    await expect(fitEnsemble(mlpTrainer(), d, { members: 0 })).rejects.toThrow(/options\.members must be an integer ≥ 1/);
    await expect(fitEnsemble(mlpTrainer(), { ...d, x: [] , y: [] })).rejects.toThrow(/at least one row/);
    expect(() => new EnsembleSurrogate([], { n: 0, seed: 0, fitTimeMs: 0, memberSeeds: [] })).toThrow(RangeError);
    const a = await mlpTrainer({ layers: [2], epochs: 1 })(d, 0);
    const b = await mlpTrainer({ layers: [2], epochs: 1 })({ ...d, targets: ["u", "w"] }, 0);
    expect(() => new EnsembleSurrogate([a, b], { n: 10, seed: 0, fitTimeMs: 0, memberSeeds: [0, 0] })).toThrow(/members\[1\] must have the inputs and targets/);
    const e = new EnsembleSurrogate([a, a], { n: 10, seed: 0, fitTimeMs: 0, memberSeeds: [0, 0] });
    const broken = JSON.parse(JSON.stringify(e.toJSON()));
    broken.payload.members[1].payload.layers[0].bias = [1];
    expect(() => loadSurrogate(broken, "ens.json")).toThrow(/ens\.json payload\.members\[1\]/);
    expect(() => loadPredictor(broken)).toThrow(/bias must have 2 values/);
  });
});
