import type { Writable } from "node:stream";
import cliProgress from "cli-progress";

/** A progress display: a bar on a terminal, silent otherwise. */
export interface ProgressBar {
  /** Shows `done` of the total. */
  update(done: number): void;
  /** Removes the bar (or does nothing). */
  stop(): void;
}

/**
 * A cli-progress bar on `stream` when it is a TTY, else a silent stand-in (so logs and pipes stay clean).
 * @param stream - where the bar is drawn (usually stderr).
 * @param total - the number of steps.
 * @param label - shown before the bar.
 * @returns the progress display.
 */
export function createProgressBar(stream: Writable, total: number, label: string): ProgressBar {
  if ((stream as Writable & { isTTY?: boolean }).isTTY !== true) return { update() {}, stop() {} };
  const bar = new cliProgress.SingleBar(
    { stream: stream as NodeJS.WriteStream, format: `${label} [{bar}] {value}/{total} rows, eta {eta}s`, fps: 5 },
    cliProgress.Presets.shades_classic,
  );
  bar.start(total, 0);
  return {
    update: (done) => bar.update(done),
    stop: () => bar.stop(),
  };
}
