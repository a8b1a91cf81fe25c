import { fitConformal, fitEnsemble, fitGaussianProcess, type SurrogateTrainer } from "@floorcast/surrogate";
import { UsageError } from "../usage-error.js";

type FileLike = { modelType?: string; payload?: Record<string, unknown>; training?: Record<string, unknown> };

/**
 * A trainer that refits a model of the same family and settings as a model file, for cross-validation
 * and learning curves: a GP with the file's kernel and ARD choice; an MLP with the file's hidden layer
 * widths, activation and the epochs, batch size, learning rate and L2 its training summary records; an ensemble with as many members,
 * each refitted like its first member; a split-conformal wrapper with the same coverage, score and
 * calibration fraction around a base refitted like its own.
 * @param file - the parsed model file.
 * @param fileName - for messages.
 * @returns the trainer.
 */
export function refitTrainer(file: unknown, fileName: string): SurrogateTrainer {
  const f = (file ?? {}) as FileLike;
  if (f.modelType === "gp") {
    const p = f.payload as { kernel: "se" | "matern32" | "matern52"; ard: boolean };
    return async (data, seed) => fitGaussianProcess(data, { kernel: p.kernel, ard: p.ard, seed });
  }
  if (f.modelType === "mlp") {
    const p = f.payload as { activation: "relu" | "tanh" | "elu"; layers: { shape: [number, number] }[] };
    const hidden = p.layers.slice(0, -1).map((l) => l.shape[1]);
    // Training settings the file records (fit-mlp's training summary); absent ones take fitMlp's defaults.
    const recorded: Record<string, number> = {};
    for (const key of ["epochs", "batchSize", "learningRate", "l2"] as const) {
      const v = f.training?.[key];
      if (typeof v === "number") recorded[key] = v;
    }
    return async (data, seed) => {
      const { fitMlp } = await import("@floorcast/surrogate/nn");
      return fitMlp(data, { ...recorded, layers: hidden, activation: p.activation, seed });
    };
  }
  if (f.modelType === "ensemble") {
    const members = (f.payload as { members: unknown[] }).members;
    const member = refitTrainer(members[0], `${fileName} payload.members[0]`);
    return (data, seed) => fitEnsemble(member, data, { members: members.length, seed });
  }
  if (f.modelType === "conformal") {
    const p = f.payload as { base: unknown; coverage: number; score: "absolute" | "normalised" };
    const base = refitTrainer(p.base, `${fileName} payload.base`);
    const fraction = typeof f.training?.calibrationFraction === "number" ? f.training.calibrationFraction : undefined;
    return (data, seed) =>
      fitConformal(base, data, { coverage: p.coverage, score: p.score, seed, ...(fraction === undefined ? {} : { calibrationFraction: fraction }) });
  }
  throw new UsageError(`assess: ${fileName} is a ${String(f.modelType)} model, which --folds and --learning-curve cannot refit`);
}
