import { createHash } from "node:crypto";
import { canonicalJson } from "../predict/canonical-json.js";
import { CHECKSUM_PREFIX } from "../predict/check-model-checksum.js";

/**
 * SHA-256 of a string's UTF-8 bytes as hex, by node:crypto (FIPS 180-4).
 * @param text - the text to hash.
 * @returns 64 lower-case hex digits.
 */
export function nodeSha256Hex(text: string): string {
  return createHash("sha256").update(text, "utf8").digest("hex");
}

/**
 * Stores the payload checksum in a model file: the file is first reduced to plain JSON values (as
 * JSON.stringify writes them, so a non-finite diagnostic becomes null exactly as it will read back), then
 * `checksum` = "sha256:" + SHA-256 of its canonical JSON without the checksum field (see canonicalJson).
 * `loadSurrogate` and `loadPredictor` refuse a file whose contents no longer match it.
 * @param file - a model file object (as a surrogate's toJSON builds it).
 * @returns a new, JSON-plain copy carrying `checksum`.
 */
export function sealModelFile<T extends object>(file: T): T & { checksum: string } {
  const plain = JSON.parse(JSON.stringify({ ...file, checksum: undefined })) as Record<string, unknown>;
  plain.checksum = CHECKSUM_PREFIX + nodeSha256Hex(canonicalJson(plain, "sealModelFile", "checksum"));
  return plain as T & { checksum: string };
}
