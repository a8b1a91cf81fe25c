import { createHash } from "node:crypto";
import { open, rename, rm, writeFile } from "node:fs/promises";
import { dirname, resolve } from "node:path";
import { checkOutputPath, type CheckOutputOptions } from "./check-output-path.js";
import { acquireOutputLock } from "./output-lock.js";

/** Size and SHA-256 (FIPS 180-4) of the bytes written to an output. */
export interface OutputDigest {
  readonly bytes: number;
  readonly sha256: string;
}

/** Options of {@link claimOutput}. */
export interface ClaimOutputOptions extends CheckOutputOptions {
  /** Keep unfinished temporary files when the claim is released without commit (a dataset's resume). */
  readonly keepTemporary?: boolean;
}

/** Outputs claimed by one run: checked, locked, written under temporary names and renamed together. */
export interface ClaimedOutput {
  /** The final paths, in commit order. */
  readonly paths: readonly string[];
  /** The temporary name of a claimed path (`<path>.partial`, same folder); stream into it, then commit. */
  temporary(path: string): string;
  /** Writes the whole contents of a claimed path to its temporary file. */
  put(path: string, contents: string | Uint8Array): Promise<void>;
  /** Flushes a claimed path's temporary file to disk (fsync) and returns the size and hash of its bytes. */
  seal(path: string): Promise<OutputDigest>;
  /** Seals every path not yet sealed, renames each temporary file to its final name, releases the lock. */
  commit(): Promise<ReadonlyMap<string, OutputDigest>>;
  /** Without commit: removes the temporary files (unless keepTemporary) and releases the lock. Idempotent. */
  release(): Promise<void>;
}

/** fsync of a folder, so a rename in it survives a crash (refused on some systems: then skipped). */
async function syncFolder(dir: string): Promise<void> {
  try {
    const fh = await open(dir, "r");
    try {
      await fh.sync();
    } finally {
      await fh.close();
    }
  } catch {
    // folders cannot be opened or synced everywhere; the rename is still atomic
  }
}

/**
 * Claims the outputs of a run before any work. Each path is checked ({@link checkOutputPath}: folder
 * writable, not an input, an existing file only with `force`), then the first path's exclusive lock
 * (`<path>.lock`, see acquireOutputLock) is taken so a second run writing the same outputs is refused. The
 * run writes each output under `<path>.partial` in the same folder; `commit` fsyncs it, hashes the bytes on
 * disk through the open file, and renames it to the final name, so the final name never holds a partial or
 * failed result and a previous file survives any failure. Always `release` in a `finally`.
 * @param paths - the outputs (e.g. a CSV and its manifest), in the order they are renamed.
 * @param options - force, inputs, caller's name, keepTemporary.
 * @returns the claim.
 * @throws RangeError when an output is refused or another run holds its lock.
 */
export async function claimOutput(paths: string | readonly string[], options: ClaimOutputOptions = {}): Promise<ClaimedOutput> {
  const fn = options.fn ?? "claimOutput";
  const list = typeof paths === "string" ? [paths] : [...paths];
  if (list.length === 0) throw new RangeError(`${fn}: no output given`);
  for (const p of list) checkOutputPath(p, { ...options, fn });
  const unlock = await acquireOutputLock(list[0]!, fn);
  const temps = new Map(list.map((p) => [resolve(p), `${p}.partial`]));
  const digests = new Map<string, OutputDigest>();
  let finished = false;
  const temporary = (path: string): string => {
    const t = temps.get(resolve(path));
    if (t === undefined) throw new RangeError(`${fn}: ${path} is not one of the claimed outputs`);
    return t;
  };
  const seal = async (path: string): Promise<OutputDigest> => {
    const done = digests.get(resolve(path));
    if (done) return done;
    const fh = await open(temporary(path), "r+");
    try {
      await fh.sync();
      const hash = createHash("sha256");
      const buf = Buffer.alloc(1 << 20);
      let bytes = 0;
      for (;;) {
        const { bytesRead } = await fh.read(buf, 0, buf.length, bytes);
        if (bytesRead === 0) break;
        hash.update(buf.subarray(0, bytesRead));
        bytes += bytesRead;
      }
      const digest = { bytes, sha256: hash.digest("hex") };
      digests.set(resolve(path), digest);
      return digest;
    } finally {
      await fh.close();
    }
  };
  const release = async (): Promise<void> => {
    if (!finished) {
      finished = true;
      if (options.keepTemporary !== true) await Promise.all([...temps.values()].map((t) => rm(t, { force: true })));
    }
    await unlock();
  };
  return {
    paths: list,
    temporary,
    async put(path, contents) {
      digests.delete(resolve(path));
      await writeFile(temporary(path), contents);
    },
    seal,
    async commit() {
      if (finished) throw new RangeError(`${fn}: the outputs were already committed or released`);
      try {
        const out = new Map<string, OutputDigest>();
        for (const p of list) out.set(p, await seal(p));
        for (const p of list) await rename(temporary(p), p);
        for (const d of new Set(list.map((p) => dirname(resolve(p))))) await syncFolder(d);
        finished = true;
        return out;
      } finally {
        await release();
      }
    },
    release,
  };
}
