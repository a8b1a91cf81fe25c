/**
 * A GitHub-flavoured Markdown table (pipes in cells escaped).
 * @param header - column titles.
 * @param rows - cells, one array per row.
 * @returns the table's lines joined with newlines (no trailing newline).
 */
export function markdownTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const cell = (s: string): string => s.replace(/\|/g, "\\|");
  return [`| ${header.map(cell).join(" | ")} |`, `| ${header.map(() => "---").join(" | ")} |`, ...rows.map((r) => `| ${r.map(cell).join(" | ")} |`)].join("\n");
}
