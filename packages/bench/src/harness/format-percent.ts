/**
 * A share as a percentage with two decimals for report tables ("—" for null/NaN/±Infinity; a value
 * that rounds to zero prints "0.00%", never "-0.00%").
 * @param v - the share (0.05 = 5%).
 */
export function formatPercent(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  const text = (v * 100).toFixed(2);
  return `${text === "-0.00" ? "0.00" : text}%`;
}
