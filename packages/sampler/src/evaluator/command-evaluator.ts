import type { BatchContext, Evaluator, EvaluatorInput } from "./evaluator.js";
import { openCommandChannel } from "./command-channel.js";

const MAX_TIMER_MS = 2_147_483_647;

/** Options of {@link commandEvaluator}. */
export interface CommandEvaluatorOptions {
  /** Inputs in flight per process (default 64): each program sees a stream, not one request at a time. */
  readonly window?: number;
  /** Copies of the program run side by side, a pool of processes for a slow model (default 1). */
  readonly processes?: number;
  /** Working directory of the program. */
  readonly cwd?: string;
  /**
   * Longest wait for the next answer while samples are unanswered, in ms (default 300 000 = 5 minutes; 0 = no
   * limit). Measured from the later of the sample's sending and the previous answer, so a full window of slow
   * but steady answers does not count against it. When it passes, every program is stopped and the evaluation fails.
   */
  readonly timeoutMs?: number;
  /**
   * Time a program has to exit after the end of its input, and again after SIGTERM before SIGKILL, in ms
   * (default: the smaller of 5 000 and timeoutMs, 5 000 when timeoutMs is 0).
   */
  readonly graceMs?: number;
  /**
   * "ids" (default): each request line carries `"sample": <id>`, and the program must answer in the order asked,
   * each answer echoing its `sample`. "ordered": compatibility mode for programs that answer strictly in order
   * without ids; the number of answers is checked when the program closes (finish).
   */
  readonly protocol?: "ids" | "ordered";
}

/**
 * Runs an external program and streams samples to it as JSON Lines (one JSON object per line on its stdin, with
 * the sample's id as `"sample"`); it must answer each line, in order, with one JSON object of outputs per line on
 * its stdout that echoes the same `"sample"` (README "Evaluator protocol"). A missing, extra, duplicate or
 * out-of-order answer fails the evaluation with an EvaluatorProtocolError naming the sample. So a user's own,
 * slower procedural model can be sampled like the built-in rule. With `processes: N`, N copies run side by side
 * and each sample goes to the copy with the fewest unanswered lines; the dataset generator still writes the
 * answers in design order, so the output does not depend on N.
 * @param command - a command line, run by the system shell (e.g. `python3 my_model.py`).
 * A program that does not answer within `timeoutMs` is stopped, with all its copies: SIGTERM to its process
 * group, SIGKILL after `graceMs` (common practice for stopping a job), and the evaluation fails naming the line,
 * the copy and the limit.
 * @param options - window per process, number of processes, working directory, answer timeout, grace period.
 * @returns the evaluator; `close` ends the programs' stdin and waits for them to exit, at most `graceMs`, then
 *   stops them as above, so it always returns.
 * @throws TypeError/RangeError for a bad command or option; evaluations reject when an answer is not a JSON object,
 *   a program exits early (its exit status and the end of its stderr are quoted) or an answer times out.
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
  const timeoutMs = options.timeoutMs ?? 300_000;
  if (typeof timeoutMs !== "number") throw new TypeError(`${fn}: timeoutMs must be a number, got ${typeof timeoutMs}`);
  // Node timers hold at most 2^31 − 1 ms (about 24.8 days)
  if (!(timeoutMs >= 0 && timeoutMs <= MAX_TIMER_MS)) {
    throw new RangeError(`${fn}: timeoutMs must be in [0, ${MAX_TIMER_MS}] ms (0 = no limit), got ${timeoutMs}`);
  }
  const graceMs = options.graceMs ?? (timeoutMs === 0 ? 5_000 : Math.min(5_000, timeoutMs));
  if (typeof graceMs !== "number") throw new TypeError(`${fn}: graceMs must be a number, got ${typeof graceMs}`);
  if (!(graceMs > 0 && graceMs <= MAX_TIMER_MS)) {
    throw new RangeError(`${fn}: graceMs must be in (0, ${MAX_TIMER_MS}] ms, got ${graceMs}`);
  }
  const protocol = options.protocol ?? "ids";
  if (protocol !== "ids" && protocol !== "ordered") throw new RangeError(`${fn}: protocol must be "ids" or "ordered", got ${JSON.stringify(protocol)}`);
  const stopOthers = (e: Error): void => {
    for (const c of channels) void c.stop(e);
  };
  const channels = Array.from({ length: processes }, (_, k) =>
    openCommandChannel(fn, command, {
      cwd: options.cwd,
      timeoutMs,
      graceMs,
      label: `process ${k + 1} of ${processes}`,
      protocol,
      onTimeout: stopOthers,
    }),
  );
  let unnamed = 0; // ids for evaluations called without a context (direct library use)
  return {
    name: protocol === "ids" ? `command: ${command}` : `command (ordered): ${command}`,
    concurrency: window * processes,
    evaluate(batch: readonly EvaluatorInput[], context?: BatchContext) {
      const ids = context?.samples;
      if (ids !== undefined && ids.length !== batch.length) {
        throw new RangeError(`${fn}: context.samples must give one id per input (${batch.length}), got ${ids.length}`);
      }
      return Promise.all(
        batch.map((input, i) => {
          let best = channels[0]!;
          for (const c of channels) if (c.pending < best.pending) best = c;
          return best.send(input, ids?.[i] ?? unnamed++);
        }),
      );
    },
    async finish() {
      const results = await Promise.allSettled(channels.map((c) => c.finish()));
      const bad = results.find((r): r is PromiseRejectedResult => r.status === "rejected");
      if (bad) throw bad.reason;
    },
    async close() {
      await Promise.all(channels.map((c) => c.close()));
    },
  };
}
