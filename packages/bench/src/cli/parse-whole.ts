import { UsageError } from "./usage-error.js";

/**
 * Parses a whole-number option value for every command (the one integer parser of the CLI): digits only, blanks
 * around them allowed, so a sign, a fraction, an exponent or a blank is refused (Number("") is 0, so a blank value
 * is never read as zero).
 * @param command - the command named in the message, e.g. "fit".
 * @param flag - the option named in the message, e.g. "--restarts".
 * @param text - the value as given (a number is read as its decimal text).
 * @param min - the least legal value.
 * @param max - the greatest legal value (default: the largest safe integer).
 * @returns the number.
 * @throws UsageError `<command>: <flag> must be a whole number ≥ min (or in [min, max]), got "<text>"`.
 */
export function parseWhole(command: string, flag: string, text: string | number, min: number, max = Number.MAX_SAFE_INTEGER): number {
  const s = String(text);
  const n = /^\s*\d+\s*$/.test(s) ? Number(s) : Number.NaN;
  if (!Number.isSafeInteger(n) || n < min || n > max) {
    const range = max === Number.MAX_SAFE_INTEGER ? `≥ ${min}` : `in [${min}, ${max}]`;
    throw new UsageError(`${command}: ${flag} must be a whole number ${range}, got ${JSON.stringify(s)}`);
  }
  return n;
}
