import { rowValue, type Variable } from "@floorcast/sampler";
import type { Design } from "../optimize/optimization-problem.js";

/**
 * The model row a surrogate sees for a design, in the sampler's one coding (createVariableCodec): each
 * variable's value in order, a numeric categorical level as its own value (as `floorcast sample` writes it in
 * the CSV the model was fitted on), a string level as its position in `levels`.
 * @param variables - the surrogate's input variables, in order.
 * @param design - the design (may hold extra keys).
 * @returns one number per variable (NaN when missing or an unknown level).
 */
export function designRow(variables: readonly Variable[], design: Design): number[] {
  return variables.map((v) => rowValue(v, design[v.name]));
}
