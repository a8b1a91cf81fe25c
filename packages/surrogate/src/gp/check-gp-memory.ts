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
 * Throws a RangeError when a GP fit would exceed the memory budget (instead of running out of memory).
 * @param fn - calling function, starts the message.
 * @param n - rows.
 * @param d - inputs.
 * @param targets - targets.
 * @param m - rows for the hyperparameter search.
 * @param budget - bytes allowed.
 */
export function checkGpMemory(fn: string, n: number, d: number, targets: number, m: number, budget: number): void {
  const need = gpMemoryBytes(n, d, targets, m);
  if (need > budget) {
    const gib = (b: number): string => `${(b / 1024 ** 3).toFixed(2)} GiB`;
    throw new RangeError(
      `${fn}: an exact GP on n = ${n} rows × ${targets} target(s) needs about ${gib(need)}, over the memory budget of ${gib(budget)} (options.memoryBudgetBytes); use fewer rows or raise the budget`,
    );
  }
}
