import type { MinAffineTrend } from "./min-affine-trend.js";
import type { ModelFileShape } from "./model-file-shape.js";

/**
 * Where a rule value comes from: a value fixed for the model, one of the model's input columns, or an input
 * column holding a level index (a categorical variable coded 0, 1, …), whose value is `levels[index]`.
 */
export type RuleSource =
  | { readonly value: number }
  | { readonly input: string }
  | { readonly input: string; readonly levels: readonly number[] };

/**
 * A learned quantity: constant over the training data, or an inner model file (gp or mlp); with a `trend` (the
 * widths by default) the quantity is trend(x) + the inner model's prediction, its sd the inner model's.
 */
export type InnerQuantity = { readonly constant: number } | { readonly model: ModelFileShape; readonly trend?: MinAffineTrend };

/** The learned quantities of a plate stack and the inputs each one reads. */
export interface PlateStackQuantities {
  /** Lot area (m²); inputs: geometryInputs. */
  readonly lotArea: InnerQuantity;
  /** Buildable area before the coverage cap (m²); inputs: geometryInputs. */
  readonly buildableArea: InnerQuantity;
  /** Least width of the uncut base plate (m); inputs: geometryInputs (+ coverageInput). Absent without a width minimum. */
  readonly baseWidth?: InnerQuantity;
  /** Plate area above the sky plane's start (m²); inputs: geometryInputs (+ coverageInput) + skyPlaneInset. */
  readonly cutArea?: InnerQuantity;
  /** Least width of that plate (m); inputs as cutArea. Absent without a width minimum. */
  readonly cutWidth?: InnerQuantity;
}

/** Names of the learned quantities, in the order of the columns of `draws`. */
export const PLATE_STACK_QUANTITIES = ["lotArea", "buildableArea", "baseWidth", "cutArea", "cutWidth"] as const;

/** Input name of the sky-plane inset in the cut models. */
export const INSET_INPUT = "skyPlaneInset";

/**
 * The payload of a "plate-stack" model file: a structure-aware surrogate that learns the smooth plate geometry
 * with inner models and applies the stacking rule named by `rule` exactly at prediction time (the composite
 * structure of Astudillo & Frazier 2019, "Bayesian optimization of composite functions", ICML). Uncertainty:
 * each draw s sets every learned quantity q to mean_q + sd_q × draws[s][q] (one standard-normal value per
 * quantity, shared by all storeys of a row), then the rule is applied; `pointMode` "expected" reports the mean
 * over the draws, "plugin" the rule applied to the inner means.
 */
export interface PlateStackPayload {
  readonly rule: string;
  readonly ruleValues: Readonly<Record<string, RuleSource>>;
  readonly geometryInputs: readonly string[];
  readonly coverageInput: string | null;
  readonly quantities: PlateStackQuantities;
  readonly draws: readonly (readonly number[])[];
  readonly pointMode: "expected" | "plugin";
}
