import type { TopLevelSpec } from "vega-lite";
import { chartSvg } from "./chart-svg.js";
import { escapeHtml } from "./escape-html.js";

/**
 * A figure for a report page: the chart drawn to inline SVG and a caption saying what it shows.
 * @param spec - Vega-Lite spec with inline data.
 * @param caption - one or two sentences on what the figure means (escaped).
 * @returns `<figure>` HTML with the SVG and a `<figcaption>`.
 */
export async function renderFigure(spec: TopLevelSpec, caption: string): Promise<string> {
  if (typeof caption !== "string" || caption.length === 0) throw new RangeError("renderFigure: caption must be a non-empty string");
  const svg = await chartSvg(spec);
  return `<figure>\n${svg}\n<figcaption>${escapeHtml(caption)}</figcaption>\n</figure>`;
}
