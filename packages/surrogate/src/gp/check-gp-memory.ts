import { DEFAULT_GP_MEMORY_BUDGET, gpMemoryBytes } from "../predict/gp-memory-budget.js";

export { DEFAULT_GP_MEMORY_BUDGET, gpMemoryBytes, checkGpLoadMemory } from "../predict/gp-memory-budget.js";

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
