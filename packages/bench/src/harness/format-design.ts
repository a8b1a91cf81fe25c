/**
 * A design as text for people (reports, terminal): its JSON with every number rounded to 12
 * significant digits, so arithmetic noise such as 42.900000000000006 reads 42.9. Files keep the
 * exact values (report.json, optimum.json).
 * @param design - variable name → value.
 * @returns JSON text.
 */
export function formatDesign(design: Readonly<Record<string, unknown>>): string {
  return JSON.stringify(design, (_, v: unknown) => (typeof v === "number" && Number.isFinite(v) ? Number(v.toPrecision(12)) : v));
}
