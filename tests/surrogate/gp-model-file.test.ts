import { describe, expect, it } from "vitest";
import { MODEL_FORMAT_VERSION, fitGaussianProcess, loadSurrogate, parseModelFile } from "@floorcast/surrogate";
import type { GaussianProcess } from "@floorcast/surrogate";
import { createGpPredictor } from "../../packages/surrogate/src/predict/gp-predictor.js";
import { hartmann3, maximinLhs } from "./gp-test-functions.js";

const x = maximinLhs(40, [0, 0, 0], [1, 1, 1], 2).map((r) => [r[0]! * 10, r[1]! - 5, r[2]! * 200]);
const y = x.map((r) => [hartmann3([r[0]! / 10, r[1]! + 5, r[2]! / 200]), r[0]! + r[1]!]);
const gp = fitGaussianProcess({ inputs: ["a", "b", "c"], targets: ["f", "g"], x, y }, { seed: 3 });
const xt = maximinLhs(25, [0, -5, 0], [10, -4, 200], 5);

describe("GP model file", () => {
  it("carries the shared envelope (kind, formatVersion, modelType, names, scalings, payload, training)", () => {
    const file = gp.toJSON();
    expect(file.kind).toBe("floorcast.surrogate");
    expect(file.formatVersion).toBe(MODEL_FORMAT_VERSION);
    expect(file.modelType).toBe("gp");
    expect(file.inputs).toEqual(["a", "b", "c"]);
    expect(file.targets).toEqual(["f", "g"]);
    expect(file.payload.trainingInputs).toHaveLength(40);
    expect(file.payload.components).toHaveLength(2);
    expect(file.training.n).toBe(40);
    expect(file.training.seed).toBe(3);
    expect(() => parseModelFile(JSON.parse(JSON.stringify(file)))).not.toThrow();
  });

  it("a loaded model predicts bitwise identically (through JSON text)", () => {
    const loaded = loadSurrogate(JSON.stringify(gp)) as GaussianProcess;
    expect(loaded.kind).toBe("gp");
    const a = gp.predict(xt);
    const b = loaded.predict(xt);
    expect(b.mean).toEqual(a.mean);
    expect(b.sd).toEqual(a.sd);
    expect(b.sdLatent).toEqual(a.sdLatent);
    expect(loaded.gradient(xt[0]!)).toEqual(gp.gradient(xt[0]!));
    expect(loaded.leaveOneOut()).toEqual(gp.leaveOneOut());
    expect(loaded.logMarginalLikelihood()).toEqual(gp.logMarginalLikelihood());
    expect(loaded.toJSON()).toEqual(JSON.parse(JSON.stringify(gp.toJSON())));
  });

  it("the dependency-free predictor matches fitGaussianProcess to 1e-9 relative", () => {
    const p = createGpPredictor(JSON.parse(JSON.stringify(gp.toJSON())));
    const a = gp.predict(xt);
    const b = p.predict(xt);
    for (let i = 0; i < xt.length; i++)
      for (let j = 0; j < 2; j++) {
        // Same formulas, a different (unpaired) Cholesky loop: agreement to round-off, far inside 1e-9 (derived).
        expect(Math.abs(b.mean[i]![j]! - a.mean[i]![j]!)).toBeLessThanOrEqual(1e-9 * Math.abs(a.mean[i]![j]!));
        expect(Math.abs(b.sd![i]![j]! - a.sd[i]![j]!)).toBeLessThanOrEqual(1e-9 * a.sd[i]![j]!);
      }
    expect(() => p.predict([[1, 2]])).toThrow(RangeError);
    expect(() => p.predict([[1, NaN, 3]])).toThrow(/x\[0\]\[1\]/);
  });

  it("refuses a wrong kind, a newer format version (with an upgrade message) and a malformed payload", () => {
    const file = JSON.parse(JSON.stringify(gp.toJSON()));
    expect(() => loadSurrogate({ ...file, kind: "other" })).toThrow(/kind must be "floorcast.surrogate"/);
    expect(() => loadSurrogate({ ...file, formatVersion: 2 })).toThrow(/newer floorcast.*Upgrade/);
    expect(() => loadSurrogate({ ...file, formatVersion: 0 })).toThrow(/formatVersion must be 1/);
    expect(() => loadSurrogate({ ...file, modelType: "forest" })).toThrow(RangeError);
    expect(() => loadSurrogate(null)).toThrow(TypeError);
    expect(() => loadSurrogate("{not json", "m.json")).toThrow(/m\.json: not valid JSON/);
    const bad = JSON.parse(JSON.stringify(file));
    bad.payload.components[1].signalVariance = -1;
    expect(() => loadSurrogate(bad, "m.json")).toThrow(/m\.json: payload\.components\.1\.signalVariance/);
    const short = JSON.parse(JSON.stringify(file));
    short.payload.components[0].alpha.pop();
    expect(() => loadSurrogate(short)).toThrow(/alpha must have 40 entries/);
    const scal = JSON.parse(JSON.stringify(file));
    scal.inputScaling.lower.pop();
    expect(() => loadSurrogate(scal)).toThrow(/inputScaling\.lower must have 3 entries/);
  });
});

describe("GP through the dependency-free loadPredictor (@floorcast/surrogate/predict)", () => {
  it("dispatches gp files to the GP predictor and matches to 1e-9 relative", async () => {
    const { loadPredictor } = await import("@floorcast/surrogate/predict");
    const p = loadPredictor(JSON.stringify(gp.toJSON()));
    expect(p.modelType).toBe("gp");
    const a = gp.predict(xt);
    const b = p.predict(xt);
    for (let i = 0; i < xt.length; i++)
      for (let j = 0; j < 2; j++) {
        expect(Math.abs(b.mean[i]![j]! - a.mean[i]![j]!)).toBeLessThanOrEqual(1e-9 * Math.abs(a.mean[i]![j]!));
        expect(Math.abs(b.sd![i]![j]! - a.sd[i]![j]!)).toBeLessThanOrEqual(1e-9 * a.sd[i]![j]!);
      }
  });
});
