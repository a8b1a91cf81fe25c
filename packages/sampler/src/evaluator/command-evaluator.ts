import type { Evaluator, EvaluatorInput } from "./evaluator.js";
import { openCommandChannel } from "./command-channel.js";

/** Options of {@link commandEvaluator}. */
export interface CommandEvaluatorOptions {
  /** Inputs in flight per process (default 64): each program sees a stream, not one request at a time. */
  readonly window?: number;
  /** Copies of the program run side by side, a pool of processes for a slow model (default 1). */
  readonly processes?: number;
  /** Working directory of the program. */
  readonly cwd?: string;
}

/**
 * Runs an external program and streams samples to it as JSON Lines (one JSON object per line on its stdin); it
 * must answer each line, in order, with one JSON object of outputs per line on its stdout. So a user's own,
 * slower procedural model can be sampled like the built-in rule. With `processes: N`, N copies run side by side
 * and each sample goes to the copy with the fewest unanswered lines; the dataset generator still writes the
 * answers in design order, so the output does not depend on N.
 * @param command - a command line, run by the system shell (e.g. `python3 my_model.py`).
 * @param options - window per process, number of processes, working directory.
 * @returns the evaluator; `close` ends the programs' stdin and waits for them to exit.
 * @throws TypeError/RangeError for a bad command or option; evaluations reject when an answer is not a JSON object
 *   or a program exits early (its exit status and the end of its stderr are quoted).
 */
export function commandEvaluator(command: string, options: CommandEvaluatorOptions = {}): Evaluator {
  const fn = "commandEvaluator";
  if (typeof command !== "string" || command.trim() === "") throw new TypeError(`${fn}: command must be a non-empty string`);
  const window = options.window ?? 64;
  if (!Number.isInteger(window) || window < 1) throw new RangeError(`${fn}: window must be an integer ≥ 1, got ${window}`);
  const processes = options.processes ?? 1;
  if (!Number.isInteger(processes) || processes < 1) {
    throw new RangeError(`${fn}: processes must be an integer ≥ 1, got ${processes}`);
  }
  const channels = Array.from({ length: processes }, () => openCommandChannel(fn, command, options.cwd));
  return {
    name: `command: ${command}`,
    concurrency: window * processes,
    evaluate(input: EvaluatorInput) {
      let best = channels[0]!;
      for (const c of channels) if (c.pending < best.pending) best = c;
      return best.send(input);
    },
    async close() {
      await Promise.all(channels.map((c) => c.close()));
    },
  };
}
