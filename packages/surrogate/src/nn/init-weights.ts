import type { MlpActivation } from "../predict/mlp-payload.js";

/** One dense layer's parameters in float32: `weights` row-major [inputs, outputs]. */
export interface DenseParams {
  readonly shape: readonly [number, number];
  readonly weights: Float32Array;
  readonly bias: Float32Array;
}

/**
 * Seeded initial weights: uniform on [−a, a] with a = √(6 / fan_in) for relu and elu
 * (He et al. 2015, "Delving deep into rectifiers") and a = √(6 / (fan_in + fan_out)) for tanh and
 * the linear output layer (Glorot & Bengio 2010); biases zero.
 * @param widths - layer widths from inputs to outputs, e.g. [12, 64, 64, 3].
 * @param activation - hidden activation.
 * @param rng - a seedrandom generator (uniform on [0, 1)).
 */
export function initWeights(widths: readonly number[], activation: MlpActivation, rng: () => number): DenseParams[] {
  const layers: DenseParams[] = [];
  for (let l = 0; l + 1 < widths.length; l++) {
    const fanIn = widths[l]!;
    const fanOut = widths[l + 1]!;
    const last = l + 2 === widths.length;
    const a = !last && activation !== "tanh" ? Math.sqrt(6 / fanIn) : Math.sqrt(6 / (fanIn + fanOut));
    const weights = new Float32Array(fanIn * fanOut);
    for (let i = 0; i < weights.length; i++) weights[i] = (2 * rng() - 1) * a;
    layers.push({ shape: [fanIn, fanOut], weights, bias: new Float32Array(fanOut) });
  }
  return layers;
}

/** Seeded Fisher–Yates shuffle of `idx` in place (Knuth, TAOCP vol. 2, Algorithm P). */
export function shuffleInPlace(idx: Int32Array | number[], rng: () => number): void {
  for (let i = idx.length - 1; i > 0; i--) {
    const j = Math.floor(rng() * (i + 1));
    const t = idx[i]!;
    idx[i] = idx[j]!;
    idx[j] = t;
  }
}
