/**
 * A continuous variable on [min, max]: sampled linearly, or with `log: true` (min > 0) uniformly in ln(value);
 * with `step`, only min + k·step (k = 0, 1, …) are legal values (e.g. a yard depth in 0.5 m steps).
 */
export interface ContinuousVariable {
  readonly kind: "continuous";
  readonly name: string;
  readonly min: number;
  readonly max: number;
  /** Sample and search uniformly in ln(value) instead of value; needs min > 0. */
  readonly log?: boolean;
  /** Optional lattice step (> 0). */
  readonly step?: number;
  /** Unit of the value, e.g. "m" (informative). */
  readonly unit?: string;
  /** One line saying what the variable is (informative). */
  readonly description?: string;
}

/** An integer variable taking every whole value from min to max inclusive. */
export interface IntegerVariable {
  readonly kind: "integer";
  readonly name: string;
  readonly min: number;
  readonly max: number;
  readonly unit?: string;
  readonly description?: string;
}

/**
 * A categorical variable taking one of a fixed list of levels (unordered; no repeats). In CSV files and in
 * model rows a level is written as its own value when it is a number; a string level's model row value is its
 * position in `levels` (see createVariableCodec).
 */
export interface CategoricalVariable {
  readonly kind: "categorical";
  readonly name: string;
  readonly levels: readonly (string | number)[];
  readonly unit?: string;
  readonly description?: string;
}

/**
 * One input of a problem, the single definition shared by the design space, the datasets, the model files'
 * input schema and the optimizers: continuous (optionally log scale and a step), integer or categorical.
 */
export type Variable = ContinuousVariable | IntegerVariable | CategoricalVariable;

/** One design: variable name → value (a number, or a categorical level). */
export type VariableRecord = Readonly<Record<string, number | string>>;
