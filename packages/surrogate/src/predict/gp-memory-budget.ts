/** Default memory budget of a GP fit: 2 GiB. */
export const DEFAULT_GP_MEMORY_BUDGET = 2 * 1024 ** 3;

/**
 * Bytes a GP fit will hold at its peak (derived): one n × n Cholesky factor per target (kept for variances),
 * one m × m work matrix for the hyperparameter search on m rows, one more n × n while conditioning the next
 * target, plus O(n·d) vectors. Checked BEFORE anything large is allocated.
 * @param n - rows.
 * @param d - inputs.
 * @param targets - targets.
 * @param m - rows used for the hyperparameter search (0 when hyperparameters are given).
 * @returns the estimate in bytes.
 */
export function gpMemoryBytes(n: number, d: number, targets: number, m: number): number {
  return 8 * (n * n * (targets + 1) + m * m + 16 * n * (d + targets));
}

/**
 * Throws a RangeError when loading a GP model file would need more memory than a fit is allowed by default
 * (DEFAULT_GP_MEMORY_BUDGET, the same estimate as gpMemoryBytes without the search matrix), checked before the
 * training inputs are copied: a file written by a default fit always loads.
 * @param fn - calling function, starts the message.
 * @param fileName - the model file, named in the message.
 * @param n - training rows in the file.
 * @param d - inputs.
 * @param targets - targets.
 */
export function checkGpLoadMemory(fn: string, fileName: string, n: number, d: number, targets: number): void {
  const need = gpMemoryBytes(n, d, targets, 0);
  if (need > DEFAULT_GP_MEMORY_BUDGET) {
    const gib = (b: number): string => `${(b / 1024 ** 3).toFixed(2)} GiB`;
    throw new RangeError(
      `${fn}: ${fileName}: a GP on n = ${n} training rows × ${targets} target(s) needs about ${gib(need)} to predict with, over the memory budget of ${gib(DEFAULT_GP_MEMORY_BUDGET)}; fit it on fewer rows`,
    );
  }
}

