import type { MlpActivation } from "../predict/mlp-payload.js";

/** One dense layer's parameters in float32: `weights` row-major [inputs, outputs]. */
export interface DenseParams {
  readonly shape: readonly [number, number];
  readonly weights: Float32Array;
  readonly bias: Float32Array;
}

/**
 * Seeded initial weights and biases, uniform on [−a, a] with a = √(6 / (fan_in + fan_out))
 * (Glorot & Bengio 2010, eq. 16; the biases drawn the same way, as scikit-learn's MLP does, so the
 * first layer's ReLU kinks do not all pass through the centre of the input box).
 * @param widths - layer widths from inputs to outputs, e.g. [12, 64, 64, 3].
 * @param activation - hidden activation (the same bound serves relu, elu and tanh here).
 * @param rng - a seedrandom generator (uniform on [0, 1)).
 */
export function initWeights(widths: readonly number[], activation: MlpActivation, rng: () => number): DenseParams[] {
  void activation;
  const layers: DenseParams[] = [];
  for (let l = 0; l + 1 < widths.length; l++) {
    const fanIn = widths[l]!;
    const fanOut = widths[l + 1]!;
    const a = Math.sqrt(6 / (fanIn + fanOut));
    const weights = new Float32Array(fanIn * fanOut);
    for (let i = 0; i < weights.length; i++) weights[i] = (2 * rng() - 1) * a;
    const bias = new Float32Array(fanOut);
    for (let i = 0; i < fanOut; i++) bias[i] = (2 * rng() - 1) * a;
    layers.push({ shape: [fanIn, fanOut], weights, bias });
  }
  return layers;
}
