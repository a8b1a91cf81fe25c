/**
 * log det(A) = 2 Σ log L_ii from a Cholesky factor of A (Rasmussen & Williams 2006, Alg. 2.1).
 * @param l - row-major factor; only the diagonal is read.
 * @param n - order.
 * @returns the log-determinant.
 */
export function logDeterminant(l: Float64Array, n: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) s += Math.log(l[i * n + i]!);
  return 2 * s;
}
