/** Standardisation of each target column: `z = (y − mean) / std`. */
export interface OutputScaling {
  readonly mean: readonly number[];
  readonly std: readonly number[];
}

/**
 * Column means and population standard deviations (divisor n, as scikit-learn's `normalize_y`);
 * a constant column gets std 1 so standardised targets are 0, never NaN (common practice).
 * @param y - rows × targets (finite, at least one row).
 * @returns the output scaling.
 */
export function createOutputScaling(y: readonly (readonly number[])[]): OutputScaling {
  const t = y[0]?.length ?? 0;
  const n = y.length;
  const mean: number[] = [];
  const std: number[] = [];
  for (let j = 0; j < t; j++) {
    let s = 0;
    for (const row of y) s += row[j]!;
    let m = s / n;
    if (!Number.isFinite(m)) {
      // The sum overflowed (targets near ±1.8e308): divide each term first.
      m = 0;
      for (const row of y) m += row[j]! / n;
    }
    let ss = 0;
    for (const row of y) ss += (row[j]! - m) ** 2;
    let sd = Math.sqrt(ss / n);
    if (!Number.isFinite(sd)) {
      // The squares overflowed (|y − mean| above ~1e154): scale by the largest deviation first (derived).
      let big = 0;
      for (const row of y) big = Math.max(big, Math.abs(row[j]! - m));
      let rs = 0;
      for (const row of y) rs += ((row[j]! - m) / big) ** 2;
      sd = big * Math.sqrt(rs / n);
    }
    mean.push(m);
    std.push(sd > 0 && Number.isFinite(sd) && sd > 1e-300 ? sd : 1);
  }
  return { mean, std };
}

/**
 * Standardised column j of `y` as a Float64Array.
 * @param scaling - from {@link createOutputScaling}.
 * @param y - rows × targets.
 * @param j - target index.
 * @returns `(y[i][j] − mean[j]) / std[j]` for every row.
 */
export function standardiseTarget(scaling: OutputScaling, y: readonly (readonly number[])[], j: number): Float64Array {
  const out = new Float64Array(y.length);
  const m = scaling.mean[j]!;
  const s = scaling.std[j]!;
  for (let i = 0; i < y.length; i++) out[i] = (y[i]![j]! - m) / s;
  return out;
}
