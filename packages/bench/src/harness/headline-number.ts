/**
 * The one precision rule of the headline table: three significant digits, trailing zeros kept
 * (0.630 beside 0.651), whole numbers of three or more digits in full (12960, not 1.30e4), and
 * exponent form below 0.001; shares are percentages by the same rule (0.0412 → "4.12%").
 * "—" for null, NaN and infinities.
 * @param v - the value.
 * @param percent - format a share as a percentage.
 * @returns the text.
 */
export function formatHeadlineNumber(v: number | null | undefined, percent = false): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  const x = percent ? v * 100 : v;
  const a = Math.abs(x);
  let text: string;
  if (a === 0) text = "0.00";
  else if (a >= 100) text = String(Math.round(x));
  else if (a < 1e-3) text = x.toExponential(2);
  else text = x.toPrecision(3);
  if (/^-0(\.0+)?$/.test(text)) text = text.slice(1);
  return percent ? `${text}%` : text;
}
