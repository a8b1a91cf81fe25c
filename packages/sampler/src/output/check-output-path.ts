import { accessSync, constants, realpathSync, statSync, type Stats } from "node:fs";
import { basename, dirname, resolve } from "node:path";

/** Options of {@link checkOutputPath}. */
export interface CheckOutputOptions {
  /** Replace an existing file (without it an existing output is refused). */
  readonly force?: boolean;
  /** Files the run reads: an output that is one of them (same path, link or hard link) is refused. */
  readonly inputs?: readonly string[];
  /** The caller's name, for messages (default "checkOutputPath"). */
  readonly fn?: string;
}

const statOrUndefined = (p: string): Stats | undefined => {
  try {
    return statSync(p);
  } catch {
    return undefined;
  }
};

/** The absolute path of `p` with its folder's links resolved (the file itself need not exist). */
function canonical(p: string): string {
  const abs = resolve(p);
  try {
    return realpathSync(abs);
  } catch {
    try {
      return resolve(realpathSync(dirname(abs)), basename(abs));
    } catch {
      return abs;
    }
  }
}

/**
 * Checks, before any work, that an output can be written and may be: its folder exists and is writable, the
 * output is not one of the run's inputs (compared after resolving links, and by device and inode), and an
 * existing output is a regular file and only replaced with `force`. Devices, pipes and folders are never
 * replaced (renaming over them would not write to them).
 * @param path - the output file.
 * @param options - force, the run's inputs, the caller's name.
 * @throws RangeError naming the output and the reason.
 */
export function checkOutputPath(path: string, options: CheckOutputOptions = {}): void {
  const fn = options.fn ?? "checkOutputPath";
  if (typeof path !== "string" || path === "") throw new TypeError(`${fn}: the output must be a non-empty path`);
  const dir = dirname(resolve(path));
  const dirStat = statOrUndefined(dir);
  if (dirStat === undefined) throw new RangeError(`${fn}: cannot write ${path}: the folder ${dirname(path)} does not exist`);
  if (!dirStat.isDirectory()) throw new RangeError(`${fn}: cannot write ${path}: ${dirname(path)} is not a folder`);
  try {
    accessSync(dir, constants.W_OK);
  } catch {
    throw new RangeError(`${fn}: cannot write ${path}: the folder ${dirname(path)} is not writable`);
  }
  const out = statOrUndefined(path);
  const target = canonical(path);
  for (const input of options.inputs ?? []) {
    const inStat = statOrUndefined(input);
    const sameFile = out !== undefined && inStat !== undefined && out.dev === inStat.dev && out.ino === inStat.ino;
    if (sameFile || canonical(input) === target) {
      throw new RangeError(`${fn}: the output ${path} is also an input (${input}); write to another file`);
    }
  }
  if (out === undefined) return;
  if (!out.isFile()) throw new RangeError(`${fn}: cannot write ${path}: it exists and is not a regular file`);
  if (options.force !== true) throw new RangeError(`${fn}: ${path} already exists; use --force (option force) to replace it`);
}
