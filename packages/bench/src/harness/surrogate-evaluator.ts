import type { Surrogate } from "@floorcast/surrogate";
import type { Design, Evaluator, OptimisationVariable, Outputs } from "../optimise/optimisation-problem.js";
import { designRow } from "./design-row.js";

/** Anything that predicts a batch of rows: a floorcast surrogate, or a peer model behind a pipe. */
export interface BatchPredictor {
  readonly targets: readonly string[];
  predict(x: readonly (readonly number[])[]): { mean: number[][] } | Promise<{ mean: number[][] }>;
}

/**
 * A surrogate as an optimiser's evaluator: each design (with an optional site merged in) becomes
 * the surrogate's input row and its predicted means become the outputs, one per target.
 * @param model - the fitted surrogate (its inputs must be the variables' names, in order).
 * @param variables - the surrogate's input variables.
 * @param site - fixed values merged into every design (site selection).
 * @returns the evaluator.
 */
export function surrogateEvaluator(
  model: Surrogate | BatchPredictor,
  variables: readonly OptimisationVariable[],
  site?: Design,
): Evaluator {
  return {
    async evaluate(batch: readonly Design[]): Promise<readonly Outputs[]> {
      if (batch.length === 0) return [];
      const rows = batch.map((d) => designRow(variables, site ? { ...site, ...d } : d));
      const { mean } = await model.predict(rows);
      return mean.map((m) => Object.fromEntries(model.targets.map((t, j) => [t, m[j]!])));
    },
  };
}
