import type { z } from "zod";

/**
 * A problem file that cannot be used. The message names the file, the path inside it and the
 * problem, e.g. `core-gfa.json: variables[1].max: max must exceed min (3)`. The CLI prints it as a
 * usage error (exit 2).
 */
export class ProblemFileError extends RangeError {
  override readonly name = "ProblemFileError";

  /** @param file - the file's name; @param path - where in the file (empty for the whole file); @param problem - what is wrong. */
  constructor(
    readonly file: string,
    readonly path: string,
    readonly problem: string,
  ) {
    super(`${file}: ${path === "" ? "" : `${path}: `}${problem}`);
  }

  /** The first issue of a zod error as a ProblemFileError (paths written like `variables[1].max`). */
  static fromZod(file: string, error: z.ZodError): ProblemFileError {
    const issue = error.issues[0]!;
    const path = issue.path
      .map((p, i) => (typeof p === "number" ? `[${p}]` : `${i === 0 ? "" : "."}${String(p)}`))
      .join("");
    const more = error.issues.length > 1 ? ` (and ${error.issues.length - 1} more)` : "";
    return new ProblemFileError(file, path, `${issue.message}${more}`);
  }
}
