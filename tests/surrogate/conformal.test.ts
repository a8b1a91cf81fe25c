import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { calibrateConformal, conformalQuantile, fitConformal, fitGaussianProcess, loadSurrogate, minCalibrationRows } from "@floorcast/surrogate";
import { mlpTrainer } from "@floorcast/surrogate/nn";
import { loadPredictor } from "@floorcast/surrogate/predict";

const SIGMA = 0.2;

/** Synthetic map with known Gaussian noise (derived): y = sin(2π x1) + x2² + N(0, 0.2²), x ∈ [0, 1]². */
function noisy(n: number, seed: string) {
  const rng = seedrandom(seed);
  const x: number[][] = [];
  const y: number[][] = [];
  for (let i = 0; i < n; i++) {
    const a = rng();
    const b = rng();
    // Box–Muller (Box & Muller 1958).
    const z = Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
    x.push([a, b]);
    y.push([Math.sin(2 * Math.PI * a) + b * b + SIGMA * z]);
  }
  return { inputs: ["x1", "x2"], targets: ["y"], x, y };
}

function coverage(p: { interval?: { lower: number[][]; upper: number[][] } }, y: number[][]): number {
  let inside = 0;
  y.forEach((r, i) => {
    if (r[0]! >= p.interval!.lower[i]![0]! && r[0]! <= p.interval!.upper[i]![0]!) inside++;
  });
  return inside / y.length;
}

describe("conformalQuantile (Lei et al. 2018, §2.2: the ⌈(n+1)(1−α)⌉-th smallest score)", () => {
  it("point values", () => {
    // n = 9, 1 − α = 0.8: k = ⌈10 · 0.8⌉ = 8 → the 8th smallest of 1..9 is 8 (derived).
    expect(conformalQuantile([9, 1, 8, 2, 7, 3, 6, 4, 5], 0.8)).toBe(8);
    // n = 999, 1 − α = 0.9: k = 900 exactly (1000 · 0.9 must not round up to 901; derived).
    expect(conformalQuantile(Array.from({ length: 999 }, (_, i) => i + 1), 0.9)).toBe(900);
    // n = 9, 1 − α = 0.95: k = ⌈9.5⌉ = 10 > n → unbounded (null).
    expect(conformalQuantile([1, 2, 3, 4, 5, 6, 7, 8, 9], 0.95)).toBeNull();
    expect(conformalQuantile([3], 0.4)).toBe(3);
  });
  it("minCalibrationRows is the least n for which the quantile exists (c / (1 − c), derived): 9 at 0.9, 19 at 0.95, 99 at 0.99", () => {
    expect([0.9, 0.95, 0.99, 0.5, 0.8].map(minCalibrationRows)).toEqual([9, 19, 99, 1, 4]);
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.995, noNaN: true }), (c) => {
        const n = minCalibrationRows(c);
        const ones = (m: number) => Array.from({ length: m }, () => 1);
        return conformalQuantile(ones(n), c) !== null && (n === 1 || conformalQuantile(ones(n - 1), c) === null);
      }),
    );
  });
  it("property: at least ⌈(n+1)(1−α)⌉ scores are ≤ q, and fewer are < q", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 100, noNaN: true }), { minLength: 1, maxLength: 200 }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), (s, c) => {
        const q = conformalQuantile(s, c);
        const k = Math.ceil((s.length + 1) * c - 1e-9);
        if (k > s.length) return q === null;
        return s.filter((v) => v <= q!).length >= k && s.filter((v) => v < q!).length < k;
      }),
    );
  });
});

describe("split-conformal coverage on 1,000 held-out points (nominal 90% → 87%..93%)", () => {
  // Why 87 %..93 %: given the calibration set, split-conformal coverage is Beta(k, n + 1 − k) with
  // k = ⌈(n + 1)(1 − α)⌉ (Vovk 2012, "Conditional validity of inductive conformal predictors", ACML; Lei et al.
  // 2018, JASA, Thm 2.2): sd ≈ √(0.9·0.1/n) = 0.011 for n = 700 and 800; the 1,000 test points add a binomial
  // sd of √(0.9·0.1/1000) = 0.0095, so about 0.015 in all (derived). ±0.03 is ±2 sd: the seeds are fixed, so the
  // test is deterministic, and it catches a miscalibrated interval (coverage 0.80 or 0.99 fails).
  const test = noisy(1000, "conformal-test");

  it("around an MLP (absolute scores): fitConformal splits, trains, calibrates", async () => {
    const data = noisy(1400, "conformal-mlp");
    const c = await fitConformal(mlpTrainer({ layers: [16], epochs: 30, backend: "wasm" }), data, { coverage: 0.9, calibrationFraction: 0.5, seed: 5 });
    expect(c.calibration.score).toBe("absolute");
    expect(c.calibration.calibrationSize).toBe(700);
    const p = c.predict(test.x);
    const cov = coverage(p, test.y);
    console.info(`conformal MLP: nominal 0.90, held-out coverage ${cov.toFixed(3)}, half-width ${c.calibration.quantiles[0]!.toFixed(3)} (noise sd ${SIGMA})`);
    expect(cov).toBeGreaterThanOrEqual(0.87);
    expect(cov).toBeLessThanOrEqual(0.93);
    // Half-width cannot beat the noise: the 90% half-width of N(0, 0.2²) is 1.645 · 0.2 = 0.329 (normal table).
    expect(c.calibration.quantiles[0]!).toBeGreaterThan(0.3);
    // The file round-trips through loadSurrogate (main entry, plain arithmetic) and loadPredictor.
    const json = JSON.parse(JSON.stringify(c.toJSON()));
    const viaFile = loadSurrogate(json).predict(test.x.slice(0, 20));
    const viaPredictor = loadPredictor(json).predict(test.x.slice(0, 20));
    viaFile.interval!.upper.forEach((r, i) => {
      expect(Math.abs(r[0]! - p.interval!.upper[i]![0]!)).toBeLessThan(1e-5);
      expect(viaPredictor.interval!.upper[i]![0]).toBeCloseTo(r[0]!, 12);
    });
    expect(viaPredictor.interval!.coverage).toBe(0.9);
  });

  it("around a GP (normalised scores |y − μ|/σ)", async () => {
    const train = noisy(150, "conformal-gp-train");
    const cal = noisy(800, "conformal-gp-cal");
    const gp = fitGaussianProcess(train, { seed: 1, restarts: 1 });
    const c = calibrateConformal(gp, cal, { coverage: 0.9 });
    expect(c.calibration.score).toBe("normalised");
    const p = c.predict(test.x);
    expect(p.sd).toBeDefined();
    const cov = coverage(p, test.y);
    console.info(`conformal GP (normalised): nominal 0.90, held-out coverage ${cov.toFixed(3)}`);
    expect(cov).toBeGreaterThanOrEqual(0.87);
    expect(cov).toBeLessThanOrEqual(0.93);
    const viaPredictor = loadPredictor(c.toJSON()).predict(test.x.slice(0, 10));
    viaPredictor.interval!.lower.forEach((r, i) => expect(Math.abs(r[0]! - p.interval!.lower[i]![0]!)).toBeLessThan(1e-9 * (1 + Math.abs(r[0]!))));
  });

  it("edge cases: bad coverage, NaN calibration rows, too few calibration points, normalised without sd", async () => {
    const data = noisy(30, "conformal-edge");
    const base = await mlpTrainer({ layers: [4], epochs: 2 })(data, 0);
    expect(() => calibrateConformal(base, data, { coverage: 1 })).toThrow(/options\.coverage must be in \(0, 1\)/);
    expect(() => calibrateConformal(base, data, { coverage: Number.NaN })).toThrow(RangeError);
    const nan = { x: data.x.map((r, i) => (i === 2 ? [r[0]!, Number.NaN] : r)), y: data.y };
    expect(() => calibrateConformal(base, nan)).toThrow(/calibration\.x\[2\]\[1\]/);
    expect(() => calibrateConformal(base, { x: [], y: [] })).toThrow(/at least one row/);
    expect(() => calibrateConformal(base, data, { score: "normalised" })).toThrow(/needs a base that gives sd/);
    // 5 rows at coverage 0.9: k = ⌈6 × 0.9⌉ = 6 > 5, no bounded interval (Lei et al. 2018, §2.2): refused, not unbounded.
    expect(() => calibrateConformal(base, { x: data.x.slice(0, 5), y: data.y.slice(0, 5) }, { coverage: 0.9 })).toThrow(
      /calibrateConformal: calibration\.x has 5 rows; coverage 0\.9 needs at least 9/,
    );
    expect(calibrateConformal(base, { x: data.x.slice(0, 9), y: data.y.slice(0, 9) }, { coverage: 0.9 }).calibration.quantiles[0]).not.toBeNull();
    // fitConformal refuses before it trains anything: 30 × 0.25 → 8 calibration rows < 9.
    let trained = 0;
    const counting = async () => (trained++, base);
    await expect(fitConformal(counting, data, { coverage: 0.9 })).rejects.toThrow(/fitConformal: 8 calibration rows .* needs at least 9/);
    expect(trained).toBe(0);
    await expect(fitConformal(mlpTrainer(), { ...data, x: [data.x[0]!], y: [data.y[0]!] })).rejects.toThrow(/both training and calibration/);
    await expect(fitConformal(mlpTrainer(), data, { calibrationFraction: 1 })).rejects.toThrow(/calibrationFraction/);
  });
});
