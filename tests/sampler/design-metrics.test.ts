import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { centredL2Discrepancy, isLatin, minPairwiseDistance, phiP } from "@floorcast/sampler";

describe("minPairwiseDistance", () => {
  it("is the 3-4-5 distance for two points and 0 for duplicates", () => {
    expect(minPairwiseDistance([[0, 0], [0.3, 0.4], [1, 1]])).toBeCloseTo(0.5, 15); // derived: 3-4-5 triangle
    expect(minPairwiseDistance([[0.2, 0.2], [0.7, 0.1], [0.2, 0.2]])).toBe(0);
  });
  it("is Infinity for fewer than two points and rejects bad input", () => {
    expect(minPairwiseDistance([])).toBe(Infinity);
    expect(minPairwiseDistance([[0.5, 0.5]])).toBe(Infinity);
    expect(() => minPairwiseDistance([[0, NaN], [1, 1]])).toThrow(/^minPairwiseDistance: points\[0\]\[1\] must be finite/);
    expect(() => minPairwiseDistance([[0, Infinity]])).toThrow(RangeError);
    expect(() => minPairwiseDistance([[0, 1], [1]])).toThrow(/points\[1\] has 1 coordinates/);
    expect(() => minPairwiseDistance([[]])).toThrow(RangeError);
    expect(() => minPairwiseDistance("x" as unknown as number[][])).toThrow(TypeError);
  });
});

describe("phiP (Morris & Mitchell 1995)", () => {
  it("equals the hand sum for three points", () => {
    // Derived by hand: distances 0.5, 1 and √(0.7² + 0.4²); φ2 = (Σ d^-2)^(1/2).
    const pts = [[0, 0], [0.3, 0.4], [1, 0]];
    const d = [0.5, 1, Math.hypot(0.7, 0.4)];
    expect(phiP(pts, 2)).toBeCloseTo(Math.sqrt(d.reduce((s, v) => s + v ** -2, 0)), 14);
    // q = 1 (rectilinear): distances 0.7, 1, 1.1 (derived).
    expect(phiP(pts, 3, 1)).toBeCloseTo((0.7 ** -3 + 1 + 1.1 ** -3) ** (1 / 3), 14);
  });
  it("tends to 1 / min distance for large p and never overflows", () => {
    const pts = [[0, 0], [1e-7, 0], [1, 1]];
    // d_min = 1e-7: d^-50 = 1e350 would overflow a direct sum; the scaled sum gives ≈ 1e7.
    expect(phiP(pts, 50)).toBeCloseTo(1e7, -1);
    expect(Number.isFinite(phiP(pts, 50))).toBe(true);
  });
  it("is Infinity (never NaN) with duplicate points, 0 for fewer than two", () => {
    expect(phiP([[0.1, 0.1], [0.1, 0.1], [0.9, 0.5]])).toBe(Infinity);
    expect(phiP([[0.5]])).toBe(0);
    expect(phiP([])).toBe(0);
  });
  it("rejects bad p and q", () => {
    for (const p of [0, -1, NaN, Infinity]) expect(() => phiP([[0], [1]], p)).toThrow(/^phiP: p must be/);
    for (const q of [0.5, NaN, Infinity]) expect(() => phiP([[0], [1]], 2, q)).toThrow(/^phiP: q must be/);
  });
  it("is at least 1 / min distance (the sum holds the d_min^-p term) and never NaN (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 2, maxLength: 12 }), (pts) => {
        const v = phiP(pts as number[][]);
        expect(Number.isNaN(v)).toBe(false);
        expect(v >= 1 / minPairwiseDistance(pts as number[][]) * (1 - 1e-12) || v === Infinity).toBe(true);
      }),
    );
  });
});

describe("centredL2Discrepancy (Hickernell 1998)", () => {
  it("matches the closed form for one point at the centre", () => {
    // One point at ½ in d dims: CD² = (13/12)^d − 2 + 1 (every product is 1) — derived from the formula.
    for (const d of [1, 3, 12]) expect(centredL2Discrepancy([Array(d).fill(0.5)])).toBeCloseTo((13 / 12) ** d - 1, 14);
  });
  it("accepts the cube's faces and rejects empty or out-of-cube input", () => {
    expect(Number.isFinite(centredL2Discrepancy([[0, 1], [1, 0]]))).toBe(true);
    expect(() => centredL2Discrepancy([])).toThrow(/^centredL2Discrepancy: points must not be empty/);
    expect(() => centredL2Discrepancy([[1.2]])).toThrow(/must be in \[0, 1\]/);
    expect(() => centredL2Discrepancy([[NaN]])).toThrow(RangeError);
  });
  it("is non-negative and invariant to the order of points and coordinates (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }), { minLength: 1, maxLength: 20 }), (pts) => {
        const v = centredL2Discrepancy(pts);
        expect(v).toBeGreaterThanOrEqual(-1e-15);
        const rev = [...pts].reverse().map((r) => [r[2], r[0], r[1]] as number[]);
        expect(Math.abs(centredL2Discrepancy(rev) - v)).toBeLessThan(1e-12);
      }),
    );
  });
});

describe("isLatin", () => {
  it("checks one point per stratum in each dimension", () => {
    expect(isLatin([[0.1, 0.9], [0.6, 0.2]])).toBe(true);
    expect(isLatin([[0.1, 0.9], [0.4, 0.2]])).toBe(false); // both x in [0, ½)
    expect(isLatin([[0, 1], [1, 0]])).toBe(true); // x = 1 counts in the last stratum
    expect(isLatin([])).toBe(true);
    expect(isLatin([[0.3]])).toBe(true);
  });
  it("with fewer strata than points, requires n/s points in each", () => {
    const pts = [[0.1], [0.2], [0.6], [0.9]];
    expect(isLatin(pts, 2)).toBe(true);
    expect(isLatin(pts, 4)).toBe(false);
    expect(isLatin(pts, 3)).toBe(false); // 3 does not divide 4
    expect(() => isLatin(pts, 0)).toThrow(/^isLatin: strata must be an integer ≥ 1/);
    expect(() => isLatin(pts, NaN)).toThrow(RangeError);
    expect(() => isLatin([[1.5]])).toThrow(RangeError);
  });
});
