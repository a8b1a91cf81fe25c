import { hostname } from "node:os";
import { readFile, rename, unlink, writeFile } from "node:fs/promises";

/** What a lock file records about the run holding it. */
interface LockHolder {
  readonly pid: number;
  readonly host: string;
}

/** The lock file that marks `path` as being written: `<path>.lock`. */
export function lockPathFor(path: string): string {
  return `${path}.lock`;
}

function parseHolder(text: string): LockHolder | undefined {
  try {
    const v = JSON.parse(text) as Partial<LockHolder>;
    return typeof v.pid === "number" && typeof v.host === "string" ? { pid: v.pid, host: v.host } : undefined;
  } catch {
    return undefined;
  }
}

/** Whether a process of this host is alive (signal 0 only checks; EPERM means it exists under another user). */
function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
}

/**
 * Takes the exclusive lock of an output: `<path>.lock` is created with O_EXCL (`wx`), so of two runs that
 * want the same output exactly one succeeds. A lock left by a run of this host that no longer exists
 * (killed, e.g. SIGKILL) is stale and taken over; a lock of another host (a shared file system) is never
 * guessed stale. Locks are advisory: they exclude floorcast runs, not other programs.
 * @param path - the output the lock guards.
 * @param fn - the caller's name, for the message.
 * @returns a function that releases the lock (removes the file if it is still this run's).
 * @throws RangeError naming the output and the holder when another live run holds the lock.
 */
export async function acquireOutputLock(path: string, fn: string): Promise<() => Promise<void>> {
  const lock = lockPathFor(path);
  const mine = `${JSON.stringify({ pid: process.pid, host: hostname() })}\n`;
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      await writeFile(lock, mine, { flag: "wx" });
      let released = false;
      return async () => {
        if (released) return;
        released = true;
        const now = await readFile(lock, "utf8").catch(() => undefined);
        if (now === mine) await unlink(lock).catch(() => undefined);
      };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== "EEXIST") throw error;
    }
    const text = await readFile(lock, "utf8").catch(() => undefined);
    if (text === undefined) continue; // released meanwhile: try again
    const holder = parseHolder(text);
    const stale = holder !== undefined && holder.host === hostname() && holder.pid !== process.pid && !alive(holder.pid);
    if (!stale || attempt > 0) {
      const who = holder ? `run ${holder.pid} on ${holder.host}` : "another run";
      throw new RangeError(
        `${fn}: ${path} is being written by ${who} (lock file ${lock}); wait for it, or remove the lock file if no run is writing`,
      );
    }
    // Move the stale lock aside under a name of our own, then check it was the stale one we read (not a fresh
    // lock another run took meanwhile, which is put back).
    const aside = `${lock}.stale-${process.pid}`;
    await rename(lock, aside).catch(() => undefined);
    const moved = await readFile(aside, "utf8").catch(() => undefined);
    if (moved !== undefined && moved !== text) await rename(aside, lock).catch(() => undefined);
    else await unlink(aside).catch(() => undefined);
  }
  throw new RangeError(`${fn}: ${path} is being written by another run (lock file ${lock})`);
}
