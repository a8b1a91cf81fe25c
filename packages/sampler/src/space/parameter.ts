/**
 * A continuous parameter sampled on [min, max], linearly or (with `log: true`, min > 0) on a log scale.
 */
export interface ContinuousParameter {
  readonly kind: "continuous";
  readonly name: string;
  readonly min: number;
  readonly max: number;
  /** Sample uniformly in log(value) instead of value; needs min > 0. */
  readonly log?: boolean;
  readonly unit: string;
  /** One line saying what the parameter is. */
  readonly description: string;
}

/** An integer parameter taking every whole value from min to max inclusive. */
export interface IntegerParameter {
  readonly kind: "integer";
  readonly name: string;
  readonly min: number;
  readonly max: number;
  readonly unit: string;
  /** One line saying what the parameter is. */
  readonly description: string;
}

/** A categorical parameter taking one of a fixed list of levels. */
export interface CategoricalParameter {
  readonly kind: "categorical";
  readonly name: string;
  readonly levels: readonly (string | number)[];
  readonly unit: string;
  /** One line saying what the parameter is. */
  readonly description: string;
}

/** One sampled dimension of a design space: continuous, integer or categorical. */
export type Parameter = ContinuousParameter | IntegerParameter | CategoricalParameter;
