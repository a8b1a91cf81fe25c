import type { Writable, Readable } from "node:stream";
import type { ClaimedOutput } from "@floorcast/sampler";

/** The streams a command reads and writes; tests pass their own. */
export interface CommandContext {
  readonly stdin: Readable;
  readonly stdout: Writable;
  readonly stderr: Writable;
  /** Sets the exit status the process ends with (the largest status set wins). */
  setExitCode(code: number): void;
  /**
   * Claims a command's output files before any work (see claimOutput in @floorcast/sampler: folder writable,
   * not an input, an existing file only with `--force`, exclusive lock); the CLI releases every claim when
   * the command ends, so a failed command leaves no temporary file or lock and the previous files intact.
   * @param command - the command's name, for messages.
   * @param paths - the output files, in the order they are renamed into place.
   * @param options - `force` (the command's --force) and the files the command reads.
   */
  claimOutput(
    command: string,
    paths: string | readonly string[],
    options: { readonly force?: boolean; readonly inputs?: readonly (string | undefined)[] },
  ): Promise<ClaimedOutput>;
}
