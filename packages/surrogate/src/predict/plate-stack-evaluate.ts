import type { InnerQuantity, PlateStackPayload, RuleSource } from "./plate-stack-payload.js";
import { INSET_INPUT, PLATE_STACK_QUANTITIES } from "./plate-stack-payload.js";
import type { StackLimit, StackRule } from "./plate-stack-rule.js";
import { coveredBaseArea, stackPlates, storeyInset, storeysAllowed } from "./plate-stack-rule.js";
import { minAffineAt } from "./min-affine-trend.js";

/** Mean and sd of one learned quantity for a batch of rows (sd all 0 when the inner model gives none). */
export interface InnerMoments {
  readonly mean: readonly number[];
  readonly sd: readonly number[];
}

/**
 * The sd an inner model's prediction carries for the draws: the latent sd of a GP (the geometry is a deterministic
 * function; the GP's noise term is a nugget), else the predictive sd, else none.
 * @param p - an inner model's prediction.
 */
export function latentSd(p: { readonly sd?: number[][]; readonly sdLatent?: number[][] }): number[][] | undefined {
  return p.sdLatent ?? p.sd;
}

/** Predicts one learned quantity: the quantity's name, its inner model and rows × that model's inputs. */
export type InnerPredict = (name: string, quantity: InnerQuantity, rows: number[][]) => InnerMoments;

/** Outputs the plate stack gives, in this order (a model's targets are a subset). */
export const PLATE_STACK_OUTPUTS = [
  "gfa",
  "floors",
  "height",
  "far",
  "coverage",
  "footprintArea",
  "openSpace",
  "lotArea",
  "buildableArea",
] as const;

/** The result of {@link evaluatePlateStack} for a batch. */
export interface PlateStackEvaluation {
  /** Point predictions, rows × PLATE_STACK_OUTPUTS. */
  readonly mean: number[][];
  /** Standard deviation over the draws, rows × PLATE_STACK_OUTPUTS (0 for inner models without uncertainty). */
  readonly sd: number[][];
  /** Per row: probability of each floor count 0..max over the draws. */
  readonly floorProbabilities: number[][];
  /** Per row: the reason the next floor was not built, from the inner means. */
  readonly limitedBy: StackLimit[];
  /** When asked for: per row, per draw, the outputs (rows × draws × PLATE_STACK_OUTPUTS). */
  readonly samples?: number[][][];
}

function ruleOf(values: Readonly<Record<string, RuleSource>>, col: ReadonlyMap<string, number>, row: readonly number[]): StackRule {
  const get = (slot: string, fallback: number | undefined): number | undefined => {
    const s = values[slot];
    if (s === undefined) return fallback;
    if ("value" in s) return s.value;
    const v = row[col.get(s.input)!]!;
    if (!("levels" in s)) return v;
    return s.levels[Math.min(s.levels.length - 1, Math.max(0, Math.round(v)))]!;
  };
  const start = get("skyPlaneStart", undefined);
  const ratio = get("skyPlaneRatio", undefined);
  return {
    floorHeight: get("floorHeight", undefined)!,
    maxHeight: get("maxHeight", undefined)!,
    maxFar: get("maxFar", Infinity)!,
    maxCoverage: get("maxCoverage", 1)!,
    minPlateWidth: get("minPlateWidth", 0)!,
    minPlateArea: get("minPlateArea", 0)!,
    ...(start !== undefined && ratio !== undefined ? { skyPlaneStart: start, skyPlaneRatio: ratio } : {}),
  };
}

function outputsOf(rule: StackRule, lot: number, buildable: number, r: ReturnType<typeof stackPlates>): number[] {
  return [
    r.gfa,
    r.floors,
    r.floors * rule.floorHeight,
    r.gfa / lot,
    r.footprintArea / lot,
    r.footprintArea,
    lot - r.footprintArea,
    lot,
    Math.max(0, buildable),
  ];
}

/**
 * Applies a plate stack to a batch of rows: maps each row onto its rule values, predicts the learned quantities
 * (once per row, and once per sky-plane storey for the cut plate), then applies the stacking rule exactly to the
 * inner means and to every draw (see PlateStackPayload). Shared by PlateStackSurrogate and the dependency-free
 * predictor, so both give the same numbers.
 * @param payload - the plate-stack payload.
 * @param inputs - the model's input names.
 * @param x - rows × inputs, original units.
 * @param predictInner - predicts one learned quantity's inner model (evaluatePlateStack adds its trend).
 * @param keepSamples - also return every draw's outputs (for Monte Carlo acquisition functions).
 * @returns point predictions, sd, floor-count probabilities and the limiting reason per row.
 */
export function evaluatePlateStack(
  payload: PlateStackPayload,
  inputs: readonly string[],
  x: readonly (readonly number[])[],
  predictInner: InnerPredict,
  keepSamples = false,
): PlateStackEvaluation {
  const col = new Map(inputs.map((name, j) => [name, j] as const));
  const q = payload.quantities;
  const rules = x.map((row) => ruleOf(payload.ruleValues, col, row));
  const geo = x.map((row) => payload.geometryInputs.map((name) => row[col.get(name)!]!));
  const withCoverage = x.map((row, i) =>
    payload.coverageInput === null ? geo[i]! : [...geo[i]!, row[col.get(payload.coverageInput)!]!],
  );
  // a quantity with a trend: the inner model predicts the remainder
  const predict = (name: string, quantity: InnerQuantity, rows: number[][]): InnerMoments => {
    const m = predictInner(name, quantity, rows);
    const trend = "trend" in quantity ? quantity.trend : undefined;
    return trend === undefined ? m : { mean: m.mean.map((v, r) => v + minAffineAt(trend, rows[r]!)), sd: m.sd };
  };
  const lot = predict("lotArea", q.lotArea, geo);
  const buildable = predict("buildableArea", q.buildableArea, geo);
  const baseWidth = q.baseWidth === undefined ? undefined : predict("baseWidth", q.baseWidth, withCoverage);
  // one cut row per (row, storey above the sky plane's start)
  const cutIndex: number[][] = [];
  const cutRows: number[][] = [];
  rules.forEach((rule, i) => {
    const idx: number[] = [];
    const top = storeysAllowed(rule);
    for (let k = 1; k <= top; k++) {
      const d = storeyInset(rule, k);
      idx.push(d > 0 ? cutRows.length : -1);
      if (d > 0) cutRows.push([...withCoverage[i]!, d]);
    }
    cutIndex.push(idx);
  });
  const needCut = cutRows.length > 0;
  if (needCut && q.cutArea === undefined) throw new RangeError(`plate stack: a row reaches the sky exposure plane but the model learned no cut plate (${INSET_INPUT})`);
  const cutArea = needCut ? predict("cutArea", q.cutArea!, cutRows) : undefined;
  const cutWidth = needCut && q.cutWidth !== undefined ? predict("cutWidth", q.cutWidth, cutRows) : undefined;
  const mean: number[][] = [];
  const sd: number[][] = [];
  const floorProbabilities: number[][] = [];
  const limitedBy: StackLimit[] = [];
  const kept: number[][][] = [];
  const draws = payload.draws;
  const z0 = PLATE_STACK_QUANTITIES.map(() => 0);
  const at = (m: InnerMoments | undefined, r: number, z: number): number => (m === undefined ? Infinity : m.mean[r]! + m.sd[r]! * z);
  const one = (i: number, z: readonly number[]): number[] => {
    const rule = rules[i]!;
    const lotArea = at(lot, i, z[0]!);
    const b = at(buildable, i, z[1]!);
    const base = coveredBaseArea(rule, lotArea, b);
    const w0 = at(baseWidth, i, z[2]!);
    const plateAt = (k: number): readonly [number, number] => {
      const c = cutIndex[i]![k - 1]!;
      if (c < 0) return [base, w0];
      return [Math.min(base, Math.max(0, at(cutArea, c, z[3]!))), at(cutWidth, c, z[4]!)];
    };
    const r = stackPlates(rule, lotArea, b, plateAt);
    if (z === z0) limitedBy.push(r.limitedBy);
    return outputsOf(rule, lotArea, b, r);
  };
  for (let i = 0; i < x.length; i++) {
    const plug = one(i, z0);
    const samples = draws.length === 0 ? [plug] : draws.map((z) => one(i, z));
    if (keepSamples) kept.push(samples);
    const avg = plug.map((_, j) => samples.reduce((s, v) => s + v[j]!, 0) / samples.length);
    const dev = plug.map((_, j) => Math.sqrt(samples.reduce((s, v) => s + (v[j]! - avg[j]!) ** 2, 0) / samples.length));
    mean.push(payload.pointMode === "expected" ? avg : plug);
    sd.push(dev);
    const counts: number[] = [];
    for (const v of samples) counts[v[1]!] = (counts[v[1]!] ?? 0) + 1;
    floorProbabilities.push(Array.from(counts, (c) => (c ?? 0) / samples.length));
  }
  return keepSamples ? { mean, sd, floorProbabilities, limitedBy, samples: kept } : { mean, sd, floorProbabilities, limitedBy };
}
