import type { Prediction, Surrogate } from "../surrogate-types.js";
import { createMlpPredictor, type MlpPredictor } from "../predict/mlp-predictor.js";
import type { MlpModelFileParsed } from "./mlp-model-file-schema.js";
import { sealModelFile } from "./seal-model-file.js";

/**
 * An MLP loaded from its model file that predicts by plain Float64 arithmetic (the dependency-free
 * predictor), so the main entry never loads tfjs. Built from a validated file: never unfitted.
 */
export class MlpFileSurrogate implements Surrogate {
  readonly kind = "mlp";
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly #file: MlpModelFileParsed;
  readonly #predictor: MlpPredictor;

  /**
   * @param file - a validated "mlp" model file.
   * @param fileName - named in messages.
   * @throws RangeError naming the file when the layer shapes do not chain from inputs to targets.
   */
  constructor(file: MlpModelFileParsed, fileName = "model file") {
    try {
      this.#predictor = createMlpPredictor(file);
    } catch (error) {
      if (error instanceof RangeError) throw new RangeError(`loadSurrogate: ${fileName}: ${error.message.replace(/^loadPredictor: /, "")}`);
      throw error;
    }
    this.#file = file;
    this.inputs = file.inputs;
    this.targets = file.targets;
  }

  /** Predicts rows × inputs (original units); `mean` rows × targets. @throws RangeError naming row and column. */
  predict(x: readonly (readonly number[])[]): Prediction {
    return { mean: this.#predictor.predict(x).mean };
  }

  /**
   * Gradient of every target with respect to every input at one row (targets × inputs, original
   * units), by back-propagation in Float64 (no tfjs).
   * @throws RangeError naming the column of a non-finite value.
   */
  gradient(x: readonly number[]): number[][] {
    return this.#predictor.gradient(x);
  }

  /** The model file it was loaded from. */
  toJSON(): MlpModelFileParsed {
    return sealModelFile(this.#file);
  }
}

/**
 * Loader for "mlp" model files (one line in surrogate-loaders.ts).
 * @param file - validated by parseModelFile.
 * @param fileName - named in messages.
 */
export function mlpSurrogateFromFile(file: MlpModelFileParsed, fileName = "model file"): MlpFileSurrogate {
  return new MlpFileSurrogate(file, fileName);
}
