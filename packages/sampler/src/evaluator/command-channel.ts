import { spawn } from "node:child_process";
import { createInterface } from "node:readline";
import type { EvaluatorInput, EvaluatorOutput } from "./evaluator.js";
import { trackChildGroup } from "./child-group-tracker.js";

/** One running external program answering JSON Lines in order. */
export interface CommandChannel {
  /** Requests sent and not yet answered. */
  readonly pending: number;
  /** Sends one input line; resolves with the matching answer line. */
  send(input: EvaluatorInput): Promise<EvaluatorOutput>;
  /** Fails every unanswered request with `reason` and stops the program (SIGTERM, SIGKILL after the grace period). */
  stop(reason: Error): Promise<void>;
  /** Ends the program's stdin and waits for it to exit: at most `graceMs`, then it is stopped. */
  close(): Promise<void>;
}

/** Options of {@link openCommandChannel}. */
export interface CommandChannelOptions {
  /** Working directory (default the current one). */
  readonly cwd?: string | undefined;
  /** Longest wait for the next answer while requests are unanswered, in ms; 0 = no limit. */
  readonly timeoutMs: number;
  /** Time the program has to exit after end of input, and again after SIGTERM before SIGKILL, in ms (> 0). */
  readonly graceMs: number;
  /** Describes this copy in messages, e.g. "process 2 of 3". */
  readonly label: string;
  /** Called once when an answer timed out (after this channel's requests were failed), e.g. to stop the others. */
  readonly onTimeout?: ((error: Error) => void) | undefined;
}

interface Pending {
  readonly resolve: (o: EvaluatorOutput) => void;
  readonly reject: (e: Error) => void;
}

const sleep = (ms: number): Promise<"timeout"> =>
  new Promise((resolve) => {
    setTimeout(() => resolve("timeout"), ms);
  });

/**
 * Starts `command` through the system shell and pairs each line written to its stdin with the next line read
 * from its stdout (FIFO). On POSIX the program runs in its own process group, so stopping it also stops whatever
 * the shell started (common practice, the way shells signal a job).
 * @param fn - names the public function in messages.
 * @param command - the command line.
 * @param options - working directory, answer timeout, grace period, label, timeout callback.
 * @returns the channel.
 */
export function openCommandChannel(fn: string, command: string, options: CommandChannelOptions): CommandChannel {
  const group = process.platform !== "win32";
  const child = spawn(command, {
    shell: true,
    stdio: ["pipe", "pipe", "pipe"],
    detached: group,
    ...(options.cwd ? { cwd: options.cwd } : {}),
  });
  const untrack = trackChildGroup(child, group);
  const queue: Pending[] = [];
  const where = `${JSON.stringify(command)} (${options.label})`;
  let stderr = "";
  let failure: Error | undefined;
  let answered = 0;
  let timer: NodeJS.Timeout | undefined;
  let stopping: Promise<void> | undefined;
  let closed = false;
  const fail = (e: Error): void => {
    failure ??= e;
    if (timer !== undefined) clearTimeout(timer);
    for (const p of queue.splice(0)) p.reject(failure);
  };
  const signal = (sig: NodeJS.Signals): void => {
    try {
      if (group && child.pid !== undefined) process.kill(-child.pid, sig);
      else child.kill(sig);
    } catch {
      child.kill(sig); // the group is gone already (ESRCH): signal the shell itself, a no-op if it has exited
    }
  };
  const exited = new Promise<void>((resolve) => {
    child.on("close", (code, sig) => {
      closed = true;
      untrack();
      const tail = stderr.trim().split("\n").slice(-3).join(" | ");
      const status = code === null ? `signal ${sig}` : `status ${code}`;
      fail(new Error(`${fn}: ${JSON.stringify(command)} exited (${status}) after ${answered} answers${tail ? `: ${tail}` : ""}`));
      resolve();
    });
  });
  const waitExit = async (ms: number): Promise<boolean> => closed || (await Promise.race([exited, sleep(ms)])) !== "timeout";
  const stop = (reason: Error): Promise<void> => {
    fail(reason);
    stopping ??= (async () => {
      if (closed) return;
      signal("SIGTERM");
      if (await waitExit(options.graceMs)) return;
      signal("SIGKILL");
      if (await waitExit(options.graceMs)) return;
      // a descendant that left the group still holds a pipe: stop listening rather than wait for it
      child.stdout.destroy();
      child.stderr.destroy();
      untrack();
    })();
    return stopping;
  };
  const arm = (): void => {
    if (timer !== undefined) clearTimeout(timer);
    timer = undefined;
    if (options.timeoutMs === 0 || queue.length === 0 || failure !== undefined) return;
    timer = setTimeout(() => {
      const seconds = options.timeoutMs / 1000;
      const e = new Error(
        `${fn}: no answer to line ${answered + 1} within ${seconds} s from ${where}; the program was stopped ` +
          `(raise timeoutMs, CLI --evaluator-timeout SECONDS, 0 = no limit)`,
      );
      void stop(e);
      options.onTimeout?.(e);
    }, options.timeoutMs);
  };
  child.stderr.setEncoding("utf8");
  child.stderr.on("data", (s: string) => {
    stderr = (stderr + s).slice(-2000);
  });
  child.on("error", (e) => fail(new RangeError(`${fn}: cannot run ${JSON.stringify(command)}: ${e.message}`)));
  child.stdin.on("error", () => {
    // EPIPE when the program exits early: reported through its exit.
  });
  createInterface({ input: child.stdout }).on("line", (line) => {
    const p = queue.shift();
    answered += 1;
    arm();
    if (p === undefined) {
      if (failure === undefined) {
        fail(new Error(`${fn}: ${JSON.stringify(command)} wrote more answers than it was asked for (answer ${answered})`));
      }
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
        if (queue.length === 1) arm();
        child.stdin.write(`${JSON.stringify(input)}\n`);
      });
    },
    stop,
    async close() {
      child.stdin.end();
      if (stopping !== undefined) return stopping;
      if (await waitExit(options.graceMs)) return;
      const seconds = options.graceMs / 1000;
      await stop(new Error(`${fn}: ${where} did not exit within ${seconds} s of the end of its input; it was stopped`));
    },
  };
}
