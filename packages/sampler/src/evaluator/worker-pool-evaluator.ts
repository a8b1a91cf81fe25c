import { availableParallelism } from "node:os";
import { isAbsolute } from "node:path";
import { pathToFileURL } from "node:url";
import { Piscina } from "piscina";
import type { Evaluator, EvaluatorInput, EvaluatorOutput } from "./evaluator.js";

/** Options of {@link workerPoolEvaluator}. */
export interface WorkerPoolEvaluatorOptions {
  /** Absolute path (or file: URL) of an ES module whose export evaluates one input record. */
  readonly filename: string;
  /** The export to call (default "default"; e.g. "evaluate" for `export function evaluate(input)`). */
  readonly exportName?: string;
  /** Worker threads (default: available parallelism). */
  readonly threads?: number;
}

/**
 * Spreads an expensive evaluator over a pool of worker threads (piscina). Each worker loads `filename` and
 * calls its export (sync or async) on one input record; a batch is spread over the workers and answered in the
 * order asked.
 * @param options - module, export name and thread count.
 * @returns the evaluator; `close` stops the workers.
 * @throws TypeError/RangeError for a bad filename or thread count.
 */
export function workerPoolEvaluator(options: WorkerPoolEvaluatorOptions): Evaluator {
  const fn = "workerPoolEvaluator";
  if (typeof options !== "object" || options === null || typeof options.filename !== "string") {
    throw new TypeError(`${fn}: options.filename must be a string`);
  }
  const isUrl = options.filename.startsWith("file:");
  if (!isUrl && !isAbsolute(options.filename)) {
    throw new RangeError(`${fn}: options.filename must be an absolute path or file: URL, got ${options.filename}`);
  }
  const threads = options.threads ?? availableParallelism();
  if (!Number.isInteger(threads) || threads < 1) throw new RangeError(`${fn}: threads must be an integer ≥ 1, got ${threads}`);
  const filename = isUrl ? options.filename : pathToFileURL(options.filename).href;
  const pool = new Piscina({ filename, name: options.exportName ?? "default", minThreads: threads, maxThreads: threads });
  return {
    name: `worker pool: ${options.filename}${options.exportName ? `#${options.exportName}` : ""}`,
    concurrency: threads * 2,
    evaluate: (batch: readonly EvaluatorInput[]) => Promise.all(batch.map((input) => pool.run(input) as Promise<EvaluatorOutput>)),
    async close() {
      await pool.destroy();
    },
  };
}
