/** Activation of the hidden layers of a multilayer perceptron; the output layer is linear. */
export type MlpActivation = "relu" | "tanh" | "elu";

/** One dense layer: `weights` row-major with `shape` [inputs, outputs], `bias` of length outputs. */
export interface MlpLayerPayload {
  readonly shape: readonly [number, number];
  readonly weights: readonly number[];
  readonly bias: readonly number[];
}

/**
 * The payload of an "mlp" model file. The network sees each input mapped from the envelope's
 * `inputScaling` bounds to [-1, 1], z = 2 (x − lower) / (upper − lower) − 1 (a zero-width bound maps
 * to 0), and predicts standardised targets, y = mean + std · out (the envelope's `outputScaling`).
 */
export interface MlpPayload {
  readonly activation: MlpActivation;
  readonly layers: readonly MlpLayerPayload[];
}
