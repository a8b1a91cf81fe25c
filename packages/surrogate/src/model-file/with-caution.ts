import { sealModelFile } from "./seal-model-file.js";

/**
 * A copy of a model file carrying `caution`, the text a user sees wherever the model's numbers are shown (the
 * CLI and the benchmark pass the one caution constant of `@floorcast/bench`; this package does not decide its
 * wording). It is placed after `formatVersion`; a file that carries a checksum is sealed again (sealModelFile),
 * so the checksum covers the caution. Loading accepts files with or without it (files written before it lack it).
 * @param file - a model file object (as a surrogate's toJSON builds it).
 * @param caution - the caution text: a non-empty string.
 * @returns the file with `caution`.
 * @throws TypeError for a file that is not an object or a caution that is not a string; RangeError for an empty caution.
 */
export function withCaution<T extends object>(file: T, caution: string): T & { caution: string } {
  if (typeof file !== "object" || file === null || Array.isArray(file)) throw new TypeError("withCaution: file must be a model file object");
  if (typeof caution !== "string") throw new TypeError(`withCaution: caution must be a string, got ${typeof caution}`);
  if (caution.trim() === "") throw new RangeError("withCaution: caution must not be empty");
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(file)) {
    if (k === "caution") continue;
    out[k] = v;
    if (k === "formatVersion") out.caution = caution;
  }
  if (!("caution" in out)) out.caution = caution;
  return ("checksum" in out ? sealModelFile(out) : out) as T & { caution: string };
}
