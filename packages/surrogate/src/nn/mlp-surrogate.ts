import type * as Tf from "@tensorflow/tfjs";
import { tf } from "./load-tfjs.js";
import type { Prediction, Surrogate } from "../surrogate-types.js";
import type { ModelFileShape } from "../predict/model-file-shape.js";
import type { MlpPayload } from "../predict/mlp-payload.js";
import { checkMatrix } from "../check-training-data.js";
import { sealModelFile } from "../model-file/seal-model-file.js";
import { mlpForward, type DenseTensors } from "./mlp-forward.js";

/** An "mlp" model file (the shared envelope with an {@link MlpPayload}). */
export interface MlpModelFile extends ModelFileShape {
  readonly modelType: "mlp";
  readonly payload: MlpPayload;
}

/**
 * A fitted multilayer-perceptron surrogate whose predictions and gradients run on tfjs (CPU or
 * WebAssembly backend, whichever is active). Built from a complete model file, so it is never
 * unfitted; it holds its weights as typed arrays and makes tensors only inside each call, so it
 * leaves no tensors behind.
 */
export class MlpSurrogate implements Surrogate {
  readonly kind = "mlp";
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly #file: MlpModelFile;
  readonly #lower: Float64Array;
  readonly #scale: Float64Array;
  readonly #layers: { shape: [number, number]; w: Float32Array; b: Float32Array }[];

  /** @param file - a validated "mlp" model file. */
  constructor(file: MlpModelFile) {
    this.#file = file;
    this.inputs = file.inputs;
    this.targets = file.targets;
    const { lower, upper } = file.inputScaling;
    this.#lower = Float64Array.from(lower);
    this.#scale = Float64Array.from(lower, (lo, j) => (upper[j]! > lo ? 2 / (upper[j]! - lo) : 0));
    this.#layers = file.payload.layers.map((l) => ({
      shape: [l.shape[0], l.shape[1]],
      w: Float32Array.from(l.weights),
      b: Float32Array.from(l.bias),
    }));
  }

  /**
   * Rows mapped to [-1, 1] in float64 exactly as training maps them, z = 2 (x − lower) / (upper − lower) − 1, then
   * stored as float32: scaling inside float32 tensors overflows for tiny spans (2/span > 3.4e38) and loses large offsets.
   */
  #scaled(x: readonly (readonly number[])[]): Float32Array {
    const d = this.inputs.length;
    const { upper } = this.#file.inputScaling;
    const z = new Float32Array(x.length * d);
    for (let i = 0; i < x.length; i++) {
      for (let j = 0; j < d; j++) {
        const w = upper[j]! - this.#lower[j]!;
        z[i * d + j] = w > 0 ? (2 * (x[i]![j]! - this.#lower[j]!)) / w - 1 : 0;
      }
    }
    return z;
  }

  #tensors(): DenseTensors[] {
    return this.#layers.map((l) => ({ w: tf.tensor2d(l.w, l.shape), b: tf.tensor1d(l.b) }));
  }

  /**
   * Predicts a batch (rows × inputs, original units) through tfjs.
   * @returns `mean` rows × targets in original units (no `sd`: a single network gives none).
   * @throws RangeError naming the row and column of a non-finite or missing value.
   */
  predict(x: readonly (readonly number[])[]): Prediction {
    checkMatrix("MlpSurrogate.predict", "x", x, this.inputs.length);
    if (x.length === 0) return { mean: [] };
    const d = this.inputs.length;
    const t = this.targets.length;
    const out = tf.tidy(() => {
      const z = tf.tensor2d(this.#scaled(x), [x.length, d]);
      return mlpForward(z, this.#tensors(), this.#file.payload.activation).dataSync();
    });
    const { mean, std } = this.#file.outputScaling;
    const rows: number[][] = [];
    for (let i = 0; i < x.length; i++) {
      const r = new Array<number>(t);
      for (let j = 0; j < t; j++) r[j] = mean[j]! + std[j]! * out[i * t + j]!;
      rows.push(r);
    }
    return { mean: rows };
  }

  /**
   * Gradient of every predicted target with respect to every input at one point, in original
   * units (target units per input unit), by automatic differentiation (tf.grad) and the chain rule
   * through the input and output scalings.
   * @param x - one input row.
   * @returns targets × inputs.
   */
  gradient(x: readonly number[]): number[][] {
    checkMatrix("MlpSurrogate.gradient", "x", [x], this.inputs.length);
    const d = this.inputs.length;
    const { std } = this.#file.outputScaling;
    return this.targets.map((_, j) =>
      tf.tidy(() => {
        const layers = this.#tensors();
        const f = (z: Tf.Tensor): Tf.Scalar =>
          tf.sum(tf.slice(mlpForward(z as Tf.Tensor2D, layers, this.#file.payload.activation), [0, j], [1, 1]));
        const z = tf.tensor2d(this.#scaled([x]), [1, d]);
        const g = tf.grad(f)(z).dataSync();
        return Array.from({ length: d }, (_, k) => std[j]! * g[k]! * this.#scale[k]!);
      }),
    );
  }

  /** The versioned model file (JSON-ready). */
  toJSON(): MlpModelFile {
    return sealModelFile(this.#file);
  }
}
