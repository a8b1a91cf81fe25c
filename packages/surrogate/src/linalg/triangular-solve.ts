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
