import type { Writable, Readable } from "node:stream";

/** The streams a command reads and writes; tests pass their own. */
export interface CommandContext {
  readonly stdin: Readable;
  readonly stdout: Writable;
  readonly stderr: Writable;
  /** Sets the exit status the process ends with (the largest status set wins). */
  setExitCode(code: number): void;
}
