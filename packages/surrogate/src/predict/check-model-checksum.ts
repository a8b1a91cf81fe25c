import { canonicalJson } from "./canonical-json.js";

/** The prefix of a model file's `checksum` field; the rest is 64 lower-case hex digits. */
export const CHECKSUM_PREFIX = "sha256:";

/**
 * Checks a model file's `checksum` field: "sha256:" + the SHA-256 of the canonical JSON (see canonicalJson)
 * of the whole file except the top-level `checksum` field. Files written before checksums were added carry
 * none: they are accepted and reported as "missing" (callers may warn). Either way, every key is walked and a
 * "__proto__" key is refused.
 * @param file - the parsed model file (a plain object).
 * @param hashHex - SHA-256 of a string's UTF-8 bytes as hex (node:crypto in the main entry, sha256Hex here).
 * @param fn - calling function named in messages.
 * @param fileName - named in messages.
 * @returns "verified" or "missing".
 * @throws RangeError when the field is malformed or does not match the contents.
 */
export function checkModelChecksum(
  file: Record<string, unknown>,
  hashHex: (text: string) => string,
  fn: string,
  fileName: string,
): "verified" | "missing" {
  const text = canonicalJson(file, `${fn}: ${fileName}`, "checksum");
  const stored = file.checksum;
  if (stored === undefined) return "missing";
  if (typeof stored !== "string" || !/^sha256:[0-9a-f]{64}$/.test(stored)) {
    throw new RangeError(`${fn}: ${fileName}: checksum must be "sha256:" and 64 lower-case hex digits, got ${JSON.stringify(stored)}`);
  }
  const actual = CHECKSUM_PREFIX + hashHex(text);
  if (actual !== stored) {
    throw new RangeError(
      `${fn}: ${fileName}: checksum does not match the contents (the file was edited or damaged after it was written); refit or restore the file`,
    );
  }
  return "verified";
}
