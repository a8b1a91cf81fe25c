/** A value a CSV writer accepts. */
export type CsvValue = number | string | boolean;

/**
 * Formats one value for a CSV cell, deterministically: numbers by their shortest round-trip text (`String(x)`,
 * ECMAScript Number::toString, which `Number` parses back to the same double), booleans as `true`/`false`,
 * strings unchanged (quoting is the CSV writer's job).
 * @param value - the value.
 * @param where - names the cell in error messages.
 * @returns the cell text.
 * @throws RangeError for NaN or ±Infinity; TypeError for any other type.
 */
export function formatCsvValue(value: CsvValue, where = "value"): string {
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new RangeError(`formatCsvValue: ${where} must be finite, got ${value}`);
    return String(value);
  }
  if (typeof value === "string") return value;
  if (typeof value === "boolean") return value ? "true" : "false";
  throw new TypeError(`formatCsvValue: ${where} must be a number, string or boolean, got ${typeof value}`);
}
