import type { Evaluator, OutputGradient, Variable } from "@floorcast/sampler";
import type { Surrogate } from "@floorcast/surrogate";
import type { Design, Outputs } from "../optimize/optimization-problem.js";
import { designRow } from "./design-row.js";

/** Anything that predicts a batch of rows: a floorcast surrogate, or a peer model behind a pipe. */
export interface BatchPredictor {
  readonly targets: readonly string[];
  predict(x: readonly (readonly number[])[]): { mean: number[][] } | Promise<{ mean: number[][] }>;
  /** Optional: gradient of the predicted means at one row, targets × inputs, original units. */
  gradient?(x: readonly number[]): number[][];
}

/**
 * A surrogate as an optimizer's evaluator: each design (with an optional site merged in) becomes
 * the surrogate's input row and its predicted means become the outputs, one per target. When the
 * surrogate has an analytic gradient (GP, MLP), the evaluator passes it on for gradient-based
 * optimizers, per output and non-categorical variable.
 * @param model - the fitted surrogate (its inputs must be the variables' names, in order).
 * @param variables - the surrogate's input variables.
 * @param site - fixed values merged into every design (site selection).
 * @returns the evaluator.
 */
export function surrogateEvaluator(
  model: Surrogate | BatchPredictor,
  variables: readonly Variable[],
  site?: Design,
): Evaluator<Outputs> {
  const rowOf = (d: Design): number[] => designRow(variables, site ? { ...site, ...d } : d);
  const evaluator: Evaluator<Outputs> = {
    name: "surrogate",
    concurrency: 1,
    close: async () => {},
    async evaluate(batch: readonly Design[]): Promise<readonly Outputs[]> {
      if (batch.length === 0) return [];
      const { mean } = await model.predict(batch.map(rowOf));
      return mean.map((m) => Object.fromEntries(model.targets.map((t, j) => [t, m[j]!])));
    },
  };
  const gradientOf = model.gradient?.bind(model);
  if (!gradientOf) return evaluator;
  const numeric = variables.flatMap((v, k) => (v.kind === "categorical" ? [] : [[v.name, k] as const]));
  return {
    ...evaluator,
    async gradient(batch: readonly Design[]): Promise<readonly OutputGradient[]> {
      return batch.map((d) => {
        const g = gradientOf(rowOf(d));
        return Object.fromEntries(model.targets.map((t, j) => [t, Object.fromEntries(numeric.map(([name, k]) => [name, g[j]![k]!]))]));
      });
    },
  };
}
