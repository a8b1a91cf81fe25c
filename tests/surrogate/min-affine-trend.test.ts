import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { fitMinAffineTrend, loadSurrogate, minAffineAt } from "@floorcast/surrogate";
import { loadPredictor } from "@floorcast/surrogate/predict";
import { fitPlateStack, type PlateStackSurrogate } from "@floorcast/surrogate";
import { plateData, scenarioOf } from "./plate-stack-data.js";

const uniformRows = (n: number, lo: readonly number[], hi: readonly number[], seed: string): number[][] => {
  const rng = seedrandom(seed);
  return Array.from({ length: n }, () => lo.map((l, j) => l + (hi[j]! - l) * rng()));
};

describe("fitMinAffineTrend", () => {
  it("recovers the least width of a rectangular plate inside its yards, min(W − 2s, D − f − r), exactly", () => {
    // Derived: the least width of a W × D rectangle inset by a front yard f, side yards s and a rear yard r is its
    // shorter side, min(W − 2s, D − f − r): a min of two affine functions, which the least-squares partition can
    // fit with zero error.
    const x = uniformRows(200, [12, 20, 0, 0, 3], [40, 50, 8, 6, 12], "rect-train");
    const w = (r: readonly number[]): number => Math.min(r[0]! - 2 * r[3]!, r[1]! - r[2]! - r[4]!);
    const trend = fitMinAffineTrend(x, x.map(w), { seed: 1 });
    for (const r of uniformRows(300, [12, 20, 0, 0, 3], [40, 50, 8, 6, 12], "rect-test")) {
      // 1e-6 m: the normal equations solved in double precision on inputs of tens of metres (derived)
      expect(Math.abs(minAffineAt(trend, r) - w(r))).toBeLessThan(1e-6);
    }
    expect(trend.pieces.length).toBeGreaterThanOrEqual(2);
    expect(trend.pieces.every((p) => p.length === 6)).toBe(true);
  });

  it("is exact on affine data (property) and repeats from its seed", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: 3, maxLength: 3 }),
        fc.integer({ min: 0, max: 1000 }),
        (coef, seed) => {
          const x = uniformRows(40, [0, -1], [10, 1], `aff-${seed}`);
          const f = (r: readonly number[]): number => coef[0]! + coef[1]! * r[0]! + coef[2]! * r[1]!;
          const trend = fitMinAffineTrend(x, x.map(f), { seed, starts: 2 });
          // derived: an affine target is one piece with zero residual; 1e-7 absolute for round-off on values ≤ 60
          for (const r of x) expect(Math.abs(minAffineAt(trend, r) - f(r))).toBeLessThan(1e-7);
          expect(fitMinAffineTrend(x, x.map(f), { seed, starts: 2 })).toEqual(trend);
        },
      ),
      { numRuns: 20, seed: 5 },
    );
  });

  it("handles a constant input column and refuses bad data and options, naming the field", () => {
    const x = uniformRows(30, [0, 3], [1, 3], "const-col");
    const trend = fitMinAffineTrend(x, x.map((r) => 2 * r[0]!), { seed: 0 });
    for (const r of x) expect(minAffineAt(trend, r)).toBeCloseTo(2 * r[0]!, 8);
    expect(() => fitMinAffineTrend([[1]], [1])).toThrow(/fitMinAffineTrend: x and y/);
    expect(() => fitMinAffineTrend("rows" as unknown as number[][], [1, 2])).toThrow(TypeError);
    expect(() => fitMinAffineTrend([[1], [2]], [1, 2], null as unknown as object)).toThrow(/fitMinAffineTrend: options/);
    expect(() => fitMinAffineTrend([[1], [2]], [1])).toThrow(RangeError);
    expect(() => fitMinAffineTrend([[1], [Number.NaN]], [1, 2])).toThrow(/fitMinAffineTrend: x must be rows/);
    expect(() => fitMinAffineTrend([[1], [2]], [1, Infinity])).toThrow(RangeError);
    expect(() => fitMinAffineTrend([[1], [2]], [1, 2], { maxPieces: 0 })).toThrow(/options.maxPieces/);
    expect(() => fitMinAffineTrend([[1], [2]], [1, 2], { starts: 1.5 })).toThrow(/options.starts/);
  });

  it("minAffineAt: the least piece; empty pieces give +Infinity", () => {
    // derived by hand: pieces 1 + x and 3 − x cross at x = 1
    const t = { pieces: [[1, 1], [3, -1]] };
    expect(minAffineAt(t, [0])).toBe(1);
    expect(minAffineAt(t, [1])).toBe(2);
    expect(minAffineAt(t, [2])).toBe(1);
    expect(minAffineAt({ pieces: [] }, [2])).toBe(Infinity);
  });
});

describe("plate-stack widths with a min-of-affine trend", () => {
  const cont = (name: string, min: number, max: number) => ({ kind: "continuous", name, min, max, unit: "m", description: name });
  const scenario = scenarioOf(
    [cont("frontage", 14, 30), cont("depth", 20, 40), cont("setbackSide", 0, 5), cont("setbackRear", 3, 10)],
    { setbackFront: 3, floorHeight: 3.2, maxHeight: 16, maxCoverage: 0.8, minPlateWidth: 8 },
  );
  let model: PlateStackSurrogate;
  it("stores the trend in the model file; both loaders add it back", async () => {
    const { data } = await plateData(scenario, 40, 3);
    model = await fitPlateStack(data, { seed: 2, draws: 16, targets: ["gfa", "floors"] });
    const file = model.toJSON();
    const base = file.payload.quantities.baseWidth as { trend?: { pieces: number[][] } };
    expect(base.trend?.pieces.every((p) => p.length === 5)).toBe(true);
    const { data: test } = await plateData(scenario, 20, 4, "random");
    const text = JSON.stringify(file);
    expect(loadSurrogate(text).predict(test.x)).toEqual(model.predict(test.x));
    const c = loadPredictor(text).predict(test.x);
    const a = model.predict(test.x);
    // the predictor recomputes the GP algebra in its own code: equal to round-off (as in plate-stack.test.ts)
    a.mean.forEach((r, i) => r.forEach((v, j) => expect(Math.abs(c.mean[i]![j]! - v)).toBeLessThanOrEqual(1e-6 * Math.max(1, Math.abs(v)))));
    const none = await fitPlateStack(data, { seed: 2, draws: 16, targets: ["gfa"], widthTrend: "none" });
    expect("trend" in (none.toJSON().payload.quantities.baseWidth as object)).toBe(false);
    await expect(fitPlateStack(data, { widthTrend: "spline" as "none" })).rejects.toThrow(/options.widthTrend/);
  }, 600_000);
  it("refuses a trend whose pieces do not match the inner model's inputs", () => {
    const file = model.toJSON();
    const q = file.payload.quantities.baseWidth as { model: unknown; trend: { pieces: number[][] } };
    const bad = {
      ...file,
      checksum: undefined,
      payload: { ...file.payload, quantities: { ...file.payload.quantities, baseWidth: { ...q, trend: { pieces: [[1, 2]] } } } },
    };
    expect(() => loadSurrogate(bad)).toThrow(/trend/);
    expect(() => loadPredictor(bad)).toThrow(/payload\.quantities\.baseWidth\.trend\.pieces/);
  });
});
