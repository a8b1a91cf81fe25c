import { commandEvaluator, type Evaluator } from "@floorcast/sampler";
import type { Design, Outputs } from "../optimize/optimization-problem.js";

/** The evaluation parts of a problem whose exact evaluator is an external command. */
export interface CommandProblemParts {
  /** Synchronous evaluation is not possible: throws TypeError (the harness uses evaluateBatch). */
  evaluate(design: Design): Outputs;
  /** Exact outputs of a batch, from the command (numbers as given, booleans as 1/0, anything else NaN); a program that fails rejects. */
  evaluateBatch(batch: readonly Design[]): Promise<readonly Outputs[]>;
  /** Stops the command's processes (started on the first evaluation). */
  close(): Promise<void>;
  /** A fresh evaluator of the same command for writeDataset (closed by its caller), as `sample --evaluator-command`. */
  datasetEvaluator(): Evaluator;
}

/**
 * A problem's exact evaluator as an external program speaking JSON Lines (the sampler's commandEvaluator, the one
 * `floorcast sample --evaluator-command` runs): each design, with the problem's fixed values, is one line; the
 * program answers with one object of outputs per line. A user benchmarks and optimizes their own evaluator
 * exactly as the demo's massing rule.
 * @param command - the command line (run by the shell in `dir`).
 * @param fixed - values sent with every design.
 * @param dir - working directory (the problem file's folder).
 * @returns evaluate (refuses), evaluateBatch, close and the dataset evaluator factory.
 */
export function commandProblem(command: string, fixed: Readonly<Record<string, number | string>>, dir: string | undefined): CommandProblemParts {
  const options = dir === undefined ? {} : { cwd: dir };
  let running: Evaluator | undefined;
  const numeric = (answer: Readonly<Record<string, unknown>>): Outputs =>
    Object.fromEntries(Object.entries(answer).map(([k, v]) => [k, typeof v === "number" ? v : typeof v === "boolean" ? (v ? 1 : 0) : Number.NaN]));
  return {
    evaluate() {
      throw new TypeError(`evaluate: the problem's evaluator is the command ${JSON.stringify(command)}, which answers asynchronously; use exactEvaluator`);
    },
    async evaluateBatch(batch) {
      running ??= commandEvaluator(command, options);
      const ev = running;
      return (await ev.evaluate(batch.map((d) => ({ ...fixed, ...d })))).map(numeric);
    },
    async close() {
      const ev = running;
      running = undefined;
      await ev?.close();
    },
    datasetEvaluator: () => commandEvaluator(command, options),
  };
}
