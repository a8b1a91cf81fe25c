import { writeFile } from "node:fs/promises";
import { join } from "node:path";
import type { BenchReport } from "./bench-report-types.js";
import { renderBenchHtml } from "./bench-report-html.js";
import { renderBenchMarkdown } from "./bench-report-markdown.js";

/**
 * Writes report.json, report.md and report.html of a bench run into `out`.
 * @param report - the bench report.
 * @param out - the output directory (exists).
 * @returns the three paths.
 */
export async function writeBenchReport(report: BenchReport, out: string): Promise<{ json: string; markdown: string; html: string }> {
  const json = join(out, "report.json");
  const markdown = join(out, "report.md");
  const html = join(out, "report.html");
  await writeFile(json, `${JSON.stringify(report, null, 1)}\n`);
  await writeFile(markdown, renderBenchMarkdown(report));
  await writeFile(html, await renderBenchHtml(report));
  return { json, markdown, html };
}
