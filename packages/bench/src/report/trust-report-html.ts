import type { TrustFigureData, TrustReport } from "@floorcast/surrogate";
import { escapeHtml } from "./escape-html.js";
import { htmlTable } from "./html-table.js";
import { renderFigure } from "./render-figure.js";
import { renderPage, type PageSection } from "./render-page.js";
import { trustFigureSpecs } from "./trust-figure-specs.js";
import { trustSummaryTables } from "./trust-summary-tables.js";

/**
 * The trust report as a self-contained offline HTML page: the caution, summary tables, and the figures
 * (parity, residuals against each input, residual histogram, learning curve, calibration curve, error by
 * regime, as available) drawn by Vega-Lite to inline SVG, each with a sentence on what it means.
 * @param report - the trust report.
 * @param data - the test points behind it (from buildTrustReport).
 * @returns the HTML document.
 */
export async function renderTrustHtml(report: TrustReport, data: TrustFigureData): Promise<string> {
  if (report?.kind !== "floorcast.trust-report") throw new TypeError("renderTrustHtml: report must be a floorcast trust report");
  const sections: PageSection[] = trustSummaryTables(report).map((t) => ({
    title: t.title,
    html: `<p>${escapeHtml(t.lead)}</p>\n${htmlTable(t.header, t.rows)}`,
  }));
  const figures = trustFigureSpecs(report, data);
  const rendered = await Promise.all(figures.map((fig) => renderFigure(fig.spec, fig.caption)));
  sections.push({
    title: "Figures",
    html: figures.map((fig, i) => `<h3>${escapeHtml(fig.title)}</h3>\n${rendered[i]}`).join("\n"),
  });
  if (report.notes.length) {
    sections.push({ title: "Notes", html: `<ul>${report.notes.map((n) => `<li class="note">${escapeHtml(n)}</li>`).join("")}</ul>` });
  }
  return renderPage({
    title: `Trust report: ${report.target} (${report.model.kind})`,
    subtitle: `Model ${report.model.source ?? "(in memory)"} · test data ${report.data.source ?? "(in memory)"} · ${report.data.n} rows`,
    caution: report.caution,
    sections,
  });
}
