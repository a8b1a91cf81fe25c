import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { metricsByRegime, percentile, regressionMetrics, type RegressionMetrics } from "@floorcast/surrogate";
import { referenceAvailable, runReference } from "../reference/python.js";

const hasRef = referenceAvailable(["sklearn", "numpy"]);

interface SkMetrics {
  mse: number;
  rmse: number;
  mae: number;
  max_error: number;
  r2: number | null;
  r2_forced: number | null;
  bias: number;
  median_rel: number | null;
  p95_rel: number | null;
}

/** Seeded test vectors: GFA-like magnitudes, negatives, zeros in y, a single row, a perfect fit. */
function cases(): { y: number[]; p: number[] }[] {
  const rng = seedrandom("trust-metrics");
  const gauss = () => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng());
  const out: { y: number[]; p: number[] }[] = [];
  for (const [n, scale] of [[200, 1], [1000, 5000], [37, 1e-3], [3, 10]] as const) {
    const y = Array.from({ length: n }, () => scale * (1 + gauss()));
    out.push({ y, p: y.map((v) => v + 0.1 * scale * gauss()) });
  }
  const withZeros = Array.from({ length: 50 }, (_, i) => (i % 5 === 0 ? 0 : i - 20));
  out.push({ y: withZeros, p: withZeros.map((v, i) => v + Math.sin(i)) });
  out.push({ y: [4.5], p: [3] });
  out.push({ y: [1, 2, 3, 4], p: [1, 2, 3, 4] });
  return out;
}

const close = (a: number, b: number | null) => {
  if (b === null) return expect(a).toBeNaN();
  // 1e-12 relative (absolute for values near 0): both sides sum the same terms in double precision, so they differ
  // by a few ulps per term at most (derived; 1e-12 leaves room for sums of up to ~10^3 terms).
  expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(Math.abs(b), 1e-300));
};

describe.skipIf(!hasRef)("regressionMetrics against scikit-learn 1.2.1 / numpy 1.24.2", () => {
  const cs = cases();
  const ref = hasRef ? runReference<{ cases: SkMetrics[] }>("metrics_sklearn.py", { cases: cs }).cases : [];
  it.each(cs.map((c, i) => [i, c] as const))("case %i", (i, c) => {
    const m = regressionMetrics(c.y, c.p);
    const r = ref[i]!;
    expect(m.n).toBe(c.y.length);
    close(m.rmse, r.rmse); // sklearn mean_squared_error(squared=False)
    close(m.rmse ** 2, r.mse); // mean_squared_error
    close(m.mae, r.mae); // mean_absolute_error
    close(m.maxAbsError, r.max_error); // max_error
    if (c.y.length > 1) close(m.r2, r.r2); // r2_score(force_finite=False); sklearn needs ≥ 2 rows
    else expect(m.r2).toBeNaN(); // one row: the target is constant, R² undefined
    close(m.bias, r.bias); // numpy mean(p − y)
    close(m.medianRelError, r.median_rel); // numpy median of |y − p|/|y|, y ≠ 0
    close(m.p95RelError, r.p95_rel); // numpy percentile(…, 95), linear
  });

  it("percentile matches numpy.percentile (linear) on random samples", () => {
    const rng = seedrandom("pct");
    const req = Array.from({ length: 30 }, (_, i) => [Array.from({ length: 1 + i * 3 }, () => rng() * 100 - 50), rng()] as [number[], number]);
    req.push([[1, 2, 3, 4], 0], [[1, 2, 3, 4], 1], [[5], 0.3]);
    const ref = runReference<{ percentiles: number[] }>("metrics_sklearn.py", { percentiles: req }).percentiles;
    req.forEach(([v, q], i) => close(percentile(v, q), ref[i]!));
  });
});

describe("regressionMetrics edge cases and documented conventions", () => {
  it("targets near 1e308, whose squares overflow, still give the finite metrics (derived by hand)", () => {
    // y = (1, 1.1, 1.2)·1e308, errors (1, −1, 2)·1e306: RMSE = √(6/3)·1e306, MAE = (4/3)·1e306, max 2e306,
    // bias (2/3)·1e306; SSE = 6e612, SST = (1e307)² + 0 + (1e307)² = 2e614, R² = 1 − 0.03 = 0.97 (derived).
    const y = [1e308, 1.1e308, 1.2e308];
    const m = regressionMetrics(y, [1.01e308, 1.09e308, 1.22e308]);
    const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
    expect(rel(m.rmse, Math.SQRT2 * 1e306)).toBeLessThan(1e-12);
    expect(rel(m.mae, (4 / 3) * 1e306)).toBeLessThan(1e-12);
    expect(rel(m.maxAbsError, 2e306)).toBeLessThan(1e-12);
    expect(rel(m.bias, (2 / 3) * 1e306)).toBeLessThan(1e-12);
    expect(rel(m.r2, 0.97)).toBeLessThan(1e-12);
    expect(rel(m.medianRelError, 0.01)).toBeLessThan(1e-12); // relative errors 0.01, 0.0091, 0.0167
    // and the scaling is by a power of two, so ordinary values give bit-for-bit the unscaled sums
    const plain = regressionMetrics([1, 2, 4], [1.5, 2, 3]);
    expect(plain.rmse).toBe(Math.sqrt((0.25 + 0 + 1) / 3));
    expect(plain.mae).toBe(1.5 / 3);
  });
  it("constant target: R² is NaN (undefined), not sklearn's forced 1.0/0.0; the rest are defined", () => {
    // scikit-learn 1.2 r2_score(force_finite=True) returns 1.0 for a perfect fit and 0.0 otherwise on a
    // constant y; we report NaN (JSON null) because the ratio 0/0 or x/0 has no meaning (documented).
    const m = regressionMetrics([2, 2, 2], [1, 2, 3]);
    expect(m.r2).toBeNaN();
    expect(m.rmse).toBeCloseTo(Math.sqrt(2 / 3), 15);
    expect(m.bias).toBe(0);
    expect(regressionMetrics([0.1, 0.1, 0.1], [0.1, 0.1, 0.1]).r2).toBeNaN();
  });

  it("all-zero target: relative errors NaN with nRelative 0", () => {
    const m = regressionMetrics([0, 0], [1, -1]);
    expect(m.nRelative).toBe(0);
    expect(m.medianRelError).toBeNaN();
    expect(m.p95RelError).toBeNaN();
  });

  it("rejects empty, NaN, ±Infinity, mismatched lengths and wrong types", () => {
    expect(() => regressionMetrics([], [])).toThrow(/regressionMetrics: yTrue must not be empty/);
    expect(() => regressionMetrics([1, NaN], [1, 2])).toThrow(/yTrue\[1\] must be finite, got NaN/);
    expect(() => regressionMetrics([1, 2], [1, Infinity])).toThrow(RangeError);
    expect(() => regressionMetrics([1, 2], [1, -Infinity])).toThrow(/yPred\[1\]/);
    expect(() => regressionMetrics([1, 2], [1])).toThrow(/yPred must have length 2, got 1/);
    expect(() => regressionMetrics("12" as unknown as number[], [1])).toThrow(TypeError);
    expect(() => regressionMetrics([1, "2"] as unknown as number[], [1, 2])).toThrow(TypeError);
    expect(() => percentile([], 0.5)).toThrow(RangeError);
    expect(() => percentile([1], 1.5)).toThrow(/q must be in \[0, 1\]/);
    expect(() => percentile([1, NaN], 0.5)).toThrow(/NaN/);
  });

  it("properties: perfect predictions give zero error and R² = 1; shifting predictions by c gives bias c (derived)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }).filter((v) => v === 0 || Math.abs(v) > 1e-100), { minLength: 2, maxLength: 40 }),
        // No subnormal shifts: their squares underflow to 0, which is IEEE arithmetic, not a metric property.
        fc.double({ min: -100, max: 100, noNaN: true }).filter((c) => c === 0 || Math.abs(c) > 1e-100),
        (y, c) => {
          const m = regressionMetrics(y, y);
          expect(m.rmse).toBe(0);
          expect(m.maxAbsError).toBe(0);
          if (!y.every((v) => v === y[0])) expect(m.r2).toBe(1);
          const s = regressionMetrics(y, y.map((v) => v + c));
          expect(s.bias).toBeCloseTo(c, 4);
          expect(s.mae).toBeLessThanOrEqual(s.rmse * (1 + 1e-12));
          expect(s.rmse).toBeLessThanOrEqual(s.maxAbsError * (1 + 1e-12) + 1e-9);
        },
      ),
    );
  });
});

describe("metricsByRegime", () => {
  it("groups rows by value and matches regressionMetrics on each group", () => {
    const y = [1, 2, 3, 4, 5, 6];
    const p = [1.5, 2, 2, 4, 7, 6];
    const g = ["height", "far", "height", "far", "plate", "height"];
    const by = metricsByRegime(y, p, g);
    expect(Object.keys(by)).toEqual(["height", "far", "plate"]);
    const h: RegressionMetrics = regressionMetrics([1, 3, 6], [1.5, 2, 6]);
    expect(by.height).toEqual(h);
    expect(by.far!.n).toBe(2);
    expect(by.plate!.maxAbsError).toBe(2);
    expect(Object.keys(metricsByRegime([1, 2], [1, 2], [1, 1]))).toEqual(["1"]);
  });

  it("rejects mismatched groups and bad group values", () => {
    expect(() => metricsByRegime([1, 2], [1, 2], ["a"])).toThrow(/groups must have length 2, got 1/);
    expect(() => metricsByRegime([1], [1], [null as unknown as string])).toThrow(TypeError);
    expect(metricsByRegime([], [], [])).toEqual({});
  });
});
