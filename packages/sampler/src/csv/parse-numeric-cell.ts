/** Decimal literal: optional sign, digits with an optional fraction, optional exponent (common practice). */
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Parses one CSV cell as a finite decimal number, or returns the reason it is not one.
 * Surrounding spaces are ignored; hexadecimal, `NaN`, `Infinity` and empty cells are refused.
 * @param cell - the raw field text.
 * @returns the number, or a string describing the problem.
 */
export function parseNumericCell(cell: string): number | string {
  const text = cell.trim();
  if (text === "") return "is empty";
  if (!DECIMAL.test(text)) return `${quoteCell(cell)} is not a number`;
  const value = Number(text);
  if (!Number.isFinite(value)) return `${quoteCell(cell)} is not a finite number`;
  return value;
}

/** The cell quoted for a message, cut to its first 40 characters (a very long cell would flood the terminal). */
function quoteCell(cell: string): string {
  return cell.length > 40 ? `${JSON.stringify(cell.slice(0, 40))}… (${cell.length} characters)` : JSON.stringify(cell);
}
