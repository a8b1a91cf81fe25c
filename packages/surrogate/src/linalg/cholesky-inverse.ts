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
  // Phase 2, two rows a, a+1 per pass (row b of U streamed once for both).
  let a = 0;
  for (; a + 1 < n; a += 2) {
    const ra = a * n;
    const ra1 = ra + n;
    const ua = diag[a]!;
    const ua1 = diag[a + 1]!;
    const uaa1 = l[ra + a + 1]!;
    for (let b = 0; b < a; b++) {
      const rb = b * n;
      let s1 = ua1 * l[rb + a + 1]!;
      let s = ua * l[rb + a]! + uaa1 * l[rb + a + 1]!;
      for (let k = a + 2; k < n; k++) {
        const u = l[rb + k]!;
        s += l[ra + k]! * u;
        s1 += l[ra1 + k]! * u;
      }
      l[ra + b] = s;
      l[ra1 + b] = s1;
    }
    let saa = ua * ua + uaa1 * uaa1;
    let s10 = ua1 * uaa1;
    let s11 = ua1 * ua1;
    for (let k = a + 2; k < n; k++) {
      const u = l[ra + k]!;
      const u1 = l[ra1 + k]!;
      saa += u * u;
      s10 += u1 * u;
      s11 += u1 * u1;
    }
    l[ra + a] = saa;
    l[ra1 + a] = s10;
    l[ra1 + a + 1] = s11;
  }
  for (; a < n; a++) {
    const ra = a * n;
    const ua = diag[a]!;
    for (let b = 0; b <= a; b++) {
      const rb = b * n;
      let s = ua * (b === a ? ua : l[rb + a]!);
      for (let k = a + 1; k < n; k++) s += l[ra + k]! * l[rb + k]!;
      l[ra + b] = s;
    }
  }
  return l;
}
