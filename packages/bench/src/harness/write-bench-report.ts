import { writeFile } from "node:fs/promises";
import { join } from "node:path";
import type { BenchReport } from "./bench-report-types.js";

/**
 * Writes report.json, report.md and report.html of a bench run into `out`. The renderers (and their chart
 * packages) are loaded here, on first use, so importing the harness loads no chart package.
 * @param report - the bench report.
 * @param out - the output directory (exists).
 * @returns the three paths.
 */
export async function writeBenchReport(report: BenchReport, out: string): Promise<{ json: string; markdown: string; html: string }> {
  const json = join(out, "report.json");
  const markdown = join(out, "report.md");
  const html = join(out, "report.html");
  const [{ renderBenchMarkdown }, { renderBenchHtml }] = await Promise.all([import("../report/bench-report-markdown.js"), import("../report/bench-report-html.js")]);
  await writeFile(json, `${JSON.stringify(report, null, 1)}\n`);
  await writeFile(markdown, renderBenchMarkdown(report));
  await writeFile(html, await renderBenchHtml(report));
  return { json, markdown, html };
}
