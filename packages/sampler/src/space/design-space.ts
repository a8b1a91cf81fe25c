import type { Parameter } from "./parameter.js";

/** The sampled dimensions of a study, one unit-cube coordinate per parameter, in order. */
export interface DesignSpace {
  readonly parameters: readonly Parameter[];
}
