import type { TrainingData } from "../surrogate-types.js";
import { checkTrainingData } from "../check-training-data.js";
import { resolveMlpOptions, type MlpOptions } from "./mlp-options.js";
import { MlpSurrogate, type MlpModelFile } from "./mlp-surrogate.js";
import { trainMlp } from "./train-mlp.js";
import { useNnBackend } from "./tf-backend.js";
import { createInputScaling } from "../scaling/input-scaling.js";
import { createOutputScaling } from "../scaling/output-scaling.js";

/**
 * Fits a multilayer-perceptron regressor to several targets at once and returns it fitted.
 * Inputs are mapped from their bounds (options.inputBounds, else the data's range) to [-1, 1];
 * targets are standardised (mean 0, population sd 1; a constant target keeps sd 1 and is predicted
 * exactly, its output weights set to zero). Training: seeded Glorot initialisation, Adam
 * on mini-batches of seeded shuffles, an L2 weight penalty, early stopping on a seeded validation
 * split with the best weights restored, and a learning-rate schedule (see {@link MlpOptions}).
 * @param data - training rows; every cell finite.
 * @param options - architecture and training settings; all optional.
 * @returns the fitted surrogate (tfjs predictions and gradients; `toJSON()` gives the "mlp" model file).
 * @throws TypeError / RangeError for bad data (naming row and column) or options.
 */
export async function fitMlp(data: TrainingData, options: MlpOptions = {}): Promise<MlpSurrogate> {
  checkTrainingData("fitMlp", data);
  const o = resolveMlpOptions("fitMlp", options);
  const backend = await useNnBackend(o.backend);
  const n = data.x.length;
  const d = data.inputs.length;
  const t = data.targets.length;
  const { lower, upper } = createInputScaling(data.x, options.inputBounds);
  const { mean, std } = createOutputScaling(data.y);
  const zx = new Float32Array(n * d);
  const zy = new Float32Array(n * t);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < d; j++) {
      const w = upper[j]! - lower[j]!;
      zx[i * d + j] = w > 0 ? (2 * (data.x[i]![j]! - lower[j]!)) / w - 1 : 0;
    }
    for (let j = 0; j < t; j++) zy[i * t + j] = (data.y[i]![j]! - mean[j]!) / std[j]!;
  }
  const { layers, summary } = trainMlp(zx, zy, n, d, t, o);
  // A constant target is predicted exactly: its output weights and bias are set to zero (z ≡ 0).
  const out = layers[layers.length - 1]!;
  for (let j = 0; j < t; j++) {
    if (data.y.every((r) => r[j] === data.y[0]![j])) {
      out.bias[j] = 0;
      for (let k = 0; k < out.shape[0]; k++) out.weights[k * t + j] = 0;
    }
  }
  const file: MlpModelFile = {
    kind: "floorcast.surrogate",
    formatVersion: 1,
    modelType: "mlp",
    inputs: [...data.inputs],
    targets: [...data.targets],
    inputScaling: { lower, upper },
    outputScaling: { mean, std },
    payload: {
      activation: o.activation,
      layers: layers.map((l) => ({ shape: [l.shape[0], l.shape[1]], weights: Array.from(l.weights), bias: Array.from(l.bias) })),
    },
    training: {
      n,
      seed: o.seed,
      backend,
      hiddenLayers: [...o.layers],
      epochs: o.epochs,
      batchSize: o.batchSize,
      learningRate: o.learningRate,
      l2: o.l2,
      ...summary,
    },
  };
  return new MlpSurrogate(file);
}
