/**
 * Formats a metric for a report: `digits` significant digits (default 4), exponent form for very
 * large/small magnitudes, "—" for null/NaN (undefined metrics), "∞"/"−∞" for infinities.
 * @param v - the value.
 * @param digits - significant digits, 1…17 (use 6 for R²-like values near 1).
 * @returns the text.
 */
export function formatNumber(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || Number.isNaN(v)) return "—";
  if (v === Infinity) return "∞";
  if (v === -Infinity) return "−∞";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (Number.isInteger(v) && a < 1e9) return String(v);
  if (a >= 1e6 || a < 1e-3) return v.toExponential(digits - 1);
  return String(Number(v.toPrecision(digits)));
}
