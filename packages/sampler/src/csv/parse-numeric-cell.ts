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
  if (!DECIMAL.test(text)) return `${JSON.stringify(cell)} is not a number`;
  const value = Number(text);
  if (!Number.isFinite(value)) return `${JSON.stringify(cell)} is not a finite number`;
  return value;
}
