import { fitConformal, fitEnsemble, type SurrogateTrainer } from "@floorcast/surrogate";
import { MODEL_FAMILIES } from "../../families/model-families.js";
import { UsageError } from "../usage-error.js";

type FileLike = { modelType?: string; payload?: Record<string, unknown>; training?: Record<string, unknown> };

/**
 * A trainer that refits a model of the same family and settings as a model file, for cross-validation
 * and learning curves: a registered family's own refit (MODEL_FAMILIES: a GP with the file's kernel and ARD choice;
 * an MLP with the file's hidden layer widths, activation and recorded training settings; a plate stack with the
 * file's inner family, point mode, draws and width trend, on the plate profile of each row in the training CSV); an ensemble with as many members,
 * each refitted like its first member; a split-conformal wrapper with the same coverage, score and
 * calibration fraction around a base refitted like its own.
 * @param file - the parsed model file.
 * @param fileName - for messages.
 * @param trainCsv - the training CSV (assess --train), for a family that reads its plate profile (plate-stack).
 * @returns the trainer.
 */
export function refitTrainer(file: unknown, fileName: string, trainCsv?: string): SurrogateTrainer {
  const f = (file ?? {}) as FileLike;
  const family = MODEL_FAMILIES.find((m) => m.modelType === f.modelType);
  if (family?.refit) return family.refit(f, trainCsv);
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
