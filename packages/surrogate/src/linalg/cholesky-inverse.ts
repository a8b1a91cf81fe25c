/**
 * Overwrites a Cholesky factor L (lower triangle of a row-major n × n array) with the lower triangle of
 * A⁻¹ = L⁻ᵀ L⁻¹ using one extra vector (derived; Golub & Van Loan §4.2). Every inner loop is a dot product
 * of contiguous rows:
 * 1. U = L⁻ᵀ into the strict upper triangle (and its diagonal 1/L_ii into a vector):
 *    U_ji = −(Σ_{k=j}^{i−1} L_ik U_jk) / L_ii, since row j of U is column j of L⁻¹;
 * 2. A⁻¹_ab = Σ_{k≥a} U_ak U_bk for b ≤ a, written over the lower triangle.
 * The strict upper triangle is left holding L⁻ᵀ.
 * @param l - factor, overwritten.
 * @param n - order.
 * @returns the same array, lower triangle (with diagonal) now A⁻¹.
 */
export function choleskyInverseInPlace(l: Float64Array, n: number): Float64Array {
  const diag = new Float64Array(n);
  for (let i = 0; i < n; i++) diag[i] = 1 / l[i * n + i]!;
  // Phase 1, two rows i, i+1 per pass so each row j of U is streamed once for both.
  let i = 0;
  for (; i + 1 < n; i += 2) {
    const ri = i * n;
    const ri1 = ri + n;
    const inv = diag[i]!;
    const inv1 = diag[i + 1]!;
    for (let j = 0; j < i; j++) {
      const rj = j * n;
      let s = l[ri + j]! * diag[j]!;
      let s1 = l[ri1 + j]! * diag[j]!;
      for (let k = j + 1; k < i; k++) {
        const u = l[rj + k]!;
        s += l[ri + k]! * u;
        s1 += l[ri1 + k]! * u;
      }
      const uji = -s * inv;
      l[rj + i] = uji;
      l[rj + i + 1] = -(s1 + l[ri1 + i]! * uji) * inv1;
    }
    l[ri + i + 1] = -(l[ri1 + i]! * inv) * inv1;
  }
  for (; i < n; i++) {
    const ri = i * n;
    const inv = diag[i]!;
    for (let j = 0; j < i; j++) {
      const rj = j * n;
      let s = l[ri + j]! * diag[j]!;
      for (let k = j + 1; k < i; k++) s += l[ri + k]! * l[rj + k]!;
      l[rj + i] = -s * inv;
    }
  }
  // Phase 2, four rows a..a+3 per pass (row b of U streamed once for all four); the 4 × 4 diagonal block
  // and the leftover rows use the plain loop.
  let a = 0;
  for (; a + 3 < n; a += 4) {
    const r0 = a * n;
    const r1 = r0 + n;
    const r2 = r1 + n;
    const r3 = r2 + n;
    const u01 = l[r0 + a + 1]!;
    const u02 = l[r0 + a + 2]!;
    const u03 = l[r0 + a + 3]!;
    const u12 = l[r1 + a + 2]!;
    const u13 = l[r1 + a + 3]!;
    const u23 = l[r2 + a + 3]!;
    const d0 = diag[a]!;
    const d1 = diag[a + 1]!;
    const d2 = diag[a + 2]!;
    const d3 = diag[a + 3]!;
    for (let b = 0; b < a; b++) {
      const rb = b * n;
      const v0 = l[rb + a]!;
      const v1 = l[rb + a + 1]!;
      const v2 = l[rb + a + 2]!;
      const v3 = l[rb + a + 3]!;
      let s0 = d0 * v0 + u01 * v1 + u02 * v2 + u03 * v3;
      let s1 = d1 * v1 + u12 * v2 + u13 * v3;
      let s2 = d2 * v2 + u23 * v3;
      let s3 = d3 * v3;
      for (let k = a + 4; k < n; k++) {
        const u = l[rb + k]!;
        s0 += l[r0 + k]! * u;
        s1 += l[r1 + k]! * u;
        s2 += l[r2 + k]! * u;
        s3 += l[r3 + k]! * u;
      }
      l[r0 + b] = s0;
      l[r1 + b] = s1;
      l[r2 + b] = s2;
      l[r3 + b] = s3;
    }
    for (let q = 0; q < 4; q++) inverseRowTail(l, n, diag, a + q, a);
  }
  for (; a < n; a++) inverseRowTail(l, n, diag, a, 0);
  return l;
}

/** A⁻¹_ab = Σ_{k≥a} U_ak U_bk for b = from..a (U_xx = diag_x, U_xk = l[x·n + k] for k > x). */
function inverseRowTail(l: Float64Array, n: number, diag: Float64Array, a: number, from: number): void {
  const ra = a * n;
  const ua = diag[a]!;
  for (let b = from; b <= a; b++) {
    const rb = b * n;
    let s = ua * (b === a ? ua : l[rb + a]!);
    for (let k = a + 1; k < n; k++) s += l[ra + k]! * l[rb + k]!;
    l[ra + b] = s;
  }
}
