import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import {
  assignFolds,
  hasLeaveOneOut,
  kFoldCrossValidation,
  learningCurve,
  leaveOneOutValidation,
  powerLawFit,
  type Surrogate,
  type TrainingData,
} from "@floorcast/surrogate";
import { referenceAvailable, runReference } from "../reference/python.js";
import { olsModel, olsTrainer } from "./trust-toy-trainer.js";

const hasRef = referenceAvailable(["sklearn", "numpy"]);

function linearData(n: number, seed: string, noise = 0.3): TrainingData {
  const rng = seedrandom(seed);
  const x = Array.from({ length: n }, () => [rng() * 10, rng() * 4 - 2]);
  const y = x.map(([a, b]) => [2 + 0.5 * a! - 3 * b! + noise * (rng() - 0.5) + 0.05 * a! * a!]);
  return { inputs: ["a", "b"], targets: ["gfa"], x, y };
}

describe("assignFolds", () => {
  it("gives scikit-learn KFold's fold sizes and is reproducible from the seed", () => {
    const f = assignFolds(23, 5, 7);
    const sizes = [0, 1, 2, 3, 4].map((k) => f.filter((g) => g === k).length);
    expect(sizes).toEqual([5, 5, 5, 4, 4]); // KFold: first n mod k folds get ⌊n/k⌋ + 1 (sklearn docs)
    expect(assignFolds(23, 5, 7)).toEqual(f);
    expect(assignFolds(23, 5, 8)).not.toEqual(f);
  });
  it("rejects k outside [2, n]", () => {
    expect(() => assignFolds(5, 1, 0)).toThrow(RangeError);
    expect(() => assignFolds(5, 6, 0)).toThrow(/folds must be an integer in \[2, 5\]/);
    expect(() => assignFolds(5, 2.5, 0)).toThrow(RangeError);
  });
  it("every row gets exactly one fold (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 60 }), fc.integer({ min: 0, max: 1e6 }), (n, seed) => {
        const k = 2 + (seed % (n - 1));
        const f = assignFolds(n, k, seed);
        expect(f).toHaveLength(n);
        const sizes = Array.from({ length: k }, (_, g) => f.filter((v) => v === g).length);
        expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      }),
    );
  });
});

describe.skipIf(!hasRef)("kFoldCrossValidation against scikit-learn 1.2.1 cross_val_predict", () => {
  it("out-of-fold predictions and Q² of a least-squares trainer match LinearRegression on the same folds", async () => {
    const data = linearData(60, "cv");
    const cv = await kFoldCrossValidation(olsTrainer(), data, { folds: 5, seed: 11 });
    const ref = runReference<{ cv: { pred: number[]; q2: number } }>("metrics_sklearn.py", {
      cv: { x: data.x, y: data.y.map((r) => r[0]), fold: cv.foldOf },
    }).cv;
    // Both solve the same 3×3 least-squares problems in double precision: 1e-9 relative absorbs the
    // normal-equations conditioning (cond ≈ 1e3 here, derived) against sklearn's lstsq.
    cv.predictions.mean.forEach((r, i) => expect(Math.abs(r[0]! - ref.pred[i]!)).toBeLessThan(1e-9 * Math.max(1, Math.abs(ref.pred[i]!))));
    expect(cv.perTarget.gfa!.q2).toBeCloseTo(ref.q2, 9);
    expect(cv.method).toBe("k-fold");
    expect(cv.folds).toBe(5);
    expect(cv.predictions.sd).toBeUndefined();
  });
});

describe("kFoldCrossValidation", () => {
  it("mean predictor: each out-of-fold prediction is the mean of the other folds (derived)", async () => {
    const data: TrainingData = { inputs: ["a"], targets: ["t"], x: [[0], [1], [2], [3], [4], [5]], y: [[1], [2], [3], [4], [5], [12]] };
    const meanTrainer = async (d: TrainingData): Promise<Surrogate> => {
      const m = d.y.reduce((a, r) => a + r[0]!, 0) / d.y.length;
      return { kind: "mean", inputs: d.inputs, targets: d.targets, predict: (x) => ({ mean: x.map(() => [m]), sd: x.map(() => [1]) }), toJSON: () => ({}) };
    };
    const cv = await kFoldCrossValidation(meanTrainer, data, { folds: 3, seed: 1 });
    cv.predictions.mean.forEach((r, i) => {
      const others = data.y.filter((_, j) => cv.foldOf![j] !== cv.foldOf![i]).map((v) => v[0]!);
      expect(r[0]).toBeCloseTo(others.reduce((a, b) => a + b, 0) / others.length, 12);
      expect(others.length).toBe(4);
    });
    expect(cv.predictions.sd).toBeDefined();
    expect(cv.perTarget.t!.q2).toBeLessThan(0); // a mean model predicts worse than the global mean out of sample
  });

  it("passes distinct seeds to the folds' trainers and rejects bad arguments", async () => {
    const seeds: number[] = [];
    const data = linearData(10, "seeds");
    await kFoldCrossValidation(async (d, s) => (seeds.push(s), olsModel(d)), data, { folds: 2, seed: 100 });
    expect(seeds).toEqual([101, 102]);
    await expect(kFoldCrossValidation(olsTrainer(), data, { folds: 11, seed: 1 })).rejects.toThrow(/folds must be an integer in \[2, 10\]/);
    await expect(kFoldCrossValidation(olsTrainer(), data, { seed: 1.5 })).rejects.toThrow(TypeError);
    await expect(kFoldCrossValidation("x" as never, data, { seed: 1 })).rejects.toThrow(TypeError);
    await expect(kFoldCrossValidation(olsTrainer(), { ...data, x: [[NaN, 1], ...data.x.slice(1)] }, { seed: 1 })).rejects.toThrow(RangeError);
  });
});

describe("leave-one-out capability", () => {
  it("uses the model's leaveOneOut() and reports Q²; OLS hat-matrix LOO equals refitting without the row (derived)", () => {
    const data = linearData(15, "loo");
    // Exact LOO of OLS by refitting n times (derived from the definition), exposed as the capability.
    const loo = data.x.map((_, i) => olsModel({ ...data, x: data.x.filter((_, j) => j !== i), y: data.y.filter((_, j) => j !== i) }).predict([data.x[i]!]).mean[0]!);
    const model = Object.assign(olsModel(data), { leaveOneOut: () => ({ mean: loo }) });
    expect(hasLeaveOneOut(model)).toBe(true);
    expect(hasLeaveOneOut(olsModel(data))).toBe(false);
    const r = leaveOneOutValidation(model, data);
    expect(r.method).toBe("leave-one-out");
    expect(r.folds).toBe(15);
    const press = data.y.reduce((a, y, i) => a + (y[0]! - loo[i]![0]!) ** 2, 0);
    const mean = data.y.reduce((a, y) => a + y[0]!, 0) / 15;
    const sst = data.y.reduce((a, y) => a + (y[0]! - mean) ** 2, 0);
    expect(r.perTarget.gfa!.q2).toBeCloseTo(1 - press / sst, 12);
    expect(() => leaveOneOutValidation(model, linearData(14, "x"))).toThrow(/15 training rows but data has 14/);
    expect(() => leaveOneOutValidation(olsModel(data) as never, data)).toThrow(TypeError);
  });
});

describe("powerLawFit and learningCurve", () => {
  it("recovers the exponent of exact power-law errors to 1e-12 (derived: log-log is a straight line)", () => {
    const sizes = [50, 100, 200, 500, 1000, 2000, 5000];
    for (const b of [-0.5, -1, -0.37, 0.2]) {
      const f = powerLawFit(sizes, sizes.map((n) => 3.7 * n ** b));
      expect(Math.abs(f.slope - b)).toBeLessThan(1e-12);
      expect(f.coefficient).toBeCloseTo(3.7, 10);
      expect(f.r2LogLog).toBeCloseTo(1, 12);
    }
    expect(powerLawFit([10, 20], [2, 2]).r2LogLog).toBeNaN();
  });
  it("rejects non-positive and degenerate inputs", () => {
    expect(() => powerLawFit([10, 10], [1, 2])).toThrow(/two distinct/);
    expect(() => powerLawFit([10, 0], [1, 2])).toThrow(/sizes\[1\] must be > 0/);
    expect(() => powerLawFit([10, 20], [1, 0])).toThrow(/errors\[1\] must be > 0/);
    expect(() => powerLawFit([10, NaN], [1, 1])).toThrow(RangeError);
    expect(() => powerLawFit([], [])).toThrow(RangeError);
  });
  it("measures test error at sizes capped by the pool, with nested subsets and a fitted slope", async () => {
    const train = linearData(300, "lc-train", 2);
    const test = linearData(200, "lc-test", 2);
    const used: number[] = [];
    const lc = await learningCurve(async (d, s) => (used.push(d.x.length, s), olsModel(d)), train, test, { seed: 5, sizes: [20, 50, 100, 500] });
    expect(lc.points.map((p) => p.size)).toEqual([20, 50, 100, 300]);
    expect(used).toEqual([20, 25, 50, 55, 100, 105, 300, 305]);
    expect(lc.points.every((p) => p.rmse > 0 && p.mae <= p.rmse && p.rmse <= p.maxAbsError)).toBe(true);
    expect(lc.powerLaw).not.toBeNull();
    expect(lc.target).toBe("gfa");
    await expect(learningCurve(olsTrainer(), train, test, { seed: 1, target: "nope" })).rejects.toThrow(/target "nope"/);
    await expect(learningCurve(olsTrainer(), train, test, { seed: 1, sizes: [1] })).rejects.toThrow(/sizes\[0\]/);
  });
});

describe("cross-validation and learning-curve guards", () => {
  it("rejects a trainer whose model returns the wrong number of predictions, and mismatched test inputs", async () => {
    const data = linearData(12, "guard");
    const broken = async (d: TrainingData): Promise<Surrogate> => ({ ...olsModel(d), predict: () => ({ mean: [[0]] }) });
    await expect(kFoldCrossValidation(broken, data, { folds: 3, seed: 0 })).rejects.toThrow(/fold 0 returned 1 predictions for 4 rows/);
    await expect(learningCurve(olsTrainer(), data, { ...data, inputs: ["b", "a"] }, { seed: 0 })).rejects.toThrow(/test.inputs must equal train.inputs/);
  });
});
