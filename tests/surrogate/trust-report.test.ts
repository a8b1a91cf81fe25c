import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import {
  buildTrustReport,
  buildValidityDomain,
  intervalCoverage,
  kFoldCrossValidation,
  regressionMetrics,
  TRUST_REPORT_DEFAULT_CAUTION,
  type TrainingData,
} from "@floorcast/surrogate";
import { olsModel, olsTrainer } from "./trust-toy-trainer.js";

function data(n: number, seed: string): TrainingData {
  const rng = seedrandom(seed);
  const x = Array.from({ length: n }, () => [rng() * 10, rng() * 5]);
  return { inputs: ["frontage", "depth"], targets: ["gfa", "floors"], x, y: x.map(([a, b]) => [3 * a! + b! + (rng() - 0.5), Math.floor(a! / 2)]) };
}

describe("buildTrustReport", () => {
  const train = data(80, "train");
  const test = data(40, "test");
  const model = olsModel(train, 0.3);
  const y = test.y.map((r) => r[0]!);

  it("assembles metrics, by-regime, calibration, CV, domain and diagnostics into a versioned JSON", async () => {
    const cv = await kFoldCrossValidation(olsTrainer(0.3), train, { folds: 4, seed: 3 });
    const groups = test.x.map((r) => (r[0]! > 5 ? "far" : "height"));
    const { report, figures } = buildTrustReport({
      model,
      target: "gfa",
      x: test.x,
      y,
      groups,
      groupColumn: "limitedBy",
      crossValidation: cv,
      domain: buildValidityDomain(train.inputs, train.x),
      design: { minDistance: 0.02, centredDiscrepancy: 0.001 },
      sources: { model: "m.json", data: "t.csv" },
    });
    expect(report.kind).toBe("floorcast.trust-report");
    expect(report.formatVersion).toBe(1);
    // without a caution from the caller, the documented default (pinned equal to FLOORCAST_CAUTION in
    // tests/bench/caution-single-source.test.ts); the surrogate's own remark is the last note
    expect(report.caution).toBe(TRUST_REPORT_DEFAULT_CAUTION);
    expect(report.notes.at(-1)).toMatch(/^A surrogate approximates the exact floor-area rule; re-check any design/);
    const pred = model.predict(test.x).mean.map((r) => r[0]!);
    expect(report.metrics).toEqual(regressionMetrics(y, pred));
    expect(Object.keys(report.byRegime!).sort()).toEqual(["far", "height"]);
    expect(report.byRegime!.far!.n + report.byRegime!.height!.n).toBe(40);
    expect(report.byRegimeColumn).toBe("limitedBy");
    expect(report.crossValidation!.method).toBe("k-fold");
    expect(report.crossValidation!.metrics.q2).toBe(cv.perTarget.gfa!.q2);
    expect(report.calibration!.coverage).toHaveLength(3);
    expect(report.domain!.nOutside).toBeGreaterThanOrEqual(0);
    expect(report.diagnostics.design).toEqual({ minDistance: 0.02, centredDiscrepancy: 0.001 });
    expect(report.learningCurve).toBeNull();
    expect(figures.mean).toEqual(pred);
    expect(figures.sd).toHaveLength(40);
    const round = JSON.parse(JSON.stringify(report));
    expect(round.metrics.rmse).toBe(report.metrics.rmse);
    expect(round.model).toEqual({ kind: "ols-toy", inputs: ["frontage", "depth"], targets: ["gfa", "floors"], source: "m.json" });
  });

  it("constant target: R² is null in JSON and a note says why; no sd: calibration null with a note", () => {
    const plain = olsModel(train);
    const { report } = buildTrustReport({ model: plain, target: "gfa", x: test.x.slice(0, 3), y: [5, 5, 5] });
    expect(JSON.parse(JSON.stringify(report)).metrics.r2).toBeNull();
    expect(report.notes.join(" ")).toMatch(/R² is undefined/);
    expect(report.calibration).toBeNull();
    expect(report.notes.join(" ")).toMatch(/no predictive uncertainty/);
    expect(report.domain).toBeNull();
    expect(report.byRegime).toBeNull();
  });

  it("flags test rows outside the domain and splits the metrics inside/outside", () => {
    const far = [...test.x.slice(0, 10), [50, 2], [5, 40]];
    const { report } = buildTrustReport({ model, target: "gfa", x: far, y: far.map(([a, b]) => 3 * a! + b!), domain: buildValidityDomain(train.inputs, train.x) });
    expect(report.domain!.outsideRows).toEqual(expect.arrayContaining([10, 11]));
    expect(report.domain!.metricsOutside!.n).toBe(report.domain!.nOutside);
    expect(report.domain!.metricsInside!.n + report.domain!.nOutside).toBe(12);
  });

  it("carries the caller's caution word for word, and rejects one that is not a non-empty string", () => {
    const caution = "Caller's caution text.";
    expect(buildTrustReport({ model, target: "gfa", x: test.x, y, caution }).report.caution).toBe(caution);
    expect(() => buildTrustReport({ model, target: "gfa", x: test.x, y, caution: 3 as never })).toThrow(new TypeError("buildTrustReport: caution must be a string"));
    expect(() => buildTrustReport({ model, target: "gfa", x: test.x, y, caution: " " })).toThrow(new RangeError("buildTrustReport: caution must not be empty"));
  });

  it("rejects a bad target, ragged or non-finite inputs, empty sets and a non-model; skips calibration for sd ≤ 0", () => {
    expect(() => buildTrustReport({ model, target: "nope", x: test.x, y })).toThrow(/target "nope" is not a target/);
    expect(() => buildTrustReport({ model, target: "gfa", x: [[1]], y: [1] })).toThrow(/x\[0\] must have 2 values/);
    expect(() => buildTrustReport({ model, target: "gfa", x: [[1, NaN]], y: [1] })).toThrow(RangeError);
    expect(() => buildTrustReport({ model, target: "gfa", x: [[1, 2]], y: [Infinity] })).toThrow(/y\[0\] must be finite/);
    expect(() => buildTrustReport({ model, target: "gfa", x: [], y: [] })).toThrow(/at least one row/);
    expect(() => buildTrustReport({ model: {} as never, target: "gfa", x: [], y: [] })).toThrow(TypeError);
    const zeroSd = olsModel(train, 0);
    const { report } = buildTrustReport({ model: zeroSd, target: "gfa", x: test.x, y });
    expect(report.calibration).toBeNull();
    expect(report.notes.join(" ")).toMatch(/predicted sd is 0/);
    const nanModel = { ...model, predict: (x: readonly (readonly number[])[]) => ({ mean: x.map(() => [NaN, 0]) }) };
    expect(() => buildTrustReport({ model: nanModel, target: "gfa", x: test.x, y })).toThrow(/predicted NaN for test row 0/);
  });
});

describe("intervalCoverage and conformal-style intervals in the report", () => {
  it("counts rows inside [lower, upper] (bounds inclusive) and the mean width", () => {
    const c = intervalCoverage([1, 2, 3, 4], [0, 2, 3.5, 3], [2, 2, 4, 5], 0.9);
    expect(c).toEqual({ n: 4, nominal: 0.9, empirical: 0.75, meanWidth: (2 + 0 + 0.5 + 2) / 4 });
    expect(intervalCoverage([0], [-Infinity], [Infinity], 0.5).empirical).toBe(1);
    expect(() => intervalCoverage([1], [2], [1], 0.9)).toThrow(/lower ≤ upper/);
    expect(() => intervalCoverage([1], [NaN], [1], 0.9)).toThrow(RangeError);
    expect(() => intervalCoverage([], [], [], 0.9)).toThrow(/must not be empty/);
    expect(() => intervalCoverage([1], [0], [2], 1)).toThrow(/nominal must be in \(0, 1\)/);
  });
  it("buildTrustReport reports the coverage of a model's own intervals", () => {
    const train = data(30, "iv");
    const base = olsModel(train);
    const model = {
      ...base,
      predict: (x: readonly (readonly number[])[]) => {
        const p = base.predict(x);
        return { ...p, interval: { lower: p.mean.map((r) => r.map((v) => v - 1)), upper: p.mean.map((r) => r.map((v) => v + 1)), coverage: 0.9 } };
      },
    };
    const test = data(50, "iv-test");
    const y = test.y.map((r) => r[0]!);
    const { report } = buildTrustReport({ model, target: "gfa", x: test.x, y });
    const pred = base.predict(test.x).mean.map((r) => r[0]!);
    expect(report.intervalCoverage).toEqual({ n: 50, nominal: 0.9, empirical: y.filter((v, i) => Math.abs(v - pred[i]!) <= 1).length / 50, meanWidth: 2 });
    expect(buildTrustReport({ model: base, target: "gfa", x: test.x, y }).report.intervalCoverage).toBeNull();
  });
});
