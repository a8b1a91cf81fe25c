import type { Evaluator, EvaluatorFunction, EvaluatorOutput } from "./evaluator.js";

/**
 * Wraps any function (sync or async) from one input record to its output record as an {@link Evaluator}: a batch
 * is answered design by design, synchronously when the function is synchronous.
 * @param fn - the function.
 * @param options - `name` recorded in manifests (default "function"), `concurrency` (default 1; raise it for
 *   async functions that wait on I/O).
 * @returns the evaluator; `close` does nothing.
 * @throws TypeError when fn is not a function; RangeError for a bad concurrency.
 */
export function functionEvaluator(
  fn: EvaluatorFunction,
  options: { readonly name?: string; readonly concurrency?: number } = {},
): Evaluator {
  if (typeof fn !== "function") throw new TypeError("functionEvaluator: fn must be a function");
  const concurrency = options.concurrency ?? 1;
  if (!Number.isInteger(concurrency) || concurrency < 1) {
    throw new RangeError(`functionEvaluator: concurrency must be an integer ≥ 1, got ${concurrency}`);
  }
  return {
    name: options.name ?? "function",
    concurrency,
    evaluate(batch) {
      const answers = batch.map((input) => fn(input));
      if (answers.some((a) => typeof (a as { then?: unknown }).then === "function")) return Promise.all(answers);
      return answers as EvaluatorOutput[];
    },
    close: async () => {},
  };
}
