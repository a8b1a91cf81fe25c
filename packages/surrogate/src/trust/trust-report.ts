import type { Surrogate } from "../surrogate-types.js";
import { checkMatrix } from "../check-training-data.js";
import { checkDomain, domainOfModel } from "./check-domain.js";
import { checkVector } from "./check-vector.js";
import type { CrossValidatedMetrics, CrossValidationResult } from "./cross-validation.js";
import { gaussianCalibration, type GaussianCalibration } from "./gaussian-calibration.js";
import { intervalCoverage, type IntervalCoverage } from "./interval-coverage.js";
import type { LearningCurve } from "./learning-curve.js";
import { metricsByRegime } from "./metrics-by-regime.js";
import { collectDiagnostics, type TrustDiagnostics } from "./model-diagnostics.js";
import { regressionMetrics, type RegressionMetrics } from "./regression-metrics.js";
import { TRUST_REPORT_DEFAULT_CAUTION } from "./trust-report-caution.js";
import type { ValidityDomain } from "./validity-domain.js";

/** The trust report's JSON (kind "floorcast.trust-report", formatVersion 1). NaN values serialise as null. */
export interface TrustReport {
  readonly kind: "floorcast.trust-report";
  readonly formatVersion: 1;
  readonly caution: string;
  readonly model: { readonly kind: string; readonly inputs: readonly string[]; readonly targets: readonly string[]; readonly source: string | null };
  readonly target: string;
  readonly data: { readonly n: number; readonly source: string | null };
  /** Metrics on the independent test set. */
  readonly metrics: RegressionMetrics;
  /** Column the regimes come from, or null. */
  readonly byRegimeColumn: string | null;
  /** Metrics per regime value (each with its n), or null. */
  readonly byRegime: Readonly<Record<string, RegressionMetrics>> | null;
  /** Cross-validation on the training data, or null when not run. */
  readonly crossValidation: {
    readonly method: "k-fold" | "leave-one-out";
    readonly folds: number;
    readonly seed: number | null;
    readonly metrics: CrossValidatedMetrics;
  } | null;
  /** Calibration where the model gives an sd; null otherwise (see `notes`). */
  readonly calibration: GaussianCalibration | null;
  /** Coverage of the model's own prediction intervals (conformal wrappers), or null. */
  readonly intervalCoverage: IntervalCoverage | null;
  readonly learningCurve: LearningCurve | null;
  /** Domain of validity of the test rows, or null when no domain is known. */
  readonly domain: {
    readonly lower: readonly number[];
    readonly upper: readonly number[];
    readonly percentile: number;
    readonly nnThreshold: number;
    readonly nOutside: number;
    readonly fractionOutside: number;
    /** First 100 0-based test rows outside. */
    readonly outsideRows: readonly number[];
    readonly metricsInside: RegressionMetrics | null;
    readonly metricsOutside: RegressionMetrics | null;
  } | null;
  readonly diagnostics: TrustDiagnostics;
  /** Why a section is missing, and other remarks. */
  readonly notes: readonly string[];
}

/** Points behind the report's figures (not part of the JSON). */
export interface TrustFigureData {
  readonly inputs: readonly string[];
  readonly x: readonly (readonly number[])[];
  readonly yTrue: readonly number[];
  readonly mean: readonly number[];
  readonly sd: readonly number[] | null;
}

/** The remark every trust report ends its notes with. */
const SURROGATE_REMARK = "A surrogate approximates the exact floor-area rule; re-check any design you act on with the exact evaluator.";

/**
 * Builds the trust report of a surrogate on an independent test set: metrics, metrics by regime,
 * calibration (when the model gives sd), coverage of its own intervals (conformal), domain of validity, diagnostics, and the cross-validation and
 * learning curve when given.
 * @param args.model - the fitted surrogate.
 * @param args.target - target column assessed.
 * @param args.x - test inputs (rows × model inputs), finite.
 * @param args.y - true test values of the target.
 * @param args.groups - regime of each test row, with `groupColumn`.
 * @param args.crossValidation - a k-fold or LOO result on the training data.
 * @param args.learningCurve - a learning curve.
 * @param args.domain - validity domain; when absent, the model's own (if it carries one).
 * @param args.design - training design quality (min distance, centred discrepancy) for the diagnostics.
 * @param args.sources - file names for the record.
 * @param args.notes - the caller's remarks, placed first in `notes`.
 * @param args.caution - the caution the report carries (floorcast passes FLOORCAST_CAUTION of `@floorcast/sampler`);
 *   default TRUST_REPORT_DEFAULT_CAUTION, the same text.
 * @returns the report and the figure data.
 */
export function buildTrustReport(args: {
  model: Surrogate;
  target: string;
  x: readonly (readonly number[])[];
  y: readonly number[];
  groups?: readonly (string | number)[];
  groupColumn?: string;
  crossValidation?: CrossValidationResult | null;
  learningCurve?: LearningCurve | null;
  domain?: ValidityDomain | null;
  design?: { minDistance?: number | null; centredDiscrepancy?: number | null };
  sources?: { model?: string; data?: string };
  notes?: readonly string[];
  caution?: string;
}): { report: TrustReport; figures: TrustFigureData } {
  const fn = "buildTrustReport";
  const { model, target } = args;
  if (typeof model !== "object" || model === null || typeof model.predict !== "function") throw new TypeError(`${fn}: model must be a surrogate`);
  const j = model.targets.indexOf(target);
  if (j < 0) throw new RangeError(`${fn}: target "${target}" is not a target of the model (${model.targets.join(", ")})`);
  checkMatrix(fn, "x", args.x, model.inputs.length);
  const y = checkVector(fn, "y", args.y, args.x.length);
  if (y.length === 0) throw new RangeError(`${fn}: the test set must have at least one row`);
  const caution = args.caution ?? TRUST_REPORT_DEFAULT_CAUTION;
  if (typeof caution !== "string") throw new TypeError(`${fn}: caution must be a string`);
  if (caution.trim().length === 0) throw new RangeError(`${fn}: caution must not be empty`);
  const notes: string[] = [...(args.notes ?? [])];
  const pred = model.predict(args.x);
  const mean = pred.mean.map((r) => r[j]!);
  const bad = mean.findIndex((v) => !Number.isFinite(v));
  if (bad >= 0) throw new RangeError(`${fn}: the model predicted ${mean[bad]} for test row ${bad}`);
  let sd: number[] | null = pred.sd ? pred.sd.map((r) => r[j]!) : null;
  let calibration: GaussianCalibration | null = null;
  if (sd) {
    const nonPositive = sd.findIndex((v) => !(v > 0) || !Number.isFinite(v));
    if (nonPositive >= 0) {
      notes.push(`Calibration skipped: predicted sd is ${sd[nonPositive]} at test row ${nonPositive} (must be positive and finite).`);
      sd = null;
    } else calibration = gaussianCalibration(y, mean, sd);
  } else notes.push("Calibration skipped: the model gives no predictive uncertainty (sd).");
  const intervals = pred.interval
    ? intervalCoverage(y, pred.interval.lower.map((r) => r[j]!), pred.interval.upper.map((r) => r[j]!), pred.interval.coverage)
    : null;
  const metrics = regressionMetrics(y, mean);
  if (Number.isNaN(metrics.r2)) notes.push("R² is undefined (null) because the test target is constant.");
  let byRegime: Record<string, RegressionMetrics> | null = null;
  if (args.groups) byRegime = metricsByRegime(y, mean, args.groups);
  let crossValidation: TrustReport["crossValidation"] = null;
  if (args.crossValidation) {
    const m = args.crossValidation.perTarget[target];
    if (!m) throw new RangeError(`${fn}: crossValidation has no results for target "${target}"`);
    crossValidation = { method: args.crossValidation.method, folds: args.crossValidation.folds, seed: args.crossValidation.seed ?? null, metrics: m };
  }
  const dom = args.domain ?? safeModelDomain(model, notes);
  let domain: TrustReport["domain"] = null;
  if (dom) {
    const check = checkDomain(dom, args.x);
    const inside = check.rows.flatMap((r, i) => (r.inDomain ? [i] : []));
    const pick = (rows: number[]) => (rows.length ? regressionMetrics(rows.map((i) => y[i]!), rows.map((i) => mean[i]!)) : null);
    domain = {
      lower: dom.lower,
      upper: dom.upper,
      percentile: dom.percentile,
      nnThreshold: dom.nnThreshold,
      nOutside: check.outside.length,
      fractionOutside: check.outside.length / y.length,
      outsideRows: check.outside.slice(0, 100),
      metricsInside: pick(inside),
      metricsOutside: pick([...check.outside]),
    };
  } else notes.push("Domain of validity unknown: the model carries none and no training data was given.");
  notes.push(SURROGATE_REMARK);
  const report: TrustReport = {
    kind: "floorcast.trust-report",
    formatVersion: 1,
    caution,
    model: { kind: model.kind, inputs: [...model.inputs], targets: [...model.targets], source: args.sources?.model ?? null },
    target,
    data: { n: y.length, source: args.sources?.data ?? null },
    metrics,
    byRegimeColumn: args.groups ? (args.groupColumn ?? "group") : null,
    byRegime,
    crossValidation,
    calibration,
    intervalCoverage: intervals,
    learningCurve: args.learningCurve ?? null,
    domain,
    diagnostics: collectDiagnostics(model.toJSON(), args.design),
    notes,
  };
  return { report, figures: { inputs: [...model.inputs], x: args.x, yTrue: y, mean, sd } };
}

/** The model's own domain, or null with a note when it carries a malformed one. */
function safeModelDomain(model: Surrogate, notes: string[]): ValidityDomain | null {
  try {
    return domainOfModel(model);
  } catch (e) {
    notes.push(`Domain of validity unreadable: ${(e as Error).message}`);
    return null;
  }
}
