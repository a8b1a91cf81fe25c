/**
 * The fewest calibration rows for which split-conformal prediction gives a bounded interval at this coverage:
 * the least n with k = ⌈(n + 1)·coverage⌉ ≤ n (Lei et al. 2018, §2.2), i.e. n ≥ coverage / (1 − coverage)
 * (derived); e.g. 9 rows at 0.9, 99 at 0.99. Uses the same rounding guard as `conformalQuantile`.
 * @param coverage - 1 − α in (0, 1).
 * @returns the least number of calibration rows.
 */
export function minCalibrationRows(coverage: number): number {
  let n = Math.max(1, Math.floor(coverage / (1 - coverage)) - 1);
  while (Math.ceil((n + 1) * coverage - 1e-9) > n) n++;
  return n;
}
