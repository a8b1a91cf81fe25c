/** A Cholesky factor and the diagonal jitter that had to be added to obtain it. */
export interface CholeskyFactor {
  /** Row-major n × n; the lower triangle (with diagonal) holds L, the strict upper triangle keeps A's values. */
  readonly factor: Float64Array;
  readonly n: number;
  /** Absolute amount added to every diagonal entry (0 when A factored as given). */
  readonly jitter: number;
}

/**
 * One attempt at A + jitter·I = L Lᵀ, written over the lower triangle of `a` (row-oriented,
 * inner products of contiguous rows; Golub & Van Loan, Matrix Computations, Alg. 4.2.1).
 * The strict upper triangle is only read, so a failed attempt can be restored from it.
 * Rows are processed four at a time so each earlier row j is streamed once for all four.
 * @returns true on success, false at a non-positive or non-finite pivot.
 */
function attempt(a: Float64Array, n: number, diag: Float64Array, jitter: number): boolean {
  let i = 0;
  for (; i + 3 < n; i += 4) {
    const r0 = i * n;
    const r1 = r0 + n;
    const r2 = r1 + n;
    const r3 = r2 + n;
    for (let j = 0; j < i; j++) {
      const rj = j * n;
      let s0 = a[r0 + j]!;
      let s1 = a[r1 + j]!;
      let s2 = a[r2 + j]!;
      let s3 = a[r3 + j]!;
      for (let p = 0; p < j; p++) {
        const l = a[rj + p]!;
        s0 -= a[r0 + p]! * l;
        s1 -= a[r1 + p]! * l;
        s2 -= a[r2 + p]! * l;
        s3 -= a[r3 + p]! * l;
      }
      const ljj = a[rj + j]!;
      a[r0 + j] = s0 / ljj;
      a[r1 + j] = s1 / ljj;
      a[r2 + j] = s2 / ljj;
      a[r3 + j] = s3 / ljj;
    }
    for (let q = i; q < i + 4; q++) if (!finishRow(a, n, diag, jitter, q, i)) return false;
  }
  for (; i < n; i++) if (!finishRow(a, n, diag, jitter, i, 0)) return false;
  return true;
}

/** Columns from..i of row i (earlier columns already done), including the pivot. */
function finishRow(a: Float64Array, n: number, diag: Float64Array, jitter: number, i: number, from: number): boolean {
  const ri = i * n;
  for (let j = from; j < i; j++) {
    const rj = j * n;
    let s = a[ri + j]!;
    for (let p = 0; p < j; p++) s -= a[ri + p]! * a[rj + p]!;
    a[ri + j] = s / a[rj + j]!;
  }
  let dii = diag[i]! + jitter;
  for (let p = 0; p < i; p++) dii -= a[ri + p]! * a[ri + p]!;
  if (!(dii > 0) || !Number.isFinite(dii)) return false;
  a[ri + i] = Math.sqrt(dii);
  return true;
}

/** Restores the lower triangle and diagonal of `a` from its untouched upper triangle and saved diagonal. */
function restore(a: Float64Array, n: number, diag: Float64Array): void {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) a[i * n + j] = a[j * n + i]!;
    a[i * n + i] = diag[i]!;
  }
}

/**
 * Cholesky factorisation of a symmetric positive (semi-)definite matrix with escalating jitter:
 * first as given, then with `jitter = initialJitter · mean(diag A) · 10^k`, k = 0, 1, … (common practice,
 * cf. Rasmussen & Williams 2006, §A.4). Works in place on `a` (row-major, both triangles filled).
 * @param a - symmetric n × n matrix, overwritten (lower triangle becomes L).
 * @param n - order.
 * @param options - `initialJitter` (relative, default 1e-10) and `maxTries` escalations (default 10).
 * @returns the factor and the absolute jitter added.
 * @throws RangeError when even the largest jitter fails (matrix not positive semi-definite or not finite).
 */
export function choleskyWithJitter(
  a: Float64Array,
  n: number,
  options: { initialJitter?: number; maxTries?: number } = {},
): CholeskyFactor {
  const diag = new Float64Array(n);
  let meanDiag = 0;
  for (let i = 0; i < n; i++) {
    diag[i] = a[i * n + i]!;
    meanDiag += diag[i]! / n;
  }
  if (attempt(a, n, diag, 0)) return { factor: a, n, jitter: 0 };
  const base = (options.initialJitter ?? 1e-10) * (meanDiag > 0 && Number.isFinite(meanDiag) ? meanDiag : 1);
  const tries = options.maxTries ?? 10;
  for (let k = 0; k < tries; k++) {
    const jitter = base * 10 ** k;
    restore(a, n, diag);
    if (attempt(a, n, diag, jitter)) return { factor: a, n, jitter };
  }
  throw new RangeError(
    `choleskyWithJitter: matrix is not positive definite even with jitter ${base * 10 ** (tries - 1)} on the diagonal`,
  );
}
