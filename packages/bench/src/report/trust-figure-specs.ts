import type { TopLevelSpec } from "vega-lite";
import type { TrustFigureData, TrustReport } from "@floorcast/surrogate";

/** One figure of the trust report: an id, a title, the Vega-Lite spec and what it means. */
export interface TrustFigureSpec {
  readonly id: "parity" | "residuals-by-input" | "residual-histogram" | "learning-curve" | "calibration-curve" | "error-by-regime";
  readonly title: string;
  readonly spec: TopLevelSpec;
  readonly caption: string;
}

/** At most this many points are drawn in the parity plot (every k-th row), to keep the page light. */
const MAX_POINTS = 4000;
/** At most this many points in all the residual panels together. */
const MAX_PANEL_POINTS = 16000;
const SCHEMA = "https://vega.github.io/schema/vega-lite/v6.json";
const POINT = { type: "circle", size: 14, opacity: 0.55, color: "#2b6cb0" } as const;

/**
 * The Vega-Lite specs of the trust report's figures: parity, residuals against each input, residual
 * histogram, and, when the report has them, learning curve, calibration curve and error by regime.
 * @param report - the trust report.
 * @param data - the test points behind it.
 * @returns the figure specs in page order.
 */
export function trustFigureSpecs(report: TrustReport, data: TrustFigureData): TrustFigureSpec[] {
  const n = data.yTrue.length;
  const stride = Math.max(1, Math.ceil(n / MAX_POINTS));
  const rows = everyKth(n, stride);
  const drawn = stride > 1 ? ` One test row in every ${stride} is drawn (${rows.length} of ${n}).` : "";
  const t = report.target;
  const lo = Math.min(...rows.map((i) => Math.min(data.yTrue[i]!, data.mean[i]!)));
  const hi = Math.max(...rows.map((i) => Math.max(data.yTrue[i]!, data.mean[i]!)));
  const figs: TrustFigureSpec[] = [];
  figs.push({
    id: "parity",
    title: "Parity: predicted against exact",
    spec: {
      $schema: SCHEMA,
      width: 420,
      height: 420,
      layer: [
        {
          data: { values: [{ a: lo, b: lo }, { a: hi, b: hi }] },
          mark: { type: "line", color: "#999", strokeDash: [4, 4] },
          encoding: { x: { field: "a", type: "quantitative" }, y: { field: "b", type: "quantitative" } },
        },
        {
          data: { values: rows.map((i) => ({ exact: data.yTrue[i], predicted: data.mean[i] })) },
          mark: POINT,
          encoding: {
            x: { field: "exact", type: "quantitative", title: `exact ${t}`, scale: { zero: false } },
            y: { field: "predicted", type: "quantitative", title: `predicted ${t}`, scale: { zero: false } },
          },
        },
      ],
    },
    caption: `Each dot is a test row: the exact ${t} across, the surrogate's prediction up. Dots on the dashed diagonal are exact predictions; the vertical distance from it is the error.${drawn}`,
  });
  const panelStride = Math.max(1, Math.ceil((n * data.inputs.length) / MAX_PANEL_POINTS));
  const panelRows = everyKth(n, panelStride);
  const panelDrawn = panelStride > 1 ? ` One test row in every ${panelStride} is drawn (${panelRows.length} of ${n}).` : "";
  const long = panelRows.flatMap((i) => data.inputs.map((name, j) => ({ input: name, value: data.x[i]![j], residual: data.mean[i]! - data.yTrue[i]! })));
  figs.push({
    id: "residuals-by-input",
    title: "Residuals against each input",
    spec: {
      $schema: SCHEMA,
      data: { values: long },
      facet: { field: "input", type: "nominal", title: null, sort: [...data.inputs] },
      columns: 3,
      spec: {
        width: 250,
        height: 170,
        layer: [
          { mark: { type: "rule", color: "#999" }, encoding: { y: { datum: 0 } } },
          {
            mark: { ...POINT, size: 10 },
            encoding: {
              x: { field: "value", type: "quantitative", title: null, scale: { zero: false } },
              y: { field: "residual", type: "quantitative", title: "predicted − exact" },
            },
          },
        ],
      },
      resolve: { scale: { x: "independent" } },
    },
    caption: `Residual (predicted − exact ${t}) of each test row against each input. A pattern (a slope, a fan, a band that leaves zero) shows where in the input space the surrogate is biased or less accurate; a patternless cloud around zero is what a good fit looks like.${panelDrawn}`,
  });
  figs.push({
    id: "residual-histogram",
    title: "Residual histogram",
    spec: {
      $schema: SCHEMA,
      width: 420,
      height: 220,
      data: { values: data.yTrue.map((y, i) => ({ residual: data.mean[i]! - y })) },
      mark: { type: "bar", color: "#2b6cb0" },
      encoding: {
        x: { field: "residual", type: "quantitative", bin: { maxbins: 40 }, title: `predicted − exact ${t}` },
        y: { aggregate: "count", type: "quantitative", title: "test rows" },
      },
    },
    caption: `How the errors are distributed over all ${n} test rows. A narrow peak at zero is good; a shifted peak is bias, long tails are rare large errors (see the maximum absolute error).`,
  });
  if (report.learningCurve) {
    const lc = report.learningCurve;
    const layers: object[] = [
      {
        data: { values: lc.points.map((p) => ({ size: p.size, rmse: p.rmse })) },
        mark: { type: "line", point: true, color: "#2b6cb0" },
        encoding: {
          x: { field: "size", type: "quantitative", scale: { type: "log" }, title: "training rows" },
          y: { field: "rmse", type: "quantitative", scale: { type: "log" }, title: `test RMSE of ${t}` },
        },
      },
    ];
    if (lc.powerLaw) {
      const pl = lc.powerLaw;
      const ends = [lc.points[0]!.size, lc.points[lc.points.length - 1]!.size];
      layers.push({
        data: { values: ends.map((s) => ({ size: s, fit: pl.coefficient * s ** pl.slope })) },
        mark: { type: "line", strokeDash: [5, 4], color: "#c05621" },
        encoding: { x: { field: "size", type: "quantitative" }, y: { field: "fit", type: "quantitative" } },
      });
    }
    figs.push({
      id: "learning-curve",
      title: "Learning curve",
      spec: { $schema: SCHEMA, width: 420, height: 260, layer: layers } as TopLevelSpec,
      caption: lc.powerLaw
        ? `Test RMSE against the number of training rows, on log-log axes, with the fitted power law RMSE ≈ ${lc.powerLaw.coefficient.toPrecision(3)}·n^${lc.powerLaw.slope.toFixed(2)} (dashed). The slope says what more samples buy: at slope −0.5, four times the data halves the error.`
        : "Test RMSE against the number of training rows, on log-log axes (too few points with non-zero error for a power-law fit).",
    });
  }
  if (report.calibration) {
    const c = report.calibration;
    figs.push({
      id: "calibration-curve",
      title: "Calibration curve",
      spec: {
        $schema: SCHEMA,
        width: 360,
        height: 360,
        layer: [
          {
            data: { values: [{ a: 0, b: 0 }, { a: 1, b: 1 }] },
            mark: { type: "line", color: "#999", strokeDash: [4, 4] },
            encoding: { x: { field: "a", type: "quantitative" }, y: { field: "b", type: "quantitative" } },
          },
          {
            data: { values: c.curve.map((e) => ({ nominal: e.nominal, empirical: e.empirical })) },
            mark: { type: "line", point: true, color: "#2b6cb0" },
            encoding: {
              x: { field: "nominal", type: "quantitative", title: "nominal coverage of the central interval", scale: { domain: [0, 1] } },
              y: { field: "empirical", type: "quantitative", title: "fraction of test rows inside", scale: { domain: [0, 1] } },
            },
          },
        ],
      },
      caption: "For each nominal probability p, the fraction of test rows whose exact value falls inside the model's central p-interval (mean ± z·sd). On the diagonal the uncertainty is honest; below it the model is over-confident (intervals too narrow), above it under-confident.",
    });
  }
  if (report.byRegime) {
    figs.push({
      id: "error-by-regime",
      title: `Error by ${report.byRegimeColumn}`,
      spec: {
        $schema: SCHEMA,
        width: 420,
        height: 220,
        data: { values: Object.entries(report.byRegime).map(([k, m]) => ({ regime: k, rmse: m.rmse, n: m.n })) },
        mark: { type: "bar", color: "#2b6cb0" },
        encoding: {
          x: { field: "regime", type: "nominal", title: report.byRegimeColumn, sort: null, axis: { labelAngle: 0 } },
          y: { field: "rmse", type: "quantitative", title: `test RMSE of ${t}` },
          tooltip: [{ field: "n", type: "quantitative" }],
        },
      },
      caption: `Test RMSE for each value of ${report.byRegimeColumn}. Surrogates tend to fail where the binding rule switches; a tall bar marks a regime to check with the exact evaluator.`,
    });
  }
  return figs;
}

/** Indices 0, k, 2k, … below n. */
function everyKth(n: number, k: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < n; i += k) out.push(i);
  return out;
}
