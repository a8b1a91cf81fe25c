import { spawn } from "node:child_process";
import { createInterface } from "node:readline";
import type { Evaluator, EvaluatorInput, EvaluatorOutput } from "./evaluator.js";

/** Options of {@link commandEvaluator}. */
export interface CommandEvaluatorOptions {
  /** Inputs written ahead of the answers read (default 64): the program sees a stream, not one request at a time. */
  readonly window?: number;
  /** Working directory of the program. */
  readonly cwd?: string;
}

interface Pending {
  readonly resolve: (o: EvaluatorOutput) => void;
  readonly reject: (e: Error) => void;
}

/**
 * Runs an external program once and streams samples to it as JSON Lines (one JSON object per line on its
 * stdin); it must answer each line, in order, with one JSON object of outputs per line on its stdout. So a
 * user's own, slower procedural model can be sampled like the built-in rule.
 * @param command - a command line, run by the system shell (e.g. `python3 my_model.py`).
 * @param options - window of inputs in flight and working directory.
 * @returns the evaluator; `close` ends the program's stdin and waits for it to exit.
 * @throws TypeError for a bad command; evaluations reject when an answer is not a JSON object or the program exits
 *   early (its exit status and the end of its stderr are quoted).
 */
export function commandEvaluator(command: string, options: CommandEvaluatorOptions = {}): Evaluator {
  const fn = "commandEvaluator";
  if (typeof command !== "string" || command.trim() === "") throw new TypeError(`${fn}: command must be a non-empty string`);
  const window = options.window ?? 64;
  if (!Number.isInteger(window) || window < 1) throw new RangeError(`${fn}: window must be an integer ≥ 1, got ${window}`);
  const child = spawn(command, { shell: true, stdio: ["pipe", "pipe", "pipe"], ...(options.cwd ? { cwd: options.cwd } : {}) });
  const pending: Pending[] = [];
  let stderr = "";
  let failure: Error | undefined;
  let answered = 0;
  const fail = (e: Error): void => {
    failure ??= e;
    for (const p of pending.splice(0)) p.reject(failure);
  };
  child.stderr.setEncoding("utf8");
  child.stderr.on("data", (s: string) => {
    stderr = (stderr + s).slice(-2000);
  });
  child.on("error", (e) => fail(new RangeError(`${fn}: cannot run ${JSON.stringify(command)}: ${e.message}`)));
  child.stdin.on("error", () => {
    // EPIPE when the program exits early: reported through its exit.
  });
  const exited = new Promise<number | null>((resolve) => {
    child.on("close", (code) => {
      if (pending.length > 0) {
        const tail = stderr.trim().split("\n").slice(-3).join(" | ");
        fail(new Error(`${fn}: ${JSON.stringify(command)} exited (status ${code}) after ${answered} answers${tail ? `: ${tail}` : ""}`));
      }
      resolve(code);
    });
  });
  const lines = createInterface({ input: child.stdout });
  lines.on("line", (line) => {
    const p = pending.shift();
    answered += 1;
    if (p === undefined) {
      fail(new Error(`${fn}: ${JSON.stringify(command)} wrote more answers than it was asked for (answer ${answered})`));
      return;
    }
    let value: unknown;
    try {
      value = JSON.parse(line);
    } catch {
      p.reject(new Error(`${fn}: answer ${answered} is not JSON: ${JSON.stringify(line.slice(0, 80))}`));
      return;
    }
    if (typeof value !== "object" || value === null || Array.isArray(value)) {
      p.reject(new Error(`${fn}: answer ${answered} must be a JSON object, got ${line.slice(0, 80)}`));
      return;
    }
    p.resolve(value as EvaluatorOutput);
  });
  return {
    name: `command: ${command}`,
    concurrency: window,
    evaluate(input: EvaluatorInput) {
      if (failure !== undefined) return Promise.reject(failure);
      return new Promise<EvaluatorOutput>((resolve, reject) => {
        pending.push({ resolve, reject });
        child.stdin.write(`${JSON.stringify(input)}\n`);
      });
    },
    async close() {
      child.stdin.end();
      await exited;
    },
  };
}
