import { createRequire } from "node:module";
import type { Writable } from "node:stream";
import type cliProgressModule from "cli-progress";

/** A progress display: a bar on a terminal, silent otherwise. */
export interface ProgressBar {
  /** Shows `done` of the total. */
  update(done: number): void;
  /** Removes the bar (or does nothing). */
  stop(): void;
}

/**
 * A cli-progress bar on `stream` when it is a TTY, else a silent stand-in (so logs and pipes stay clean).
 * cli-progress is loaded only when a bar is drawn, so importing the sampler loads no progress-bar package.
 * @param stream - where the bar is drawn (usually stderr).
 * @param total - the number of steps.
 * @param label - shown before the bar.
 * @param unit - what is counted (default "rows").
 * @returns the progress display.
 */
export function createProgressBar(stream: Writable, total: number, label: string, unit = "rows"): ProgressBar {
  if ((stream as Writable & { isTTY?: boolean }).isTTY !== true) return { update() {}, stop() {} };
  const cliProgress = createRequire(import.meta.url)("cli-progress") as typeof cliProgressModule;
  const bar = new cliProgress.SingleBar(
    { stream: stream as NodeJS.WriteStream, format: `${label} [{bar}] {value}/{total} ${unit}, eta {eta}s`, fps: 5 },
    cliProgress.Presets.shades_classic,
  );
  bar.start(total, 0);
  return {
    update: (done) => bar.update(done),
    stop: () => bar.stop(),
  };
}
