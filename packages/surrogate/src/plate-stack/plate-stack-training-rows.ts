import type { RuleSource } from "../predict/plate-stack-payload.js";
import { INSET_INPUT } from "../predict/plate-stack-payload.js";
import type { StackRule } from "../predict/plate-stack-rule.js";
import { storeyInset, storeysAllowed } from "../predict/plate-stack-rule.js";
import type { TrainingData } from "../surrogate-types.js";

/** Training rows of a plate stack: a design's sampled inputs and its plate-profile columns. */
export interface PlateStackData {
  /** The model's input columns (the sampled parameters). */
  readonly inputs: readonly string[];
  /** rows × inputs. */
  readonly x: readonly (readonly number[])[];
  /** Plate-profile columns by name (lotArea, buildableArea, rule_<slot>, plateArea_k, plateWidth_k), one value per row. */
  readonly columns: Readonly<Record<string, readonly number[]>>;
}

const SLOTS = ["floorHeight", "maxHeight", "maxFar", "maxCoverage", "minPlateWidth", "minPlateArea", "skyPlaneStart", "skyPlaneRatio"];

/**
 * The plate-profile columns a dataset must have for the plate-stack family, and which of them its header lacks.
 * @param header - the dataset's columns.
 * @returns columns to read (present ones) and the missing required ones.
 */
export function plateStackColumns(header: readonly string[]): { columns: string[]; missing: string[] } {
  const has = new Set(header);
  const required = ["lotArea", "buildableArea", "rule_floorHeight", "rule_maxHeight", "plateArea_1", "plateWidth_1"];
  const missing = required.filter((c) => !has.has(c));
  let k = 0;
  while (has.has(`plateArea_${k + 1}`) && has.has(`plateWidth_${k + 1}`)) k++;
  const columns = [
    "lotArea",
    "buildableArea",
    ...SLOTS.map((s) => `rule_${s}`).filter((c) => has.has(c)),
    ...Array.from({ length: k }, (_, i) => [`plateArea_${i + 1}`, `plateWidth_${i + 1}`]).flat(),
  ].filter((c) => has.has(c));
  return { columns, missing };
}

/** Where each rule value comes from, found from the data: constant → value; equal to an input column → input. */
export function ruleSources(fn: string, data: PlateStackData): Record<string, RuleSource> {
  const out: Record<string, RuleSource> = {};
  for (const slot of SLOTS) {
    const v = data.columns[`rule_${slot}`];
    if (v === undefined) continue;
    if (v.every((a) => a === v[0])) {
      out[slot] = { value: v[0]! };
      continue;
    }
    const j = data.inputs.findIndex((_, c) => data.x.every((row, i) => row[c] === v[i]));
    if (j >= 0) {
      out[slot] = { input: data.inputs[j]! };
      continue;
    }
    const coded = levelCoded(data, v);
    if (coded === undefined) {
      throw new RangeError(`${fn}: rule_${slot} varies between rows but equals no input column; add its column to the inputs`);
    }
    out[slot] = coded;
  }
  if (out.floorHeight === undefined || out.maxHeight === undefined) {
    throw new RangeError(`${fn}: the data must give rule_floorHeight and rule_maxHeight`);
  }
  return out;
}

/** An input holding level indices 0..L−1 that maps one to one onto the rule values (a categorical variable). */
function levelCoded(data: PlateStackData, v: readonly number[]): RuleSource | undefined {
  for (let c = 0; c < data.inputs.length; c++) {
    const levels: number[] = [];
    const ok = data.x.every((row, i) => {
      const k = row[c]!;
      if (!Number.isInteger(k) || k < 0 || k > 64) return false;
      if (levels[k] === undefined) levels[k] = v[i]!;
      return levels[k] === v[i];
    });
    if (!ok || levels.length < 2) continue;
    // a level index never seen in training (a hole) leaves its value unknown: no match
    if (Array.from(levels, (l) => l === undefined).some(Boolean)) continue;
    return { input: data.inputs[c]!, levels };
  }
  return undefined;
}

/** The rule values of row i. */
export function ruleOfRow(data: PlateStackData, i: number): StackRule {
  const c = data.columns;
  const get = (slot: string): number | undefined => c[`rule_${slot}`]?.[i];
  const start = get("skyPlaneStart");
  const ratio = get("skyPlaneRatio");
  return {
    floorHeight: get("floorHeight")!,
    maxHeight: get("maxHeight")!,
    maxFar: get("maxFar") ?? Infinity,
    maxCoverage: get("maxCoverage") ?? 1,
    minPlateWidth: get("minPlateWidth") ?? 0,
    minPlateArea: get("minPlateArea") ?? 0,
    ...(start !== undefined && ratio !== undefined ? { skyPlaneStart: start, skyPlaneRatio: ratio } : {}),
  };
}

/** The inner training sets of a plate stack. */
export interface InnerTrainingSets {
  readonly lotArea: TrainingData;
  readonly buildableArea: TrainingData;
  readonly baseWidth: TrainingData;
  readonly cutArea: TrainingData;
  readonly cutWidth: TrainingData;
}

/**
 * Splits plate-profile data into the inner training sets: one row per design for the lot and buildable areas
 * (inputs: the geometry inputs) and for the base plate's width (plus the coverage input), and one row per
 * storey above the sky plane's start for the cut plate's area and width (plus the inset).
 * @param data - inputs, rows and profile columns.
 * @param geometry - names of the geometry inputs.
 * @param coverage - the coverage input, or null.
 * @returns the five training sets (a set may have no rows).
 */
export function innerTrainingSets(data: PlateStackData, geometry: readonly string[], coverage: string | null): InnerTrainingSets {
  const gIdx = geometry.map((g) => data.inputs.indexOf(g));
  const cIdx = coverage === null ? -1 : data.inputs.indexOf(coverage);
  const geo = data.x.map((row) => gIdx.map((j) => row[j]!));
  const wc = data.x.map((row, i) => (cIdx < 0 ? geo[i]! : [...geo[i]!, row[cIdx]!]));
  const wcNames = coverage === null ? [...geometry] : [...geometry, coverage];
  const col = (name: string): readonly number[] => data.columns[name]!;
  const base: { x: number[][]; y: number[][] } = { x: [], y: [] };
  const cut: { x: number[][]; a: number[][]; w: number[][] } = { x: [], a: [], w: [] };
  for (let i = 0; i < data.x.length; i++) {
    const rule = ruleOfRow(data, i);
    const top = storeysAllowed(rule);
    for (let k = 1; k <= top && data.columns[`plateArea_${k}`] !== undefined; k++) {
      const d = storeyInset(rule, k);
      if (d === 0) {
        if (k === 1) {
          base.x.push(wc[i]!);
          base.y.push([col(`plateWidth_${k}`)[i]!]);
        }
      } else {
        cut.x.push([...wc[i]!, d]);
        cut.a.push([col(`plateArea_${k}`)[i]!]);
        cut.w.push([col(`plateWidth_${k}`)[i]!]);
      }
    }
  }
  const cutNames = [...wcNames, INSET_INPUT];
  return {
    lotArea: { inputs: [...geometry], targets: ["lotArea"], x: geo, y: col("lotArea").map((v) => [v]) },
    buildableArea: { inputs: [...geometry], targets: ["buildableArea"], x: geo, y: col("buildableArea").map((v) => [v]) },
    baseWidth: { inputs: wcNames, targets: ["baseWidth"], x: base.x, y: base.y },
    cutArea: { inputs: cutNames, targets: ["cutArea"], x: cut.x, y: cut.a },
    cutWidth: { inputs: cutNames, targets: ["cutWidth"], x: cut.x, y: cut.w },
  };
}
