/**
 * The headline table as plain aligned text for a terminal.
 * @param table - from {@link headlineTable}.
 */
export function formatTextTable(table: { header: readonly string[]; rows: readonly (readonly string[])[] }): string {
  const all = [table.header, ...table.rows];
  const widths = table.header.map((_, j) => Math.max(...all.map((r) => r[j]!.length)));
  const line = (r: readonly string[]): string => r.map((c, j) => (j < 2 ? c.padEnd(widths[j]!) : c.padStart(widths[j]!))).join("  ");
  return [line(table.header), widths.map((w) => "-".repeat(w)).join("  "), ...table.rows.map(line)].join("\n");
}
