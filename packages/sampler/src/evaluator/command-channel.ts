import { spawn } from "node:child_process";
import { createInterface } from "node:readline";
import type { EvaluatorInput, EvaluatorOutput } from "./evaluator.js";

/** One running external program answering JSON Lines in order. */
export interface CommandChannel {
  /** Requests sent and not yet answered. */
  readonly pending: number;
  /** Sends one input line; resolves with the matching answer line. */
  send(input: EvaluatorInput): Promise<EvaluatorOutput>;
  /** Ends the program's stdin and waits for it to exit. */
  close(): Promise<void>;
}

interface Pending {
  readonly resolve: (o: EvaluatorOutput) => void;
  readonly reject: (e: Error) => void;
}

/**
 * Starts `command` through the system shell and pairs each line written to its stdin with the next line read
 * from its stdout (FIFO).
 * @param fn - names the public function in messages.
 * @param command - the command line.
 * @param cwd - working directory (default the current one).
 * @returns the channel.
 */
export function openCommandChannel(fn: string, command: string, cwd?: string): CommandChannel {
  const child = spawn(command, { shell: true, stdio: ["pipe", "pipe", "pipe"], ...(cwd ? { cwd } : {}) });
  const queue: Pending[] = [];
  let stderr = "";
  let failure: Error | undefined;
  let answered = 0;
  const fail = (e: Error): void => {
    failure ??= e;
    for (const p of queue.splice(0)) p.reject(failure);
  };
  child.stderr.setEncoding("utf8");
  child.stderr.on("data", (s: string) => {
    stderr = (stderr + s).slice(-2000);
  });
  child.on("error", (e) => fail(new RangeError(`${fn}: cannot run ${JSON.stringify(command)}: ${e.message}`)));
  child.stdin.on("error", () => {
    // EPIPE when the program exits early: reported through its exit.
  });
  const exited = new Promise<void>((resolve) => {
    child.on("close", (code) => {
      const tail = stderr.trim().split("\n").slice(-3).join(" | ");
      fail(new Error(`${fn}: ${JSON.stringify(command)} exited (status ${code}) after ${answered} answers${tail ? `: ${tail}` : ""}`));
      resolve();
    });
  });
  createInterface({ input: child.stdout }).on("line", (line) => {
    const p = queue.shift();
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
    get pending() {
      return queue.length;
    },
    send(input) {
      if (failure !== undefined) return Promise.reject(failure);
      return new Promise<EvaluatorOutput>((resolve, reject) => {
        queue.push({ resolve, reject });
        child.stdin.write(`${JSON.stringify(input)}\n`);
      });
    },
    async close() {
      child.stdin.end();
      await exited;
    },
  };
}
