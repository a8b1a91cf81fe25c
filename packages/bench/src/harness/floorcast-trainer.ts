import { fitGaussianProcess } from "@floorcast/surrogate";
import { fitMlp } from "@floorcast/surrogate/nn";
import type { OptimisationVariable } from "../optimise/optimisation-problem.js";
import type { BenchTrainer } from "./bench-trainer.js";

/** The declared bounds of the surrogate's inputs: each variable's range (a categorical's level indices). */
function inputBounds(variables: readonly OptimisationVariable[]): { lower: number[]; upper: number[] } {
  return {
    lower: variables.map((v) => (v.kind === "categorical" ? 0 : v.min)),
    upper: variables.map((v) => (v.kind === "categorical" ? Math.max(1, v.levels.length - 1) : v.max)),
  };
}

/**
 * floorcast's own surrogates as benchmark trainers: "gp" (fitGaussianProcess, Matérn-5/2 ARD,
 * hyperparameters by maximum marginal likelihood with seeded restarts) and "nn" (fitMlp, a
 * two-hidden-layer ReLU MLP with early stopping). Both scale inputs from the variables' declared
 * bounds, so every trial shares one scaling.
 * @param kind - "gp" or "nn".
 * @param variables - the surrogate's input variables (the problem's training variables).
 * @param quick - smaller restarts/epochs for the demo and tests.
 */
export function floorcastTrainer(
  kind: "gp" | "nn",
  variables: readonly OptimisationVariable[],
  quick = false,
): BenchTrainer {
  const bounds = inputBounds(variables);
  if (kind === "gp") {
    return {
      name: "gp",
      fit: (data, seed) =>
        Promise.resolve(
          fitGaussianProcess(data, { seed, inputBounds: bounds, restarts: quick ? 2 : 3, maxIterations: quick ? 100 : 200 }),
        ),
    };
  }
  return {
    name: "nn",
    fit: (data, seed) =>
      fitMlp(data, {
        seed,
        inputBounds: bounds,
        layers: quick ? [32, 32] : [64, 64],
        epochs: quick ? 150 : 400,
        patience: quick ? 15 : 30,
        batchSize: 16,
        learningRate: 0.005,
      }),
  };
}
