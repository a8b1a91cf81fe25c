/** Width of a terminal the headline must fit. */
export const TERMINAL_COLUMNS = 100;

/** Splits text into lines of at most `width` characters at spaces (a longer word keeps its own line). */
function wrap(text: string, width: number): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(" ")) {
    if (line !== "" && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else line = line === "" ? word : `${line} ${word}`;
  }
  if (line !== "") lines.push(line);
  return lines;
}

/**
 * The headline table as plain aligned text for a terminal: the caption, the table (first two
 * columns left-aligned and followed by two spaces, the rest right-aligned one space apart) and the
 * notes, the caption and notes wrapped at {@link TERMINAL_COLUMNS}.
 * @param table - from {@link headlineTable}.
 */
export function formatTextTable(table: {
  readonly caption?: string;
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
  readonly notes?: readonly string[];
}): string {
  const all = [table.header, ...table.rows];
  const widths = table.header.map((_, j) => Math.max(...all.map((r) => r[j]!.length)));
  // Two spaces after the two text columns, one between the right-aligned number columns.
  const join = (cells: readonly string[]): string => cells.map((c, j) => (j === 0 ? c : `${j <= 2 ? "  " : " "}${c}`)).join("");
  const line = (r: readonly string[]): string => join(r.map((c, j) => (j < 2 ? c.padEnd(widths[j]!) : c.padStart(widths[j]!))));
  return [
    ...(table.caption ? [...wrap(table.caption, TERMINAL_COLUMNS), ""] : []),
    line(table.header),
    join(widths.map((w) => "-".repeat(w))),
    ...table.rows.map(line),
    ...(table.notes && table.notes.length > 0 ? ["", ...table.notes.flatMap((n) => wrap(n, TERMINAL_COLUMNS))] : []),
  ].join("\n");
}
