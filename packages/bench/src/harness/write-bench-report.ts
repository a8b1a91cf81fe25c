import { mkdir } from "node:fs/promises";
import { join } from "node:path";
import { claimOutput, type ClaimedOutput } from "@floorcast/sampler";
import type { BenchReport } from "./bench-report-types.js";

/** The three report files of a bench run in `out`. */
export function benchReportPaths(out: string): { json: string; markdown: string; html: string } {
  return { json: join(out, "report.json"), markdown: join(out, "report.md"), html: join(out, "report.html") };
}

/**
 * Writes report.json, report.md and report.html of a bench run into `out`, all three under temporary names,
 * then renamed together (see claimOutput): an existing report is kept unless `force`. The renderers (and
 * their chart packages) are loaded here, on first use, so importing the harness loads no chart package.
 * @param report - the bench report.
 * @param out - the output directory (created when missing).
 * @param claim - the outputs claimed at the start of the run (claimed here when not given, with `force`).
 * @param force - replace existing report files (only when `claim` is not given).
 * @returns the three paths.
 */
export async function writeBenchReport(
  report: BenchReport,
  out: string,
  claim?: ClaimedOutput,
  force = false,
): Promise<{ json: string; markdown: string; html: string }> {
  const paths = benchReportPaths(out);
  if (claim === undefined) {
    await mkdir(out, { recursive: true });
    claim = await claimOutput([paths.json, paths.markdown, paths.html], { fn: "writeBenchReport", force });
  }
  try {
    const [{ renderBenchMarkdown }, { renderBenchHtml }] = await Promise.all([import("../report/bench-report-markdown.js"), import("../report/bench-report-html.js")]);
    await claim.put(paths.json, `${JSON.stringify(report, null, 1)}\n`);
    await claim.put(paths.markdown, renderBenchMarkdown(report));
    await claim.put(paths.html, await renderBenchHtml(report));
    await claim.commit();
  } finally {
    await claim.release();
  }
  return paths;
}
