import type { CategoricalVariable, ContinuousVariable, IntegerVariable } from "./variable.js";

/** A scenario's continuous parameter: a {@link ContinuousVariable} with its unit and description. */
export type ContinuousParameter = ContinuousVariable & { readonly unit: string; readonly description: string };

/** A scenario's integer parameter: an {@link IntegerVariable} with its unit and description. */
export type IntegerParameter = IntegerVariable & { readonly unit: string; readonly description: string };

/** A scenario's categorical parameter: a {@link CategoricalVariable} with its unit and description. */
export type CategoricalParameter = CategoricalVariable & { readonly unit: string; readonly description: string };

/** One sampled dimension of a scenario's design space: a Variable that carries its unit and description. */
export type Parameter = ContinuousParameter | IntegerParameter | CategoricalParameter;
