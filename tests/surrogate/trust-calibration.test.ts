import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { gaussianCalibration, gaussianCrps, standardNormal } from "@floorcast/surrogate";

/** Box–Muller normal draws from a seeded stream. */
function normals(n: number, seed: string): number[] {
  const rng = seedrandom(seed);
  return Array.from({ length: n }, () => Math.sqrt(-2 * Math.log(1 - rng())) * Math.cos(2 * Math.PI * rng()));
}

describe("gaussianCalibration on synthetic data with known Gaussian noise", () => {
  const n = 20_000;
  const e = normals(n, "calibration");
  const mean = Array.from({ length: n }, (_, i) => 1000 + 10 * Math.sin(i));
  const sd = Array.from({ length: n }, (_, i) => 5 + (i % 7)); // heteroscedastic, known
  const y = mean.map((m, i) => m + sd[i]! * e[i]!);

  it("a model whose sd equals the true noise covers 50/90/95% within a 4σ binomial tolerance", () => {
    const c = gaussianCalibration(y, mean, sd);
    // Under a calibrated model the count inside a p-interval is Binomial(n, p), so the empirical coverage has
    // sd √(p(1−p)/n) (derived); 4 of those (≈ 0.0085 at p = 0.9, n = 20,000) fails a correct model with
    // probability ≈ 6e-5 (normal approximation), while a model whose sd is 10% too small shifts 90%
    // coverage to ≈ 0.87 (derived: 2Φ(1.645/1.1) − 1), well outside it (checked below).
    for (const entry of c.coverage) {
      const tol = 4 * Math.sqrt((entry.nominal * (1 - entry.nominal)) / n);
      expect(Math.abs(entry.empirical - entry.nominal)).toBeLessThan(tol);
    }
    expect(c.coverage.map((x) => x.nominal)).toEqual([0.5, 0.9, 0.95]);
    for (const entry of c.curve) {
      expect(Math.abs(entry.empirical - entry.nominal)).toBeLessThan(4 * Math.sqrt((entry.nominal * (1 - entry.nominal)) / n));
    }
    const z = c.standardisedResiduals;
    expect(Math.abs(z.mean)).toBeLessThan(4 / Math.sqrt(n)); // sd of the mean of n N(0,1) is 1/√n
    expect(Math.abs(z.sd - 1)).toBeLessThan(4 / Math.sqrt(2 * n)); // sd of the sample sd ≈ 1/√(2n) (derived)
    expect(z.histogram.counts.reduce((a, b) => a + b, 0) + z.histogram.below + z.histogram.above).toBe(n);
    // NLPD of a calibrated Gaussian: E[½log(2πσ²) + z²/2] = mean(½log(2πσ²)) + ½ (derived), ± 4 sd of z²/2 /√n.
    const expected = sd.reduce((a, s) => a + 0.5 * Math.log(2 * Math.PI * s * s), 0) / n + 0.5;
    expect(Math.abs(c.nlpd - expected)).toBeLessThan(4 * Math.sqrt(0.5 / n));
    // Mean CRPS equals the direct average of the closed form (same function), and for a calibrated forecast
    // E[CRPS] = E|X − Y| − ½E|X − X′| = 2σ/√π − σ/√π = σ/√π (Gneiting & Raftery 2007 eq. 20, derived): check within 2%.
    expect(c.crps).toBeCloseTo(y.reduce((a, v, i) => a + gaussianCrps(v, mean[i]!, sd[i]!), 0) / n, 10);
    const expectedCrps = sd.reduce((a, s) => a + s / Math.sqrt(Math.PI), 0) / n;
    expect(Math.abs(c.crps / expectedCrps - 1)).toBeLessThan(0.02);
    expect(c.standardisedResiduals.quantiles.gaussian[3]).toBe(0);
    expect(c.standardisedResiduals.quantiles.gaussian[6]).toBeCloseTo(standardNormal.quantile(0.975), 15);
  });

  it("an over-confident model (sd 10% too small) is caught: 90% coverage falls outside the tolerance", () => {
    const c = gaussianCalibration(y, mean, sd.map((s) => s / 1.1));
    const c90 = c.coverage[1]!;
    expect(c90.empirical).toBeLessThan(0.9 - 4 * Math.sqrt(0.09 / n));
    expect(c90.empirical).toBeCloseTo(2 * standardNormal.cdf(1.6448536269514722 / 1.1) - 1, 1);
  });

  it("custom levels, edge cases and validation", () => {
    const c = gaussianCalibration([0, 1, 2], [0, 0, 0], [1, 1, 1], { levels: [0.7] }); // z = Φ⁻¹(0.85) ≈ 1.036: rows at 0 and 1 inside, 2 outside
    expect(c.coverage).toEqual([{ nominal: 0.7, empirical: 2 / 3 }]);
    expect(gaussianCalibration([0], [0], [1]).standardisedResiduals.sd).toBeNaN(); // one row: sample sd undefined
    expect(() => gaussianCalibration([], [], [])).toThrow(/must not be empty/);
    expect(() => gaussianCalibration([1], [1], [0])).toThrow(/sd\[0\] must be > 0, got 0/);
    expect(() => gaussianCalibration([1], [1], [-1])).toThrow(RangeError);
    expect(() => gaussianCalibration([1], [NaN], [1])).toThrow(/mean\[0\] must be finite/);
    expect(() => gaussianCalibration([1], [1], [Infinity])).toThrow(RangeError);
    expect(() => gaussianCalibration([1], [1], [1], { levels: [1] })).toThrow(/levels\[0\] must be in \(0, 1\)/);
    expect(() => gaussianCalibration([1, 2], [1], [1])).toThrow(/mean must have length 2/);
  });
});

describe("calibration properties", () => {
  it("the calibration curve never decreases with the nominal level, and scaling y, mean and sd together changes nothing but NLPD and CRPS (property, derived)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -100, max: 100, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true })), { minLength: 1, maxLength: 40 }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (rows, k) => {
          const y = rows.map(([v]) => v);
          const mean = rows.map(() => 0);
          const sd = rows.map(([, s]) => s);
          const c = gaussianCalibration(y, mean, sd);
          for (let i = 1; i < c.curve.length; i++) expect(c.curve[i]!.empirical).toBeGreaterThanOrEqual(c.curve[i - 1]!.empirical);
          const s = gaussianCalibration(y.map((v) => v * k), mean, sd.map((v) => v * k));
          expect(s.coverage).toEqual(c.coverage);
          expect(s.crps).toBeCloseTo(c.crps * k, 8);
          expect(s.nlpd).toBeCloseTo(c.nlpd + Math.log(k), 8); // ½log(2πk²σ²) = ½log(2πσ²) + log k
        },
      ),
      { numRuns: 60 },
    );
  });
});
