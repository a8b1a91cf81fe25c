import seedrandom from "seedrandom";
import { fitGaussianProcess } from "../gp/fit-gaussian-process.js";
import type { GaussianProcessOptions } from "../gp/gaussian-process-options.js";
import { MODEL_FILE_KIND, MODEL_FORMAT_VERSION } from "../model-file/model-file-version.js";
import { PLATE_STACK_OUTPUTS } from "../predict/plate-stack-evaluate.js";
import { PLATE_STACK_QUANTITIES } from "../predict/plate-stack-payload.js";
import { PLATE_STACK_RULE_NAME, stackPlates } from "../predict/plate-stack-rule.js";
import { shuffleInPlace } from "../seeded-shuffle.js";
import type { SurrogateTrainer, TrainingData } from "../surrogate-types.js";
import { innerTrainingSets, ruleOfRow, ruleSources, type PlateStackData } from "./plate-stack-training-rows.js";
import { PlateStackSurrogate, type FittedQuantity } from "./plate-stack-surrogate.js";
import { qmcNormalDraws } from "./qmc-normal-draws.js";
import { fitMinAffineTrend } from "./fit-min-affine-trend.js";
import { minAffineAt } from "../predict/min-affine-trend.js";
import { buildValidityDomain } from "../trust/validity-domain.js";

/** Options of {@link fitPlateStack}. */
export interface PlateStackOptions {
  /** Outputs to predict, a subset of PLATE_STACK_OUTPUTS (default all). */
  readonly targets?: readonly string[];
  /** Seed of every random choice (default 0). */
  readonly seed?: number;
  /** Fits one inner model (one target); default a GP (fitGaussianProcess with `gp`). An MLP gives no uncertainty. */
  readonly innerTrainer?: SurrogateTrainer;
  /** Options of the default inner GP (seed is set per quantity). */
  readonly gp?: GaussianProcessOptions;
  /** Quasi-Monte Carlo draws for the uncertainty and the "expected" point mode (default 64; 0: none). */
  readonly draws?: number;
  /** "expected" (default): the mean of the rule over the draws; "plugin": the rule applied to the inner means. */
  readonly pointMode?: "expected" | "plugin";
  /** At most this many storey rows train the cut-plate models (a seeded subset; default 800). */
  readonly maxCutRows?: number;
  /**
   * Trend of the plate widths (default "min-affine"): a least of affine pieces fitted first (fitMinAffineTrend),
   * the inner model learning the remainder; "none": the inner model learns the width itself.
   */
  readonly widthTrend?: "min-affine" | "none";
}

const FN = "fitPlateStack";

function checkData(data: PlateStackData): void {
  if (typeof data !== "object" || data === null || !Array.isArray(data.inputs) || !Array.isArray(data.x)) {
    throw new TypeError(`${FN}: data must be { inputs, x, columns }`);
  }
  if (data.x.length < 2) throw new RangeError(`${FN}: data.x must have at least 2 rows, got ${data.x.length}`);
  for (const [name, v] of Object.entries(data.columns)) {
    if (!Array.isArray(v) || v.length !== data.x.length || !v.every((a) => Number.isFinite(a))) {
      throw new RangeError(`${FN}: data.columns.${name} must hold one finite number per row`);
    }
  }
  for (const c of ["lotArea", "buildableArea", "plateArea_1", "plateWidth_1"]) {
    if (data.columns[c] === undefined) throw new RangeError(`${FN}: data.columns.${c} is missing (the evaluator must report the plate profile)`);
  }
}

function thin(set: TrainingData, max: number, seed: number): TrainingData {
  if (set.x.length <= max) return set;
  const idx = Array.from(set.x, (_, i) => i);
  shuffleInPlace(idx, seedrandom(`plate-stack-thin-${seed}`));
  const keep = idx.slice(0, max).sort((a, b) => a - b);
  return { ...set, x: keep.map((i) => set.x[i]!), y: keep.map((i) => set.y[i]!) };
}

async function fitQuantity(set: TrainingData, trainer: SurrogateTrainer, seed: number, trended = false): Promise<FittedQuantity | undefined> {
  if (set.x.length === 0) return undefined;
  const y = set.y.map((r) => r[0]!);
  const scale = Math.max(1, ...y.map(Math.abs));
  if (y.every((v) => Math.abs(v - y[0]!) <= 1e-12 * scale)) return { constant: y[0]! };
  if (set.inputs.length === 0) throw new RangeError(`${FN}: ${set.targets[0]} varies but no geometry input is left to learn it from`);
  if (!trended) return { model: await trainer(set, seed) };
  const trend = fitMinAffineTrend(set.x, y, { seed });
  const rest = set.y.map((r, i) => [r[0]! - minAffineAt(trend, set.x[i]!)]);
  return { model: await trainer({ ...set, y: rest }, seed), trend };
}

/**
 * Fits the structure-aware plate-stack surrogate: inner models (a GP by default) learn the smooth geometry from the
 * plate-profile columns — lot area and buildable area per design, the base plate's width, and the plate area and
 * width above the sky plane's start by inset distance (one row per storey) — while every input that only enters
 * the stacking arithmetic (floor height, height limit, FAR, plate minima, sky-plane start and ratio) stays out of
 * the learned models. Prediction applies the rule exactly (stackPlates). The training rows are checked first: the
 * rule applied to their own profiles must reproduce their gfa and floors columns when those are given.
 * Composite structure after Astudillo & Frazier (2019), "Bayesian optimization of composite functions", ICML.
 * @param data - inputs, rows and plate-profile columns (see plateStackColumns).
 * @param options - targets, seed, inner trainer, GP options, draws, point mode, cut-row cap.
 * @returns the fitted PlateStackSurrogate.
 * @throws TypeError / RangeError naming the field (missing profile columns, a rule value not tied to an input,
 *   a profile the rule does not reproduce).
 */
export async function fitPlateStack(data: PlateStackData, options: PlateStackOptions = {}): Promise<PlateStackSurrogate> {
  checkData(data);
  const seed = options.seed ?? 0;
  const targets = [...(options.targets ?? PLATE_STACK_OUTPUTS)];
  for (const t of targets) {
    if (!(PLATE_STACK_OUTPUTS as readonly string[]).includes(t)) {
      throw new RangeError(`${FN}: options.targets: ${t} is not an output of the plate stack (${PLATE_STACK_OUTPUTS.join(", ")})`);
    }
  }
  const drawCount = options.draws ?? 64;
  if (!Number.isInteger(drawCount) || drawCount < 0) throw new RangeError(`${FN}: options.draws must be an integer ≥ 0, got ${drawCount}`);
  const ruleValues = ruleSources(FN, data);
  const ruleInputs = new Set(Object.values(ruleValues).flatMap((s) => ("input" in s ? [s.input] : [])));
  const cov = ruleValues.maxCoverage;
  const coverageInput = cov !== undefined && "input" in cov ? cov.input : null;
  const geometryInputs = data.inputs.filter((name) => !ruleInputs.has(name));
  // exact outputs of the training rows, from their own profiles: the check and the envelope's output scaling
  const exact = data.x.map((_, i) => {
    const rule = ruleOfRow(data, i);
    const lot = data.columns.lotArea![i]!;
    const b = data.columns.buildableArea![i]!;
    const r = stackPlates(rule, lot, b, (k) => [data.columns[`plateArea_${k}`]?.[i] ?? 0, data.columns[`plateWidth_${k}`]?.[i] ?? 0]);
    const out = [r.gfa, r.floors, r.floors * rule.floorHeight, r.gfa / lot, r.footprintArea / lot, r.footprintArea, lot - r.footprintArea, lot, b];
    const gfa = data.columns.gfa?.[i];
    const floors = data.columns.floors?.[i];
    if ((gfa !== undefined && Math.abs(gfa - r.gfa) > 1e-6 * lot) || (floors !== undefined && floors !== r.floors)) {
      throw new RangeError(
        `${FN}: row ${i + 1}: the stacking rule gives gfa ${r.gfa} and ${r.floors} floors from the plate profile, the data ${gfa} and ${floors}; ` +
          "plate-stack applies only to evaluators that follow floorcast's massing rule",
      );
    }
    return out;
  });
  const sets = innerTrainingSets(data, geometryInputs, coverageInput);
  const width = ruleValues.minPlateWidth;
  const needWidth = width !== undefined && ("input" in width || width.value > 0);
  const trainer: SurrogateTrainer =
    options.innerTrainer ?? ((d, s) => Promise.resolve(fitGaussianProcess(d, { ...options.gp, seed: s })));
  const maxCut = options.maxCutRows ?? 800;
  const widthTrend = options.widthTrend ?? "min-affine";
  if (widthTrend !== "min-affine" && widthTrend !== "none") {
    throw new RangeError(`${FN}: options.widthTrend must be "min-affine" or "none", got ${String(widthTrend)}`);
  }
  const trended = widthTrend === "min-affine";
  const quantities: Record<string, FittedQuantity | undefined> = {
    lotArea: await fitQuantity(sets.lotArea, trainer, seed),
    buildableArea: await fitQuantity(sets.buildableArea, trainer, seed + 1),
    baseWidth: needWidth ? await fitQuantity(sets.baseWidth, trainer, seed + 2, trended) : undefined,
    cutArea: await fitQuantity(thin(sets.cutArea, maxCut, seed), trainer, seed + 3),
    cutWidth: needWidth ? await fitQuantity(thin(sets.cutWidth, maxCut, seed), trainer, seed + 4, trended) : undefined,
  };
  const uncertain = Object.values(quantities).some((q) => q !== undefined && "model" in q && q.model.kind === "gp");
  const draws = uncertain && drawCount > 0 ? qmcNormalDraws(drawCount, PLATE_STACK_QUANTITIES.length, seed) : [];
  const cols = targets.map((t) => (PLATE_STACK_OUTPUTS as readonly string[]).indexOf(t));
  const mean = cols.map((c) => exact.reduce((s, r) => s + r[c]!, 0) / exact.length);
  const std = cols.map((c, j) => Math.sqrt(exact.reduce((s, r) => s + (r[c]! - mean[j]!) ** 2, 0) / exact.length) || 1);
  const lower = data.inputs.map((_, j) => Math.min(...data.x.map((r) => r[j]!)));
  const upper = data.inputs.map((_, j) => Math.max(...data.x.map((r) => r[j]!)));
  return new PlateStackSurrogate({
    file: {
      kind: MODEL_FILE_KIND,
      formatVersion: MODEL_FORMAT_VERSION,
      modelType: "plate-stack",
      inputs: [...data.inputs],
      targets,
      inputScaling: { lower, upper },
      outputScaling: { mean, std },
      payload: {
        rule: PLATE_STACK_RULE_NAME,
        ruleValues,
        geometryInputs,
        coverageInput,
        draws,
        // without draws (an inner model with no sd, or draws: 0) the mean over draws is the plug-in value: say so
        pointMode: draws.length > 0 ? (options.pointMode ?? "expected") : "plugin",
      },
      training: {
        n: data.x.length,
        seed,
        domain: buildValidityDomain(data.inputs, data.x),
        innerRows: Object.fromEntries(Object.entries(sets).map(([k, s]) => [k, Math.min(s.x.length, k.startsWith("cut") ? maxCut : Infinity)])),
      },
    },
    quantities,
  });
}
