import { UsageError } from "../cli/usage-error.js";

/**
 * Parses a whole-number option value, refusing a blank, a fraction, a sign or anything else (Number("") is 0, so
 * a blank value is not read as zero).
 * @param command - the command named in the message, e.g. "fit".
 * @param flag - the option named in the message, e.g. "--restarts".
 * @param text - the value as given.
 * @param min - the least legal value.
 * @returns the number.
 * @throws UsageError naming the command, the flag and the value.
 */
export function parseWhole(command: string, flag: string, text: string, min: number): number {
  const n = /^\s*\d+\s*$/.test(text) ? Number(text) : NaN;
  if (!Number.isSafeInteger(n) || n < min) throw new UsageError(`${command}: ${flag} must be an integer ≥ ${min}, got ${text}`);
  return n;
}
