import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { solveLower, solveLowerTransposed } from "./triangular-solve.js";

/** Below this order the exact symmetric eigen-decomposition of ml-matrix is used (not a hot path). */
const EXACT_MAX_N = 150;

/**
 * 2-norm condition number of A = L Lᵀ. For n ≤ 150, exactly from ml-matrix's symmetric eigenvalues
 * (not hot; ml-matrix is used here because speed does not matter); above, estimated by 30 steps of power
 * iteration for λ_max (A v = L(Lᵀv)) and of inverse iteration for λ_min (two triangular solves) from a
 * deterministic start vector (Golub & Van Loan §7.3, §7.6).
 * @param l - Cholesky factor (lower triangle of a row-major n × n array).
 * @param n - order.
 * @returns λ_max / λ_min (an estimate from below above n = 150).
 */
export function conditionEstimate(l: Float64Array, n: number): number {
  if (n === 0) return 1;
  if (n <= EXACT_MAX_N) {
    const a = new Matrix(n, n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j <= i; j++) {
        let s = 0;
        for (let k = 0; k <= j; k++) s += l[i * n + k]! * l[j * n + k]!;
        a.set(i, j, s);
        a.set(j, i, s);
      }
    }
    const ev = new EigenvalueDecomposition(a, { assumeSymmetric: true }).realEigenvalues;
    const max = Math.max(...ev);
    const min = Math.min(...ev);
    return min > 0 ? max / min : Infinity;
  }
  const v = new Float64Array(n);
  const w = new Float64Array(n);
  const start = (x: Float64Array): void => {
    for (let i = 0; i < n; i++) x[i] = 1 + ((i * 7919) % 13) / 13;
    normalise(x);
  };
  start(v);
  let lmax = 0;
  for (let it = 0; it < 30; it++) {
    // w = Lᵀ v
    w.fill(0);
    for (let i = 0; i < n; i++) {
      const vi = v[i]!;
      for (let k = 0; k <= i; k++) w[k] = w[k]! + l[i * n + k]! * vi;
    }
    // v = L w
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k <= i; k++) s += l[i * n + k]! * w[k]!;
      v[i] = s;
    }
    lmax = normalise(v);
  }
  start(v);
  let inv = 0;
  for (let it = 0; it < 30; it++) {
    solveLower(l, n, v);
    solveLowerTransposed(l, n, v);
    inv = normalise(v);
  }
  return inv > 0 ? lmax * inv : Infinity;
}

function normalise(x: Float64Array): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += x[i]! * x[i]!;
  const norm = Math.sqrt(s);
  if (norm > 0) for (let i = 0; i < x.length; i++) x[i] = x[i]! / norm;
  return norm;
}
