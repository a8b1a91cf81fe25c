// @floorcast/bench/report: report rendering, bench and trust (self-contained pages, Vega-Lite charts to SVG).
export { chartSvg } from "./chart-svg.js";
export { escapeHtml } from "./escape-html.js";
export { formatNumber } from "./format-number.js";
export { htmlTable } from "./html-table.js";
export { renderFigure } from "./render-figure.js";
export { renderPage } from "./render-page.js";
export type { PageSection } from "./render-page.js";
export { trustFigureSpecs } from "./trust-figure-specs.js";
export type { TrustFigureSpec } from "./trust-figure-specs.js";
export { trustSummaryTables } from "./trust-summary-tables.js";
export type { SummaryTable } from "./trust-summary-tables.js";
export { renderTrustMarkdown } from "./trust-report-markdown.js";
export { renderTrustHtml } from "./trust-report-html.js";
export { renderBenchMarkdown } from "./bench-report-markdown.js";
export { renderBenchHtml } from "./bench-report-html.js";
export { massingDrawingSpec } from "./massing-drawing-spec.js";
