import { escapeHtml } from "./escape-html.js";

/**
 * A simple HTML table; every cell is escaped.
 * @param header - column headings.
 * @param rows - cells (strings or numbers, formatted by the caller).
 * @returns `<table>` HTML.
 */
export function htmlTable(header: readonly string[], rows: readonly (readonly (string | number)[])[]): string {
  const head = `<tr>${header.map((h) => `<th>${escapeHtml(h)}</th>`).join("")}</tr>`;
  const body = rows.map((r) => `<tr>${r.map((c) => `<td>${escapeHtml(c)}</td>`).join("")}</tr>`).join("\n");
  return `<table>\n<thead>${head}</thead>\n<tbody>\n${body}\n</tbody>\n</table>`;
}
