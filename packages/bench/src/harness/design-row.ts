import type { Design, OptimisationVariable } from "../optimise/optimisation-problem.js";

/**
 * The numeric row a surrogate sees for a design: each variable's value in order, a categorical
 * one as its level index (the optimisers' coding).
 * @param variables - the surrogate's input variables, in order.
 * @param design - the design (may hold extra keys).
 * @returns one number per variable (NaN when missing or an unknown level).
 */
export function designRow(variables: readonly OptimisationVariable[], design: Design): number[] {
  return variables.map((v) => {
    const value = design[v.name];
    if (v.kind === "categorical") {
      const k = v.levels.indexOf(value as string | number);
      return k < 0 ? Number.NaN : k;
    }
    return typeof value === "number" ? value : Number.NaN;
  });
}
