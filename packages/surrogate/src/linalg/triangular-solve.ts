/**
 * Solves L x = b by forward substitution (L lower triangle of a row-major n × n array).
 * @param l - factor (only the lower triangle is read).
 * @param n - order.
 * @param b - right-hand side, overwritten with x.
 * @returns b (now x).
 */
export function solveLower(l: Float64Array, n: number, b: Float64Array): Float64Array {
  for (let i = 0; i < n; i++) {
    const r = i * n;
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= l[r + k]! * b[k]!;
    b[i] = s / l[r + i]!;
  }
  return b;
}

/**
 * Solves Lᵀ x = b by back substitution, reading L row by row (column-oriented update).
 * @param l - factor (only the lower triangle is read).
 * @param n - order.
 * @param b - right-hand side, overwritten with x.
 * @returns b (now x).
 */
export function solveLowerTransposed(l: Float64Array, n: number, b: Float64Array): Float64Array {
  for (let i = n - 1; i >= 0; i--) {
    const r = i * n;
    const xi = b[i]! / l[r + i]!;
    b[i] = xi;
    for (let k = 0; k < i; k++) b[k] = b[k]! - l[r + k]! * xi;
  }
  return b;
}

/**
 * Solves L X = B for m right-hand sides at once (forward substitution; B row-major n × m, overwritten), so L is
 * streamed once per block instead of once per column; each column gets exactly the operations of {@link solveLower}.
 * @param l - factor (only the lower triangle is read).
 * @param n - order.
 * @param b - n × m right-hand sides, overwritten with X.
 * @param m - number of right-hand sides.
 * @returns b (now X).
 */
export function solveLowerMany(l: Float64Array, n: number, b: Float64Array, m: number): Float64Array {
  for (let i = 0; i < n; i++) {
    const r = i * n;
    const bi = i * m;
    for (let k = 0; k < i; k++) {
      const lik = l[r + k]!;
      if (lik === 0) continue;
      const bk = k * m;
      for (let c = 0; c < m; c++) b[bi + c] = b[bi + c]! - lik * b[bk + c]!;
    }
    const lii = l[r + i]!;
    for (let c = 0; c < m; c++) b[bi + c] = b[bi + c]! / lii;
  }
  return b;
}
