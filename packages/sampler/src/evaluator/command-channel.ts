import { spawn } from "node:child_process";
import { createInterface } from "node:readline";
import type { EvaluatorInput, EvaluatorOutput } from "./evaluator.js";
import { trackChildGroup } from "./child-group-tracker.js";
import { EvaluatorProtocolError } from "./evaluator-protocol-error.js";

/** One running external program answering JSON Lines in order. */
export interface CommandChannel {
  /** Requests sent and not yet answered. */
  readonly pending: number;
  /** Sends one input line for `sample`; resolves with the matching answer line. */
  send(input: EvaluatorInput, sample: number): Promise<EvaluatorOutput>;
  /** Ends the program's stdin, waits for it to exit (as close) and rejects when it broke the protocol. */
  finish(): Promise<void>;
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
  /**
   * "ids" (default): each request carries `"sample": <id>` and each answer must echo it, in order.
   * "ordered": compatibility with programs that answer strictly in order without ids (requests carry no id);
   * the answer count is checked when the program closes.
   */
  readonly protocol?: "ids" | "ordered";
  /** Called once when an answer timed out (after this channel's requests were failed), e.g. to stop the others. */
  readonly onTimeout?: ((error: Error) => void) | undefined;
}

interface Pending {
  readonly sample: number;
  readonly resolve: (o: EvaluatorOutput) => void;
  readonly reject: (e: Error) => void;
}


/**
 * Starts `command` through the system shell and pairs each line written to its stdin with the next line read
 * from its stdout (FIFO). With the "ids" protocol each request line is the input object plus `"sample": id`,
 * and an answer whose `sample` is not the oldest unanswered id (missing, extra, duplicate or out of order)
 * fails the channel with an EvaluatorProtocolError naming the sample, before any answer is paired wrongly. On POSIX the program runs in its own process group, so stopping it also stops whatever
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
  const ordered = options.protocol === "ordered";
  let stderr = "";
  let failure: Error | undefined;
  let protocolFailure: EvaluatorProtocolError | undefined;
  let sent = 0;
  let answered = 0;
  let timer: NodeJS.Timeout | undefined;
  let stopping: Promise<void> | undefined;
  let closed = false;
  const fail = (e: Error): void => {
    if (e instanceof EvaluatorProtocolError && failure === undefined) protocolFailure = e;
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
      const waiting = queue[0] === undefined ? "" : `; sample ${queue[0].sample} unanswered`;
      fail(new Error(`${fn}: ${JSON.stringify(command)} exited (${status}) after ${answered} answers${waiting}${tail ? `: ${tail}` : ""}`));
      resolve();
    });
  });
  /** Waits at most `ms` for the program to exit; the timer is cleared when it exits first, so it never holds the process open. */
  const waitExit = async (ms: number): Promise<boolean> => {
    if (closed) return true;
    let t: NodeJS.Timeout | undefined;
    const limit = new Promise<"timeout">((resolve) => {
      t = setTimeout(() => resolve("timeout"), ms);
    });
    try {
      return (await Promise.race([exited, limit])) !== "timeout";
    } finally {
      clearTimeout(t);
    }
  };
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
        `${fn}: no answer for sample ${queue[0]?.sample} (line ${answered + 1}) within ${seconds} s from ${where}; the program was stopped ` +
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
  const violation = (message: string, sample: number | undefined): void =>
    void stop(new EvaluatorProtocolError(`${fn}: ${where}: ${message}`, sample, ordered));
  createInterface({ input: child.stdout }).on("line", (line) => {
    answered += 1;
    arm();
    if (failure !== undefined) return; // already failed: every pending sample was rejected
    const p = queue[0];
    let value: unknown;
    try {
      value = JSON.parse(line);
    } catch {
      violation(`answer ${answered}${p ? ` (for sample ${p.sample})` : ""} is not JSON: ${JSON.stringify(line.slice(0, 80))}`, p?.sample);
      return;
    }
    const id = typeof value === "object" && value !== null && !Array.isArray(value) ? (value as Record<string, unknown>)["sample"] : undefined;
    if (p === undefined) {
      violation(`wrote an answer nobody asked for (answer ${answered}${ordered ? "" : `, sample ${JSON.stringify(id)}`}): an extra or duplicate answer`, typeof id === "number" ? id : undefined);
      return;
    }
    if (typeof value !== "object" || value === null || Array.isArray(value)) {
      violation(`answer ${answered} (for sample ${p.sample}) must be a JSON object, got ${line.slice(0, 80)}`, p.sample);
      return;
    }
    let output = value as Record<string, unknown>;
    if (!ordered) {
      if (id === undefined) {
        violation(`answer ${answered} has no "sample" id; sample ${p.sample} was expected (programs that answer strictly in order without ids: the "ordered" protocol)`, p.sample);
        return;
      }
      if (id !== p.sample) {
        const later = queue.some((q) => q.sample === id);
        violation(
          later
            ? `the answer for sample ${JSON.stringify(id)} came before the answer for sample ${p.sample} (answers must come in the order asked: sample ${p.sample} is missing or late)`
            : `an answer for sample ${JSON.stringify(id)}, which was not asked for or was already answered, came while sample ${p.sample} was expected (an extra or duplicate answer)`,
          p.sample,
        );
        return;
      }
      output = { ...output };
      delete output["sample"];
    }
    queue.shift();
    p.resolve(output as EvaluatorOutput);
  });
  const close = async (): Promise<void> => {
    child.stdin.end();
    if (stopping !== undefined) return stopping;
    if (await waitExit(options.graceMs)) return;
    const seconds = options.graceMs / 1000;
    await stop(new Error(`${fn}: ${where} did not exit within ${seconds} s of the end of its input; it was stopped`));
  };
  return {
    get pending() {
      return queue.length;
    },
    send(input, sample) {
      if (failure !== undefined) return Promise.reject(failure);
      return new Promise<EvaluatorOutput>((resolve, reject) => {
        queue.push({ sample, resolve, reject });
        sent += 1;
        if (queue.length === 1) arm();
        child.stdin.write(`${JSON.stringify(ordered ? input : { ...input, sample })}\n`);
      });
    },
    stop,
    close,
    async finish() {
      await close();
      if (protocolFailure !== undefined) throw protocolFailure;
      if (ordered && answered !== sent) {
        throw new EvaluatorProtocolError(
          `${fn}: ${where} wrote ${answered} answer lines for ${sent} samples (in-order protocol): answers may belong to other samples`,
          undefined,
          true,
        );
      }
    },
  };
}
