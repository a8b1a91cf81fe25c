import { describe, expect, it } from "vitest";
import {
  chartSvg,
  escapeHtml,
  formatNumber,
  htmlTable,
  renderFigure,
  renderPage,
  renderTrustHtml,
  renderTrustMarkdown,
  trustFigureSpecs,
} from "@floorcast/bench";
import { SAMPLE_FIGURES, sampleTrustReport } from "./report-fixture.js";

describe("chartSvg (Vega-Lite → Vega → SVG in Node)", () => {
  it("renders a scatter to SVG with one circle per data point", async () => {
    const svg = await chartSvg({
      data: { values: [{ a: 1, b: 2 }, { a: 2, b: 3 }, { a: 3, b: 1 }] },
      mark: "circle",
      encoding: { x: { field: "a", type: "quantitative" }, y: { field: "b", type: "quantitative" } },
    });
    expect(svg.startsWith("<svg")).toBe(true);
    // Vega labels each drawn symbol with aria-roledescription="circle" (one per datum).
    expect(svg.match(/aria-roledescription="circle"/g)).toHaveLength(3);
    expect(svg.match(/aria-roledescription="axis"/g)).toHaveLength(2);
  });
  it("refuses external data (nothing is fetched) and bad specs", async () => {
    await expect(chartSvg({ data: { url: "http://example.invalid/x.json" }, mark: "point" })).rejects.toThrow();
    await expect(chartSvg(null as never)).rejects.toThrow(TypeError);
  });
});

describe("page helpers", () => {
  it("escapeHtml escapes the five special characters", () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;");
    expect(escapeHtml(3)).toBe("3");
  });
  it("formatNumber: undefined metrics as —, infinities, digits", () => {
    expect(formatNumber(NaN)).toBe("—");
    expect(formatNumber(null)).toBe("—");
    expect(formatNumber(Infinity)).toBe("∞");
    expect(formatNumber(-Infinity)).toBe("−∞");
    expect(formatNumber(0.999993, 6)).toBe("0.999993");
    expect(formatNumber(0.999993)).toBe("1");
    expect(formatNumber(1234.5678)).toBe("1235");
    expect(formatNumber(2.5e-7)).toBe("2.500e-7");
    expect(formatNumber(12)).toBe("12");
  });
  it("htmlTable and renderPage escape user text, carry the caution and forbid fetching", () => {
    const t = htmlTable(["a<b"], [["<script>"]]);
    expect(t).toContain("&lt;script&gt;");
    expect(t).not.toContain("<script>");
    const page = renderPage({ title: "T <x>", caution: "not a zoning determination", sections: [{ title: "S&P", html: t }] });
    expect(page).toContain("<title>T &lt;x&gt;</title>");
    expect(page).toContain("S&amp;P");
    expect(page).toMatch(/Content-Security-Policy" content="default-src 'none'/);
    expect(page.match(/not a zoning determination/g)).toHaveLength(2);
    expect(page).not.toMatch(/<script|<link|src="http/);
    expect(() => renderPage({ title: "x", caution: "", sections: [] })).toThrow(RangeError);
    expect(() => renderPage({ title: 1 as never, caution: "c", sections: [] })).toThrow(TypeError);
  });
  it("renderFigure wraps an SVG with its caption", async () => {
    const html = await renderFigure({ data: { values: [{ a: 1 }] }, mark: "bar", encoding: { x: { field: "a", type: "quantitative" } } }, "What it <means>.");
    expect(html).toMatch(/^<figure>\n<svg[\s\S]*<\/svg>\n<figcaption>What it &lt;means&gt;.<\/figcaption>\n<\/figure>$/);
    await expect(renderFigure({ mark: "bar" }, "")).rejects.toThrow(RangeError);
  });
});

describe("trust report rendering", () => {
  const { report, figures } = sampleTrustReport();

  it("has one figure spec per available section, each with a caption", () => {
    const specs = trustFigureSpecs(report, figures);
    expect(specs.map((s) => s.id)).toEqual(["parity", "residuals-by-input", "residual-histogram", "learning-curve", "calibration-curve", "error-by-regime"]);
    for (const s of specs) expect(s.caption.length).toBeGreaterThan(40);
    const bare = trustFigureSpecs({ ...report, learningCurve: null, calibration: null, byRegime: null, byRegimeColumn: null }, figures);
    expect(bare.map((s) => s.id)).toEqual(["parity", "residuals-by-input", "residual-histogram"]);
  });

  it("Markdown carries the caution, the metrics and the regimes", () => {
    const md = renderTrustMarkdown(report);
    expect(md).toMatch(/^# Trust report: gfa \(toy\)/);
    expect(md).toMatch(/not a zoning determination/);
    expect(md).toContain("## Accuracy by limitedBy");
    expect(md).toContain(`| test | 120 | ${formatNumber(report.metrics.rmse)} |`);
    expect(md).toMatch(/\| far \| \d+ \|/);
    expect(md).toContain("## Calibration of the predicted uncertainty");
    expect(md).toContain("## Domain of validity");
    expect(() => renderTrustMarkdown({} as never)).toThrow(TypeError);
  });

  it("HTML page: every figure as inline SVG with a caption, the caution visible, nothing external", async () => {
    const html = await renderTrustHtml(report, figures);
    expect(html.match(/<figure>/g)).toHaveLength(SAMPLE_FIGURES);
    expect(html.match(/<figcaption>/g)).toHaveLength(SAMPLE_FIGURES);
    expect(html.match(/<svg /g)).toHaveLength(SAMPLE_FIGURES);
    expect(html).toContain("skew &lt;b&gt;");
    expect(html).not.toContain("skew <b>");
    expect(html).toMatch(/class="caution"[^>]*><strong>Caution.<\/strong>[^<]*not a zoning determination/);
    expect(html).not.toMatch(/<script|<link|<img|@import|url\(/);
  });
});

describe("trustFigureSpecs thinning of large test sets", () => {
  it("draws at most 4,000 parity points and 16,000 residual-panel points, and says so in the caption", () => {
    const { report } = sampleTrustReport();
    const n = 9001;
    const x = Array.from({ length: n }, (_, i) => [i, i % 7, i % 3]);
    const specs = trustFigureSpecs(report, { inputs: ["a", "b", "c"], x, yTrue: x.map((r) => r[0]!), mean: x.map((r) => r[0]! + 1), sd: null });
    const parity = specs.find((s) => s.id === "parity")!;
    const pts = ((parity.spec as { layer: { data: { values: unknown[] } }[] }).layer[1]!.data.values).length;
    expect(pts).toBe(Math.ceil(n / 3)); // stride ⌈9001/4000⌉ = 3 (derived)
    expect(parity.caption).toMatch(/One test row in every 3 is drawn \(3001 of 9001\)/);
    const panels = specs.find((s) => s.id === "residuals-by-input")!;
    const long = (panels.spec as { data: { values: unknown[] } }).data.values.length;
    expect(long).toBe(3 * Math.ceil(n / 2)); // stride ⌈9001·3/16000⌉ = 2 (derived)
    expect(long).toBeLessThanOrEqual(16_000);
    const hist = specs.find((s) => s.id === "residual-histogram")!;
    expect((hist.spec as { data: { values: unknown[] } }).data.values).toHaveLength(n); // binned, so all rows
  });
});
