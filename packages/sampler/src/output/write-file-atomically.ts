import { open, rename, rm } from "node:fs/promises";

/**
 * Replaces a file all at once: the contents go to `<path>.partial` in the same folder, are flushed to disk
 * (fsync) and renamed over `path`, so a reader sees the old file or the new one, never a part. For files a
 * run owns and refreshes itself (caches); outputs a user names go through claimOutput, which also checks
 * and locks them.
 * @param path - the file to replace.
 * @param contents - the whole new contents.
 */
export async function writeFileAtomically(path: string, contents: string | Uint8Array): Promise<void> {
  const temp = `${path}.partial`;
  try {
    const fh = await open(temp, "w");
    try {
      await fh.writeFile(contents);
      await fh.sync();
    } finally {
      await fh.close();
    }
    await rename(temp, path);
  } catch (error) {
    await rm(temp, { force: true });
    throw error;
  }
}
