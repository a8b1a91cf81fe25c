import type { Writable } from "node:stream";
import { createRequire } from "node:module";
import type cliProgressModule from "cli-progress";

/** Progress of a bench run on a terminal. */
export interface BenchProgress {
  /** A problem starts (or is skipped as already finished). */
  problem(name: string, state: "start" | "skip" | "done", index: number, total: number): void;
  /** A step within the current problem: label, trials done, trials planned. */
  step(label: string, done: number, total: number): void;
  stop(): void;
}

/**
 * Progress for `floorcast bench` and `floorcast demo`: a cli-progress bar of the current problem's
 * trials on a TTY, plain one-line messages otherwise (logs, pipes, tests).
 * @param stream - where to write (the command's stderr).
 */
export function benchProgress(stream: Writable): BenchProgress {
  const tty = (stream as Writable & { isTTY?: boolean }).isTTY === true;
  const t0 = performance.now();
  const elapsed = (): string => `${((performance.now() - t0) / 1000).toFixed(1)}s`;
  let bar: cliProgressModule.SingleBar | null = null;
  let current = "";
  return {
    problem(name, state, index, total) {
      bar?.stop();
      bar = null;
      current = name;
      const what = state === "skip" ? "already finished, reusing its results" : state === "start" ? "starting" : "finished";
      stream.write(`[${elapsed()}] problem ${index + 1}/${total} ${name}: ${what}\n`);
    },
    step(label, done, total) {
      if (tty) {
        if (!bar) {
          // loaded only when a bar is drawn: importing the harness loads no progress-bar package
          const cliProgress = createRequire(import.meta.url)("cli-progress") as typeof cliProgressModule;
          bar = new cliProgress.SingleBar(
            { stream: stream as NodeJS.WriteStream, format: `  ${current} [{bar}] {value}/{total} trials · {step}`, fps: 5, clearOnComplete: true },
            cliProgress.Presets.shades_classic,
          );
          bar.start(total, done, { step: label });
        }
        bar.update(done, { step: label });
      } else {
        stream.write(`[${elapsed()}]   ${current}: ${label} (${done}/${total} trials)\n`);
      }
    },
    stop() {
      bar?.stop();
      bar = null;
    },
  };
}
