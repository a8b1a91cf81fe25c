import { fitGaussianProcess, type SurrogateTrainer } from "@floorcast/surrogate";
import { UsageError } from "../usage-error.js";

/**
 * A trainer that refits a model of the same family and settings as a model file, for cross-validation
 * and learning curves: a GP with the file's kernel and ARD choice; an MLP with the file's hidden layer
 * widths and activation (other training options at their defaults). Ensembles and conformal wrappers are
 * not refitted here (their members' trainers are not recorded in the file); use the API with your trainer.
 * @param file - the parsed model file.
 * @param fileName - for messages.
 * @returns the trainer.
 */
export function refitTrainer(file: unknown, fileName: string): SurrogateTrainer {
  const f = file as { modelType?: string; payload?: Record<string, unknown> };
  if (f.modelType === "gp") {
    const p = f.payload as { kernel: "se" | "matern32" | "matern52"; ard: boolean };
    return async (data, seed) => fitGaussianProcess(data, { kernel: p.kernel, ard: p.ard, seed });
  }
  if (f.modelType === "mlp") {
    const p = f.payload as { activation: "relu" | "tanh" | "elu"; layers: { shape: [number, number] }[] };
    const hidden = p.layers.slice(0, -1).map((l) => l.shape[1]);
    return async (data, seed) => {
      const { fitMlp } = await import("@floorcast/surrogate/nn");
      return fitMlp(data, { layers: hidden, activation: p.activation, seed });
    };
  }
  throw new UsageError(
    `assess: ${fileName} is a ${f.modelType} model; --folds and --learning-curve refit gp and mlp models only (use kFoldCrossValidation with your own trainer)`,
  );
}
