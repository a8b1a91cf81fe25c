import type * as Tf from "@tensorflow/tfjs";
import { tf } from "./load-tfjs.js";
import type { MlpActivation } from "../predict/mlp-payload.js";

/** A dense layer's tensors. */
export interface DenseTensors {
  readonly w: Tf.Tensor2D;
  readonly b: Tf.Tensor1D;
}

/**
 * The network's forward pass on standardised data: hidden layers act(z·W + b), a linear output layer.
 * Call inside tf.tidy.
 * @param z - rows × inputs, inputs already mapped to [-1, 1].
 * @returns rows × targets in standardised units.
 */
export function mlpForward(z: Tf.Tensor2D, layers: readonly DenseTensors[], activation: MlpActivation): Tf.Tensor2D {
  let h: Tf.Tensor2D = z;
  layers.forEach((layer, l) => {
    const a = tf.add(tf.matMul(h, layer.w), layer.b) as Tf.Tensor2D;
    if (l === layers.length - 1) h = a;
    else if (activation === "relu") h = tf.relu(a);
    else if (activation === "tanh") h = tf.tanh(a);
    else h = tf.elu(a);
  });
  return h;
}
