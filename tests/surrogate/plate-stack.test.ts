import { describe, expect, it } from "vitest";
import { PLATE_STACK_OUTPUTS, fitPlateStack, loadSurrogate, qmcNormalDraws, type PlateStackSurrogate } from "@floorcast/surrogate";
import { loadPredictor } from "@floorcast/surrogate/predict";
import { plateData, scenarioOf } from "./plate-stack-data.js";

// each slot's own unit (a scenario's units are checked): metres, except the floor area ratio, a plain ratio
const cont = (name: string, min: number, max: number) => ({ kind: "continuous", name, min, max, unit: name === "maxFar" ? "1" : "m", description: name });
const gfaCol = PLATE_STACK_OUTPUTS.indexOf("gfa");
const floorsCol = PLATE_STACK_OUTPUTS.indexOf("floors");

describe("plate-stack: only the arithmetic varies → predictions are exact", () => {
  // Derived: with the lot and the yards fixed, every learned quantity is a constant, so the surrogate is the
  // stacking rule itself and must match evaluateMassing at every point, steps included.
  const scenario = scenarioOf(
    [cont("maxHeight", 8, 40), { kind: "categorical", name: "floorHeight", levels: [2.9, 3.2, 3.6], unit: "m", description: "f" }, cont("maxFar", 0.8, 5)],
    { frontage: 24, depth: 36, setbackFront: 4, setbackSide: 2, setbackRear: 6, maxCoverage: 0.5, minPlateWidth: 8, minPlateArea: 100 },
  );
  it("matches the exact evaluator on 300 held-out rows", async () => {
    const { data } = await plateData(scenario, 12, 1);
    const model = await fitPlateStack(data, { seed: 3 });
    const file = model.toJSON();
    expect(file.payload.geometryInputs).toEqual([]);
    expect(Object.values(file.payload.quantities).every((q) => q === undefined || "constant" in q)).toBe(true);
    const { data: test, rows } = await plateData(scenario, 300, 2, "random");
    const p = model.predictMassing(test.x);
    rows.forEach((r, i) => {
      expect(p.mean[i]![floorsCol]).toBe(r.floors);
      expect(Math.abs(p.mean[i]![gfaCol]! - Number(r.gfa))).toBeLessThanOrEqual(1e-9 * Number(r.lotArea));
      expect(p.limitedBy[i]).toBe(r.limitedBy);
      expect(p.sd[i]![gfaCol]).toBe(0);
    });
  });
});

describe("plate-stack on a varied quad lot with a sky exposure plane", () => {
  const scenario = scenarioOf(
    [cont("frontage", 14, 36), cont("depth", 22, 44), cont("setbackRear", 3, 9), cont("maxHeight", 12, 30), cont("skyPlaneStart", 6, 14)],
    { setbackFront: 0, setbackSide: 0, floorHeight: 3.3, maxCoverage: 0.7, skyPlaneRatio: 1.5, minPlateWidth: 6, maxFar: 4 },
  );
  let model: PlateStackSurrogate;
  it("keeps the arithmetic inputs out of the learned models and learns one row per cut storey", async () => {
    const { data } = await plateData(scenario, 30, 5);
    model = await fitPlateStack(data, { seed: 1, draws: 32 });
    const file = model.toJSON();
    expect(file.payload.geometryInputs).toEqual(["frontage", "depth", "setbackRear"]);
    expect(file.payload.ruleValues).toMatchObject({ maxHeight: { input: "maxHeight" }, skyPlaneStart: { input: "skyPlaneStart" }, floorHeight: { value: 3.3 } });
    expect(model.inner("cutArea")!.inputs).toEqual(["frontage", "depth", "setbackRear", "skyPlaneInset"]);
    const rows = (file.training as { innerRows: Record<string, number> }).innerRows;
    expect(rows.lotArea).toBe(30);
    expect(rows.cutArea).toBeGreaterThan(30);
  }, 600_000);
  it("round-trips through the model file and the dependency-free predictor", async () => {
    const { data: test } = await plateData(scenario, 25, 9, "random");
    const a = model.predict(test.x);
    const text = JSON.stringify(model.toJSON());
    const b = loadSurrogate(text).predict(test.x);
    const c = loadPredictor(text).predict(test.x);
    expect(b.mean).toEqual(a.mean);
    expect(b.sd).toEqual(a.sd);
    for (let i = 0; i < test.x.length; i++) {
      for (let j = 0; j < a.mean[0]!.length; j++) {
        // the predictor recomputes the GP algebra in its own code: equal to round-off
        expect(Math.abs(c.mean[i]![j]! - a.mean[i]![j]!)).toBeLessThanOrEqual(1e-6 * Math.max(1, Math.abs(a.mean[i]![j]!)));
      }
    }
    expect(loadPredictor(text).modelType).toBe("plate-stack");
  }, 600_000);
  it("gives floor-count probabilities that sum to one and plug-in floors that are whole numbers", async () => {
    const { data: test, rows } = await plateData(scenario, 40, 11, "random");
    const p = model.predictMassing(test.x);
    let right = 0;
    p.floorProbabilities.forEach((f) => expect(f.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12));
    rows.forEach((r, i) => {
      const best = p.floorProbabilities[i]!.indexOf(Math.max(...p.floorProbabilities[i]!));
      if (best === r.floors) right++;
    });
    expect(right).toBeGreaterThanOrEqual(30); // most likely floor count right on at least 75% of held-out rows
    const plug = loadSurrogate({ ...model.toJSON(), checksum: undefined, payload: { ...model.toJSON().payload, pointMode: "plugin" } }) as PlateStackSurrogate;
    for (const row of plug.predictMassing(test.x).mean) expect(Number.isInteger(row[floorsCol])).toBe(true);
  }, 600_000);
});

describe("plate-stack: refusals name the problem", () => {
  const scenario = scenarioOf([cont("frontage", 14, 30), cont("depth", 20, 40)], {
    setbackFront: 3, setbackSide: 1, setbackRear: 5, floorHeight: 3, maxHeight: 15,
  });
  it("missing profile columns, a rule that does not reproduce the data, a rule value tied to no input", async () => {
    const { data } = await plateData(scenario, 8, 1);
    const { plateArea_1: _a, ...noPlates } = data.columns;
    await expect(fitPlateStack({ ...data, columns: noPlates })).rejects.toThrow(/plateArea_1 is missing/);
    const wrongGfa = { ...data.columns, gfa: data.columns.gfa!.map((v) => v + 50) };
    await expect(fitPlateStack({ ...data, columns: wrongGfa })).rejects.toThrow(/does not|the stacking rule gives gfa/);
    const varying = { ...data.columns, rule_maxHeight: data.columns.rule_maxHeight!.map((v, i) => v + i) };
    await expect(fitPlateStack({ ...data, columns: varying })).rejects.toThrow(/rule_maxHeight varies between rows but equals no input column/);
    await expect(fitPlateStack(data, { targets: ["profit"] })).rejects.toThrow(/profit is not an output/);
  });
  it("a model file naming an unknown rule is refused by both loaders", async () => {
    const { data } = await plateData(scenario, 8, 1);
    const file = (await fitPlateStack(data, { seed: 0 })).toJSON();
    const bad = { ...file, checksum: undefined, payload: { ...file.payload, rule: "someone-elses-rule" } };
    expect(() => loadSurrogate(bad)).toThrow(/payload\.rule/);
    expect(() => loadPredictor(bad)).toThrow(/payload\.rule/);
  }, 600_000);
});

describe("qmcNormalDraws", () => {
  it("are standard normal to QMC accuracy and repeat from the seed", () => {
    const d = qmcNormalDraws(256, 5, 7);
    expect(qmcNormalDraws(256, 5, 7)).toEqual(d);
    for (let j = 0; j < 5; j++) {
      const col = d.map((r) => r[j]!);
      const m = col.reduce((s, v) => s + v, 0) / col.length;
      const v = col.reduce((s, x) => s + (x - m) ** 2, 0) / col.length;
      // derived: for 256 low-discrepancy points the mean is within a few 1e-2 of 0 and the variance of 1
      expect(Math.abs(m)).toBeLessThan(0.05);
      expect(Math.abs(v - 1)).toBeLessThan(0.1);
    }
    expect(() => qmcNormalDraws(0, 5, 1)).toThrow(RangeError);
    expect(() => qmcNormalDraws(4, 11, 1)).toThrow(RangeError);
  });
});

