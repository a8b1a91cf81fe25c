import type { SurrogateTrainer, TrainingData } from "../surrogate-types.js";
import { checkTrainingData } from "../check-training-data.js";

/**
 * Validates what every trainer-taking wrapper receives: a trainer function, training data and a seed.
 * @param fn - caller named in messages.
 * @param trainer - must be a function.
 * @param data - checked by checkTrainingData.
 * @param seed - options.seed, default 0.
 * @returns the seed.
 * @throws TypeError / RangeError naming the field.
 */
export function checkWrapperArgs(fn: string, trainer: SurrogateTrainer, data: TrainingData, seed: unknown = 0): number {
  if (typeof trainer !== "function") throw new TypeError(`${fn}: trainer must be a function (data, seed) => Promise<Surrogate>`);
  checkTrainingData(fn, data);
  if (typeof seed !== "number" || !Number.isFinite(seed)) throw new RangeError(`${fn}: options.seed must be a finite number`);
  return seed;
}
