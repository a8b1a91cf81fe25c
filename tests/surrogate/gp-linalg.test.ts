import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { CholeskyDecomposition, EigenvalueDecomposition, Matrix, inverse } from "ml-matrix";
import {
  choleskyInverseInPlace,
  choleskyWithJitter,
  conditionEstimate,
  logDeterminant,
  solveLower,
  solveLowerMany,
  solveLowerTransposed,
} from "@floorcast/surrogate";

// Outside reference: ml-matrix's own Cholesky, inverse and symmetric eigen-decomposition (a separate implementation).
const spd = (n: number, seed: number): Float64Array => {
  const b = Array.from({ length: n * n }, (_, i) => Math.sin(seed + i * 1.37) * 0.5);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let s = i === j ? n * 0.1 : 0;
      for (let k = 0; k < n; k++) s += b[i * n + k]! * b[j * n + k]!;
      a[i * n + j] = s;
    }
  return a;
};
const toMatrix = (a: Float64Array, n: number): Matrix => new Matrix(Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, (i + 1) * n))));

describe("choleskyWithJitter", () => {
  it("matches ml-matrix's Cholesky factor to 1e-12 and needs no jitter on an SPD matrix", () => {
    const n = 40;
    const a = spd(n, 1);
    const ref = new CholeskyDecomposition(toMatrix(a, n)).lowerTriangularMatrix;
    const f = choleskyWithJitter(a.slice(), n);
    expect(f.jitter).toBe(0);
    for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) expect(f.factor[i * n + j]).toBeCloseTo(ref.get(i, j), 12);
  });

  it("escalates jitter on a singular matrix (duplicate rows) and records it", () => {
    // [[1,1],[1,1]] is PSD but singular (derived): the first attempt fails, a jitter of 1e-10·mean(diag) or more is added.
    const f = choleskyWithJitter(Float64Array.from([1, 1, 1, 1]), 2);
    expect(f.jitter).toBeGreaterThanOrEqual(1e-10);
    expect(f.jitter).toBeLessThan(1e-3);
    const l = f.factor;
    expect(l[0]! * l[0]!).toBeCloseTo(1 + f.jitter, 14);
    expect(Number.isFinite(l[3]!)).toBe(true);
  });

  it("throws a RangeError on an indefinite matrix, and on NaN", () => {
    expect(() => choleskyWithJitter(Float64Array.from([1, 2, 2, 1]), 2)).toThrow(RangeError);
    expect(() => choleskyWithJitter(Float64Array.from([NaN, 0, 0, 1]), 2)).toThrow(RangeError);
  });

  it("handles n = 0 and n = 1", () => {
    expect(choleskyWithJitter(new Float64Array(0), 0).jitter).toBe(0);
    expect(choleskyWithJitter(Float64Array.from([4]), 1).factor[0]).toBe(2);
  });
});

describe("triangular solves, log-determinant, inverse, condition number", () => {
  it("solve L Lᵀ x = b, log det and A⁻¹ agree with ml-matrix (1e-10 relative)", () => {
    for (const n of [1, 2, 7, 33]) {
      const a = spd(n, n);
      const am = toMatrix(a, n);
      const f = choleskyWithJitter(a.slice(), n);
      const b = Float64Array.from({ length: n }, (_, i) => Math.cos(i));
      const x = solveLowerTransposed(f.factor, n, solveLower(f.factor, n, b.slice()));
      const ax = am.mmul(Matrix.columnVector(Array.from(x)));
      for (let i = 0; i < n; i++) expect(ax.get(i, 0)).toBeCloseTo(b[i]!, 10);
      const eig = new EigenvalueDecomposition(am, { assumeSymmetric: true }).realEigenvalues;
      const logdet = eig.reduce((s, v) => s + Math.log(v), 0);
      expect(Math.abs(logDeterminant(f.factor, n) - logdet)).toBeLessThan(1e-10 * Math.max(1, Math.abs(logdet)));
      const inv = choleskyInverseInPlace(f.factor.slice(), n);
      const ref = inverse(am);
      for (let i = 0; i < n; i++)
        for (let j = 0; j <= i; j++) expect(Math.abs(inv[i * n + j]! - ref.get(i, j))).toBeLessThan(1e-10 * Math.max(1, Math.abs(ref.get(i, j))));
    }
  });

  it("solveLowerMany gives bit for bit the single-column solves", () => {
    const n = 17;
    const m = 5;
    const f = choleskyWithJitter(spd(n, 9), n);
    const b = Float64Array.from({ length: n * m }, (_, i) => Math.sin(i * 0.31));
    const many = solveLowerMany(f.factor, n, b.slice(), m);
    for (let c = 0; c < m; c++) {
      const col = solveLower(f.factor, n, Float64Array.from({ length: n }, (_, i) => b[i * m + c]!));
      for (let i = 0; i < n; i++) expect(many[i * m + c]).toBe(col[i]);
    }
  });

  it("condition number: exact (n ≤ 150) equals λmax/λmin; the estimate (n > 150) is within 10% and never above", () => {
    for (const n of [20, 200]) {
      const a = spd(n, 3);
      const eig = new EigenvalueDecomposition(toMatrix(a, n), { assumeSymmetric: true }).realEigenvalues;
      const exact = Math.max(...eig) / Math.min(...eig);
      const est = conditionEstimate(choleskyWithJitter(a.slice(), n).factor, n);
      if (n <= 150) expect(est).toBeCloseTo(exact, 6);
      else {
        expect(est).toBeLessThanOrEqual(exact * (1 + 1e-9));
        expect(est).toBeGreaterThan(0.9 * exact);
      }
    }
  });

  it("property: for random SPD matrices, L Lᵀ reproduces A (fast-check)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 12 }), fc.integer({ min: 0, max: 1000 }), (n, seed) => {
        const a = spd(n, seed);
        const f = choleskyWithJitter(a.slice(), n);
        for (let i = 0; i < n; i++)
          for (let j = 0; j <= i; j++) {
            let s = 0;
            for (let k = 0; k <= j; k++) s += f.factor[i * n + k]! * f.factor[j * n + k]!;
            if (Math.abs(s - a[i * n + j]!) > 1e-10 * Math.max(1, Math.abs(a[i * n + j]!))) return false;
          }
        return true;
      }),
      { numRuns: 50 },
    );
  });
});
