import type { ModelFileShape } from "./model-file-shape.js";
import type { Predictor, PredictorOutput } from "./predictor.js";
import { objectField } from "./predictor-checks.js";
import type { InnerQuantity, PlateStackPayload } from "./plate-stack-payload.js";
import { PLATE_STACK_QUANTITIES } from "./plate-stack-payload.js";
import { PLATE_STACK_OUTPUTS, evaluatePlateStack, latentSd, type InnerMoments } from "./plate-stack-evaluate.js";
import { PLATE_STACK_RULE_NAME } from "./plate-stack-rule.js";

const FN = "loadPredictor";

/** Checks the plate-stack payload's shape (the zod schema in model-file/ is the full authority). */
function checkPayload(file: ModelFileShape): PlateStackPayload {
  const p = objectField(FN, "payload", file.payload);
  if (p.rule !== PLATE_STACK_RULE_NAME) {
    throw new RangeError(`${FN}: payload.rule must be ${JSON.stringify(PLATE_STACK_RULE_NAME)} (a rule this floorcast knows), got ${JSON.stringify(p.rule)}`);
  }
  objectField(FN, "payload.ruleValues", p.ruleValues);
  objectField(FN, "payload.quantities", p.quantities);
  if (!Array.isArray(p.geometryInputs) || !Array.isArray(p.draws)) {
    throw new RangeError(`${FN}: payload.geometryInputs and payload.draws must be arrays`);
  }
  for (const name of [...(p.geometryInputs as unknown[]), p.coverageInput]) {
    if (name !== null && !file.inputs.includes(name as string)) throw new RangeError(`${FN}: payload names ${JSON.stringify(name)}, not an input`);
  }
  for (const [slot, src] of Object.entries(p.ruleValues as Record<string, unknown>)) {
    const s = objectField(FN, `payload.ruleValues.${slot}`, src);
    const levelsOk = s.levels === undefined || (Array.isArray(s.levels) && s.levels.length > 0 && s.levels.every((l) => typeof l === "number" && Number.isFinite(l)));
    const ok = typeof s.value === "number" ? Number.isFinite(s.value) : typeof s.input === "string" && file.inputs.includes(s.input) && levelsOk;
    if (!ok) throw new RangeError(`${FN}: payload.ruleValues.${slot} must be { value } or { input[, levels] } naming an input`);
  }
  for (const row of p.draws as unknown[]) {
    if (!Array.isArray(row) || row.length !== PLATE_STACK_QUANTITIES.length || !row.every((v) => typeof v === "number" && Number.isFinite(v))) {
      throw new RangeError(`${FN}: payload.draws must hold rows of ${PLATE_STACK_QUANTITIES.length} finite numbers`);
    }
  }
  if (p.pointMode !== "expected" && p.pointMode !== "plugin") throw new RangeError(`${FN}: payload.pointMode must be expected or plugin`);
  return p as unknown as PlateStackPayload;
}

/** Checks a quantity's trend: pieces of one intercept and one slope per input of its inner model, all finite. */
function checkTrend(field: string, trend: unknown, inputs: number): void {
  const pieces = objectField(FN, field, trend).pieces;
  const ok =
    Array.isArray(pieces) &&
    pieces.length > 0 &&
    pieces.every((p) => Array.isArray(p) && p.length === inputs + 1 && p.every((v) => typeof v === "number" && Number.isFinite(v)));
  if (!ok) throw new RangeError(`${FN}: ${field}.pieces must be rows of ${inputs + 1} finite numbers (intercept, one slope per input)`);
}

/**
 * Builds a predictor for a "plate-stack" model file: each inner model file is loaded with `load`, and the stacking
 * rule named by the file (floorcast's own code, never code from the file) is applied exactly (evaluatePlateStack).
 * @param file - the plate-stack model file.
 * @param load - loads one inner model file (the dispatching loader).
 * @returns the predictor; `mean` and `sd` rows × the file's targets.
 * @throws RangeError for a bad payload or an unknown rule name.
 */
export function createPlateStackPredictor(file: ModelFileShape, load: (inner: unknown) => Predictor): Predictor {
  const payload = checkPayload(file);
  const inner = new Map<string, Predictor>();
  for (const name of PLATE_STACK_QUANTITIES) {
    const q = (payload.quantities as unknown as Record<string, InnerQuantity | undefined>)[name];
    if (q === undefined) continue;
    const v = objectField(FN, `payload.quantities.${name}`, q);
    if (v.model !== undefined) {
      const model = load(v.model);
      inner.set(name, model);
      if (v.trend !== undefined) checkTrend(`payload.quantities.${name}.trend`, v.trend, model.inputs.length);
    } else if (typeof v.constant !== "number" || !Number.isFinite(v.constant)) {
      throw new RangeError(`${FN}: payload.quantities.${name} must be { constant } or { model }`);
    }
  }
  const cols = file.targets.map((t) => (PLATE_STACK_OUTPUTS as readonly string[]).indexOf(t));
  if (cols.some((c) => c < 0)) throw new RangeError(`${FN}: targets must be among ${PLATE_STACK_OUTPUTS.join(", ")}`);
  const predictInner = (name: string, q: InnerQuantity, rows: number[][]): InnerMoments => {
    if ("constant" in q) return { mean: rows.map(() => q.constant), sd: rows.map(() => 0) };
    const p = inner.get(name)!.predict(rows);
    return { mean: p.mean.map((r) => r[0]!), sd: latentSd(p)?.map((r) => r[0]!) ?? rows.map(() => 0) };
  };
  return {
    modelType: "plate-stack",
    inputs: [...file.inputs],
    targets: [...file.targets],
    predict(x: readonly (readonly number[])[]): PredictorOutput {
      const e = evaluatePlateStack(payload, file.inputs, x, predictInner);
      return { mean: e.mean.map((r) => cols.map((c) => r[c]!)), sd: e.sd.map((r) => cols.map((c) => r[c]!)) };
    },
  };
}
