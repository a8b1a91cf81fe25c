import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { erf, erfc, gaussianCrps, standardNormal } from "@floorcast/surrogate";
import { referenceAvailable, runReference } from "../reference/python.js";

const hasRef = referenceAvailable(["scipy"]);

/** Relative difference, with an absolute floor for values near 0. */
const rel = (a: number, b: number, floor = 1e-300) => Math.abs(a - b) / Math.max(Math.abs(b), floor);

// Grid over the whole useful range: the centre, Cody's interval edges (0.46875, 4) and the deep tails.
const xs: number[] = [];
for (let x = -38; x <= 9; x += 0.0625) xs.push(x);
xs.push(0.46875, -0.46875, 4, -4, 1e-12, -1e-300, 26.5, 27);
const ps: number[] = [1e-300, 1e-100, 1e-20, 1e-10, 1e-5, 0.001, 0.01, 0.02425, 0.025, 0.05, 0.1, 0.25, 0.5, 0.6, 0.75, 0.9, 0.95, 0.975, 0.99, 0.999, 1 - 1e-10];
for (let p = 0.01; p < 1; p += 0.01) ps.push(p);

describe.skipIf(!hasRef)("erf, erfc, Φ and Φ⁻¹ against scipy.special 1.10.1", () => {
  const ref = hasRef
    ? runReference<{ erf: number[]; erfc: number[]; ndtr: number[]; ndtri: number[] }>("normal_scipy.py", { x: xs, p: ps })
    : { erf: [], erfc: [], ndtr: [], ndtri: [] };

  it("erf and erfc agree with scipy.special.erf/erfc to 1e-14 relative", () => {
    // Cody (1969) reports relative errors below 1e-18 for the rational forms; what remains is a few ulps
    // of double rounding (1 ulp ≈ 2.2e-16), so 1e-14 relative is a tight, honest bound.
    let worst = 0;
    xs.forEach((x, i) => {
      if (ref.erf[i] !== 0) worst = Math.max(worst, rel(erf(x), ref.erf[i]!));
      if (ref.erfc[i] !== 0) worst = Math.max(worst, rel(erfc(x), ref.erfc[i]!));
      else expect(erfc(x)).toBeLessThan(1e-300);
    });
    expect(worst).toBeLessThan(1e-14);
  });

  it("Φ agrees with scipy.special.ndtr to a few ulps plus the tail's argument-rounding bound", () => {
    // Both compute ½erfc(|x|/√2). Rounding t = x/√2 by δ ≤ 1.1e-16 relative changes exp(−t²) by
    // 2t²δ = x²δ relative (derived), ≈ 1.6e-13 at x = −38; the two libraries may round differently,
    // so the bound is x²·1.2e-16 + 3e-15 (a dozen ulps for the rest).
    xs.forEach((x, i) => {
      if (ref.ndtr[i]! > 1e-300) expect(rel(standardNormal.cdf(x), ref.ndtr[i]!)).toBeLessThan(x * x * 1.2e-16 + 3e-15);
    });
  });

  it("Φ⁻¹ agrees with scipy.special.ndtri to 1e-14 relative (absolute 1e-17 near p = ½)", () => {
    // Two Halley steps from Acklam's 1e-9 start square the error twice: full precision (derived).
    ps.forEach((p, i) => {
      expect(rel(standardNormal.quantile(p), ref.ndtri[i]!, 1e-3)).toBeLessThan(1e-14);
    });
  });
});

describe("standard normal: special values, symmetry and edge cases", () => {
  it("handles NaN and infinities", () => {
    expect(erf(NaN)).toBeNaN();
    expect(erfc(NaN)).toBeNaN();
    expect(erf(Infinity)).toBe(1);
    expect(erf(-Infinity)).toBe(-1);
    expect(erfc(Infinity)).toBe(0);
    expect(erfc(-Infinity)).toBe(2);
    expect(standardNormal.cdf(NaN)).toBeNaN();
    expect(standardNormal.cdf(Infinity)).toBe(1);
    expect(standardNormal.cdf(-Infinity)).toBe(0);
    expect(standardNormal.quantile(0)).toBe(-Infinity);
    expect(standardNormal.quantile(1)).toBe(Infinity);
    expect(standardNormal.quantile(1.5)).toBeNaN();
    expect(standardNormal.quantile(NaN)).toBeNaN();
  });

  it("Φ(0) = ½ and Φ⁻¹(0.975) = 1.959963984540054 (textbook value, from memory; also scipy.special.ndtri)", () => {
    expect(standardNormal.cdf(0)).toBe(0.5);
    expect(standardNormal.quantile(0.975)).toBeCloseTo(1.959963984540054, 14);
  });

  it("erf is odd, Φ(x) + Φ(−x) = 1 and Φ⁻¹(Φ(x)) = x (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -8, max: 8, noNaN: true }), (x) => {
        expect(erf(-x)).toBe(-erf(x));
        expect(Math.abs(standardNormal.cdf(x) + standardNormal.cdf(-x) - 1)).toBeLessThan(2e-16 * 4);
        expect(Math.abs(standardNormal.quantile(standardNormal.cdf(x)) - x)).toBeLessThan(1e-8 * Math.max(1, Math.abs(x)) + 1e-15 / standardNormal.pdf(x));
      }),
    );
  });
});

describe("Gaussian CRPS (Gneiting & Raftery 2007, eq. 21)", () => {
  it("matches hand-computed points", () => {
    // derived: z = 0 → σ(2φ(0) − 1/√π) = (√2 − 1)/√π = 0.2336949772551091 for σ = 1.
    expect(gaussianCrps(0, 0, 1)).toBeCloseTo((Math.SQRT2 - 1) / Math.sqrt(Math.PI), 15);
    // derived: z = 1 with Φ(1) = 0.8413447460685429, φ(1) = 0.24197072451914337 (standard tables):
    // 1·(2·0.8413447460685429 − 1) + 2·0.24197072451914337 − 0.5641895835477563 = 0.6024413576276166.
    expect(gaussianCrps(3, 1, 2)).toBeCloseTo(2 * 0.6024413576276166, 14);
    expect(gaussianCrps(1, 3, 2)).toBeCloseTo(2 * 0.6024413576276166, 14); // symmetric in y − μ
    // σ = 0: the limit is |y − μ| (derived: the forecast is a point mass).
    expect(gaussianCrps(2.5, 1, 0)).toBe(1.5);
    expect(gaussianCrps(1, 1, -1)).toBeNaN();
    expect(gaussianCrps(NaN, 1, 1)).toBeNaN();
  });

  it("scales with σ and tends to σ(|z| − 1/√π) far from the mean (property, derived)", () => {
    fc.assert(
      fc.property(fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), (z, s) => {
        expect(gaussianCrps(z * s, 0, s)).toBeCloseTo(s * gaussianCrps(z, 0, 1), 10);
        expect(gaussianCrps(z, 0, 1)).toBeGreaterThan(0);
      }),
    );
    expect(gaussianCrps(30, 0, 1)).toBeCloseTo(30 - 1 / Math.sqrt(Math.PI), 12);
  });

  describe.skipIf(!hasRef)("against numerical integration (scipy.integrate.quad)", () => {
    it("agrees with ∫(F(t) − 1{t ≥ y})² dt to 1e-9 relative", () => {
      const cases: [number, number, number][] = [[0, 0, 1], [1.3, -0.2, 0.7], [-4, 2, 1.5], [100, 97, 5], [0.01, 0, 0.001], [7, 0, 1]];
      const ref = runReference<{ crps_quad: number[] }>("normal_scipy.py", { crps: cases });
      cases.forEach(([y, m, s], i) => {
        // quad was asked for 1e-12 relative; 1e-9 leaves room for its own error estimate being loose.
        expect(rel(gaussianCrps(y, m, s), ref.crps_quad[i]!)).toBeLessThan(1e-9);
      });
    });
  });
});
