/**
 * The stratum [k/n, (k+1)/n) that a unit-interval coordinate falls in, with x = 1 put in the last stratum.
 * @param x - a coordinate in [0, 1].
 * @param n - the number of strata.
 * @returns k in 0..n-1.
 */
export function stratumIndex(x: number, n: number): number {
  const k = Math.floor(x * n);
  return k >= n ? n - 1 : k < 0 ? 0 : k;
}

/**
 * Whether a column is Latin: its n coordinates fall one in each of the n strata.
 * @param column - coordinates in [0, 1].
 * @returns the stratum of each entry when the column is Latin, otherwise undefined.
 */
export function latinStrata(column: readonly number[]): number[] | undefined {
  const n = column.length;
  const seen = new Uint8Array(n);
  const strata = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    const k = stratumIndex(column[i] as number, n);
    if (seen[k] === 1) return undefined;
    seen[k] = 1;
    strata[i] = k;
  }
  return strata;
}
