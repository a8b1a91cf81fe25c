import type { TrustReport } from "@floorcast/surrogate";
import { trustSummaryTables } from "./trust-summary-tables.js";

const cell = (s: string) => s.replace(/\|/g, "\\|").replace(/\n/g, " ");

/**
 * The trust report as Markdown: caution, the summary tables and the notes (figures are in the HTML page).
 * @param report - the trust report.
 * @returns Markdown text.
 */
export function renderTrustMarkdown(report: TrustReport): string {
  if (report?.kind !== "floorcast.trust-report") throw new TypeError("renderTrustMarkdown: report must be a floorcast trust report");
  const out: string[] = [
    `# Trust report: ${report.target} (${report.model.kind})`,
    "",
    `> **Caution.** ${report.caution}`,
    "",
    `Model: ${report.model.source ?? "(in memory)"} · test data: ${report.data.source ?? "(in memory)"} · ${report.data.n} rows. Figures: see report.html.`,
    "",
  ];
  for (const t of trustSummaryTables(report)) {
    out.push(`## ${t.title}`, "", t.lead, "", `| ${t.header.map(cell).join(" | ")} |`, `|${t.header.map(() => " --- ").join("|")}|`);
    for (const r of t.rows) out.push(`| ${r.map(cell).join(" | ")} |`);
    out.push("");
  }
  if (report.notes.length) out.push("## Notes", "", ...report.notes.map((n) => `- ${n}`), "");
  out.push(`_${report.caution}_`, "");
  return out.join("\n");
}
