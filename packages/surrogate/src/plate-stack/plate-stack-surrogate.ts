import type { Prediction, Surrogate } from "../surrogate-types.js";
import { checkMatrix } from "../check-training-data.js";
import { sealModelFile } from "../model-file/seal-model-file.js";
import type { InnerQuantity, PlateStackPayload } from "../predict/plate-stack-payload.js";
import { PLATE_STACK_OUTPUTS, evaluatePlateStack, latentSd, type InnerMoments, type PlateStackEvaluation } from "../predict/plate-stack-evaluate.js";
import type { PlateStackModelFile } from "../model-file/plate-stack-model-file-schema.js";
import type { MinAffineTrend } from "../predict/min-affine-trend.js";

/**
 * A learned quantity of a fitted plate stack: a constant, or a fitted inner surrogate (one target), which with a
 * `trend` learns the quantity minus the trend (the quantity is trend + the inner model's prediction).
 */
export type FittedQuantity = { readonly constant: number } | { readonly model: Surrogate; readonly trend?: MinAffineTrend };

/** Everything a fitted plate stack is made of (built by fitPlateStack or loadSurrogate). */
export interface PlateStackParts {
  /** The model file without its quantities' inner files and checksum (they are added by toJSON). */
  readonly file: Omit<PlateStackModelFile, "checksum" | "payload"> & { readonly payload: Omit<PlateStackPayload, "quantities"> };
  readonly quantities: Readonly<Record<string, FittedQuantity | undefined>>;
}

/**
 * The structure-aware "plate-stack" surrogate: inner models learn the smooth plate geometry (lot area, buildable
 * area, plate areas and widths by sky-plane inset) and the stacking rule (plate stops, FAR cap at whole floors,
 * height limit) is applied exactly at prediction time (composite structure: Astudillo & Frazier 2019, ICML).
 * `predict` gives the point values (the mean of the rule over the inner posterior in "expected" mode) and the sd of
 * the rule's outputs over quasi-Monte Carlo draws of the inner models.
 */
export class PlateStackSurrogate implements Surrogate {
  readonly kind = "plate-stack";
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly #parts: PlateStackParts;
  readonly #payload: PlateStackPayload;
  readonly #columns: number[];

  /** @param parts - fitted parts; use fitPlateStack or loadSurrogate rather than calling this directly. */
  constructor(parts: PlateStackParts) {
    this.#parts = parts;
    this.inputs = parts.file.inputs;
    this.targets = parts.file.targets;
    this.#columns = this.targets.map((t) => (PLATE_STACK_OUTPUTS as readonly string[]).indexOf(t));
    const quantities = Object.fromEntries(
      Object.entries(parts.quantities)
        .filter((e): e is [string, FittedQuantity] => e[1] !== undefined)
        .map(([k, q]) => [k, "constant" in q ? q : { model: q.model.toJSON(), ...(q.trend === undefined ? {} : { trend: q.trend }) }]),
    );
    this.#payload = { ...parts.file.payload, quantities } as unknown as PlateStackPayload;
  }

  /** The fitted inner surrogate of a learned quantity (undefined when constant or not learned; with a trend it predicts the remainder). */
  inner(name: string): Surrogate | undefined {
    const q = this.#parts.quantities[name];
    return q !== undefined && "model" in q ? q.model : undefined;
  }

  /**
   * Everything the rule yields for a batch: point values and sd for every output in PLATE_STACK_OUTPUTS order, the
   * probability of each floor count and the limiting reason.
   * @param x - rows × inputs, original units.
   * @param keepSamples - also return every draw's outputs (`samples`, rows × draws × PLATE_STACK_OUTPUTS).
   */
  predictMassing(x: readonly (readonly number[])[], keepSamples = false): PlateStackEvaluation {
    checkMatrix("PlateStackSurrogate.predict", "x", x, this.inputs.length);
    const predictInner = (name: string, q: InnerQuantity, rows: number[][]): InnerMoments => {
      if ("constant" in q) return { mean: rows.map(() => q.constant), sd: rows.map(() => 0) };
      const p = this.inner(name)!.predict(rows);
      return { mean: p.mean.map((r) => r[0]!), sd: latentSd(p)?.map((r) => r[0]!) ?? rows.map(() => 0) };
    };
    return evaluatePlateStack(this.#payload, this.inputs, x, predictInner, keepSamples);
  }

  /**
   * Point predictions and sd of the model's targets.
   * @param x - rows × inputs, original units.
   * @returns mean and sd, rows × targets.
   */
  predict(x: readonly (readonly number[])[]): Prediction {
    const e = this.predictMassing(x);
    const cols = this.#columns;
    return { mean: e.mean.map((r) => cols.map((c) => r[c]!)), sd: e.sd.map((r) => cols.map((c) => r[c]!)) };
  }

  /** The versioned model file: the envelope, the rule's name and values, and each inner model's own file. */
  toJSON(): PlateStackModelFile {
    return sealModelFile({ ...this.#parts.file, payload: this.#payload } as unknown as PlateStackModelFile);
  }
}
