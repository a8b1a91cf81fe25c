import type { RegressionMetrics, TrustReport } from "@floorcast/surrogate";
import { formatNumber as f } from "./format-number.js";

/** A titled table of the trust report with a sentence on how to read it. */
export interface SummaryTable {
  readonly title: string;
  readonly lead: string;
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
}

const METRIC_HEADER = ["n", "RMSE", "MAE", "max |error|", "R²", "bias", "median rel. error", "95th pct rel. error"];
const metricCells = (m: RegressionMetrics): string[] => [
  String(m.n),
  f(m.rmse),
  f(m.mae),
  f(m.maxAbsError),
  f(m.r2, 6),
  f(m.bias),
  f(m.medianRelError),
  f(m.p95RelError),
];

/**
 * The trust report's tables, shared by the Markdown and HTML renderers: test metrics, by regime,
 * cross-validation, calibration, domain of validity and diagnostics (sections absent from the report
 * are left out; the report's notes say why).
 * @param r - the trust report.
 * @returns the tables in page order.
 */
export function trustSummaryTables(r: TrustReport): SummaryTable[] {
  const t: SummaryTable[] = [];
  t.push({
    title: "Accuracy on the test set",
    lead: `Errors of ${r.target} in its own units on ${r.data.n} independent test rows. Relative errors are over the ${r.metrics.nRelative} rows with a non-zero target; "—" marks an undefined value (R² of a constant target).`,
    header: ["set", ...METRIC_HEADER],
    rows: [["test", ...metricCells(r.metrics)]],
  });
  if (r.byRegime) {
    t.push({
      title: `Accuracy by ${r.byRegimeColumn}`,
      lead: `The same metrics for each value of ${r.byRegimeColumn}. Large errors in one regime point to a rule switch the surrogate smooths over.`,
      header: [r.byRegimeColumn ?? "regime", ...METRIC_HEADER],
      rows: Object.entries(r.byRegime).map(([k, m]) => [k, ...metricCells(m)]),
    });
  }
  if (r.crossValidation) {
    const cv = r.crossValidation;
    t.push({
      title: "Cross-validation on the training data",
      lead: `${cv.method === "k-fold" ? `${cv.folds}-fold cross-validation (seed ${cv.seed})` : "Closed-form leave-one-out"}: each row predicted by a model that did not see it. Q² near 1 means the training data support the model; Q² far below the test R² hints at a lucky test set.`,
      header: ["method", ...METRIC_HEADER, "Q²"],
      rows: [[cv.method, ...metricCells(cv.metrics), f(cv.metrics.q2, 6)]],
    });
  }
  if (r.calibration) {
    const c = r.calibration;
    const z = c.standardisedResiduals;
    t.push({
      title: "Calibration of the predicted uncertainty",
      lead: "Fraction of test rows inside the model's central intervals (mean ± z·sd) against the nominal probability; a calibrated model matches them. Standardised residuals (y − mean)/sd should have mean 0 and sd 1. NLPD and CRPS: lower is better; CRPS is in the target's units.",
      header: ["quantity", "value"],
      rows: [
        ...c.coverage.map((e) => [`coverage of nominal ${Math.round(e.nominal * 100)}%`, `${(e.empirical * 100).toFixed(1)}%`]),
        ["standardised residual mean", f(z.mean)],
        ["standardised residual sd", f(z.sd)],
        ...z.quantiles.at.map((q, i) => [`standardised residual ${q * 100}% quantile (N(0,1): ${f(z.quantiles.gaussian[i]!)})`, f(z.quantiles.value[i]!)]),
        ["negative log predictive density (mean)", f(c.nlpd)],
        ["CRPS (mean)", f(c.crps)],
        ["mean predicted sd", f(c.meanSd)],
      ],
    });
  }
  if (r.intervalCoverage) {
    const c = r.intervalCoverage;
    t.push({
      title: "Coverage of the model's prediction intervals",
      lead: `The model states intervals (e.g. split-conformal) covering ${(c.nominal * 100).toFixed(0)}% of new rows; this is the fraction of test rows inside them, and their mean width in ${r.target}'s units.`,
      header: ["quantity", "value"],
      rows: [
        ["nominal coverage", `${(c.nominal * 100).toFixed(1)}%`],
        ["empirical coverage", `${(c.empirical * 100).toFixed(1)}%`],
        ["mean interval width", f(c.meanWidth)],
      ],
    });
  }
  if (r.learningCurve) {
    const lc = r.learningCurve;
    t.push({
      title: "Learning curve",
      lead: lc.powerLaw
        ? `Test error after training on nested random subsets (seed ${lc.seed}). Fitted RMSE ≈ ${f(lc.powerLaw.coefficient)}·n^${f(lc.powerLaw.slope)} (log-log R² ${f(lc.powerLaw.r2LogLog)}).`
        : `Test error after training on nested random subsets (seed ${lc.seed}).`,
      header: ["training rows", "RMSE", "MAE", "max |error|"],
      rows: lc.points.map((p) => [String(p.size), f(p.rmse), f(p.mae), f(p.maxAbsError)]),
    });
  }
  if (r.domain) {
    const d = r.domain;
    t.push({
      title: "Domain of validity",
      lead: `A test row is outside when an input leaves the training range or its nearest training row (inputs scaled to [0, 1] by the training range) is farther than ${f(d.nnThreshold)}, the ${d.percentile * 100}th percentile of the training rows' own nearest-neighbour distances. Predictions outside are extrapolations.`,
      header: ["quantity", "value"],
      rows: [
        ["test rows outside", `${d.nOutside} (${(d.fractionOutside * 100).toFixed(1)}%)`],
        ["RMSE inside / outside", `${f(d.metricsInside?.rmse)} / ${f(d.metricsOutside?.rmse)}`],
        ["max |error| inside / outside", `${f(d.metricsInside?.maxAbsError)} / ${f(d.metricsOutside?.maxAbsError)}`],
        ...r.model.inputs.map((name, j) => [`training range of ${name}`, `${f(d.lower[j])} … ${f(d.upper[j])}`]),
      ],
    });
  }
  const dg = r.diagnostics;
  const vals = (list: readonly { path: string; value: unknown }[]) =>
    list.length ? list.map((v) => `${typeof v.value === "number" ? f(v.value) : JSON.stringify(v.value)} (${v.path})`).join("; ") : "not recorded";
  t.push({
    title: "Diagnostics",
    lead: "What the fit recorded: hyperparameters stuck on a bound, jitter added to the kernel, its condition number, the early-stopping epoch, and the training design's spread (scaled inputs).",
    header: ["quantity", "value"],
    rows: [
      ["model type", dg.modelType ?? r.model.kind],
      ["training rows", dg.trainingRows === null ? "not recorded" : String(dg.trainingRows)],
      ["hyperparameters on bounds", vals(dg.hyperparametersOnBounds)],
      ["jitter", vals(dg.jitter)],
      ["condition number", vals(dg.conditionNumber)],
      ["early-stopping epoch", vals(dg.earlyStoppingEpoch)],
      ["design minimum distance", dg.design ? f(dg.design.minDistance) : "not computed"],
      ["design centred L2 discrepancy", dg.design ? f(dg.design.centredDiscrepancy) : "not computed"],
      ...dg.warnings.map((w) => ["warning", w]),
    ],
  });
  return t;
}
