import type * as Tf from "@tensorflow/tfjs";
import { tf } from "./load-tfjs.js";
import seedrandom from "seedrandom";
import { initWeights, type DenseParams } from "./init-weights.js";
import { shuffleInPlace } from "../seeded-shuffle.js";
import { mlpForward, type DenseTensors } from "./mlp-forward.js";
import type { ResolvedMlpOptions } from "./mlp-options.js";

/** What the training loop reports. */
export interface MlpTrainingSummary {
  readonly nTrain: number;
  readonly nValidation: number;
  readonly epochsRun: number;
  readonly bestEpoch: number;
  /** Mean squared error on the validation rows in standardised units (training rows when there is no split). */
  readonly bestLoss: number;
  readonly finalLearningRate: number;
}

// Adam constants (Kingma & Ba 2015, Algorithm 1 defaults).
const BETA1 = 0.9;
const BETA2 = 0.999;
const EPS = 1e-8;

/**
 * Trains an MLP on standardised data with Adam (Kingma & Ba 2015), seeded mini-batches, early
 * stopping on a seeded validation split (the best weights are restored) and a learning-rate
 * schedule. The loop is explicit (tf.variableGrads inside tf.tidy), so the same seed and backend
 * give the same weights; every tensor it makes is disposed before it returns.
 * @param zx - n × d inputs mapped to [-1, 1], row-major.
 * @param zy - n × t standardised targets, row-major.
 */
export function trainMlp(
  zx: Float32Array,
  zy: Float32Array,
  n: number,
  d: number,
  t: number,
  o: ResolvedMlpOptions,
): { layers: DenseParams[]; summary: MlpTrainingSummary } {
  const rng = seedrandom(`floorcast-mlp:${o.seed}`);
  const init = initWeights([d, ...o.layers, t], o.activation, rng);
  const order = Array.from({ length: n }, (_, i) => i);
  shuffleInPlace(order, rng);
  let nVal = o.validationFraction > 0 ? Math.floor(n * o.validationFraction) : 0;
  if (nVal < 1 || n - nVal < 1) nVal = 0;
  const valIdx = order.slice(0, nVal);
  const trainIdx = Int32Array.from(order.slice(nVal));
  const nTrain = trainIdx.length;
  const batch = Math.min(o.batchSize, nTrain);

  const gather = (idx: ArrayLike<number>, start: number, count: number, src: Float32Array, w: number): Float32Array => {
    const out = new Float32Array(count * w);
    for (let i = 0; i < count; i++) out.set(src.subarray(idx[start + i]! * w, idx[start + i]! * w + w), i * w);
    return out;
  };
  const checkIdx = nVal > 0 ? valIdx : Array.from(trainIdx);
  const xCheck = tf.tensor2d(gather(checkIdx, 0, checkIdx.length, zx, d), [checkIdx.length, d]);
  const yCheck = tf.tensor2d(gather(checkIdx, 0, checkIdx.length, zy, t), [checkIdx.length, t]);

  // tf.tidy disposes each variable's initial-value tensor and keeps the variable.
  const vars: DenseTensors[] = tf.tidy(() =>
    init.map((p) => ({
      w: tf.variable(tf.tensor2d(p.weights, [p.shape[0], p.shape[1]])) as Tf.Variable<Tf.Rank.R2>,
      b: tf.variable(tf.tensor1d(p.bias)) as Tf.Variable<Tf.Rank.R1>,
    })),
  );
  const flat = vars.flatMap((v) => [v.w, v.b]) as Tf.Variable[];
  // Adam's moments for all parameters in two flat variables: a dozen tensor ops per step instead of a dozen per parameter.
  const sizes = flat.map((v) => v.size);
  const total = sizes.reduce((a, b) => a + b, 0);
  const moments = tf.tidy(() => ({ m: tf.variable(tf.zeros([total])), v: tf.variable(tf.zeros([total])) }));
  // Mean squared error + (l2 / rows) Σ W², i.e. scikit-learn's ½ MSE + α/(2·rows) Σ W² doubled (same minimiser).
  const loss = (x: Tf.Tensor2D, y: Tf.Tensor2D, rows: number): Tf.Scalar => {
    const mse = tf.mean(tf.squaredDifference(mlpForward(x, vars, o.activation), y)) as Tf.Scalar;
    if (o.l2 === 0) return mse;
    return tf.add(mse, tf.mul(o.l2 / rows, tf.addN(vars.map((v) => tf.sum(tf.square(v.w)))))) as Tf.Scalar;
  };

  let lr = o.learningRate;
  let step = 0;
  let best = Infinity;
  let bestEpoch = 0;
  let bestParams = init;
  let sinceBest = 0;
  let sincePlateau = 0;
  let epoch = 0;
  try {
    for (epoch = 1; epoch <= o.epochs; epoch++) {
      shuffleInPlace(trainIdx, rng);
      for (let start = 0; start < nTrain; start += batch) {
        step++;
        const rows = Math.min(batch, nTrain - start);
        const lrT = (lr * Math.sqrt(1 - BETA2 ** step)) / (1 - BETA1 ** step);
        tf.tidy(() => {
          const xb = tf.tensor2d(gather(trainIdx, start, rows, zx, d), [rows, d]);
          const yb = tf.tensor2d(gather(trainIdx, start, rows, zy, t), [rows, t]);
          const { grads } = tf.variableGrads(() => loss(xb, yb, rows), flat);
          const g = tf.concat(flat.map((p) => tf.reshape(grads[p.name]!, [-1])));
          moments.m.assign(tf.add(tf.mul(BETA1, moments.m), tf.mul(1 - BETA1, g)));
          moments.v.assign(tf.add(tf.mul(BETA2, moments.v), tf.mul(1 - BETA2, tf.square(g))));
          const step = tf.split(tf.mul(lrT, tf.div(moments.m, tf.add(tf.sqrt(moments.v), EPS))), sizes);
          flat.forEach((p, i) => p.assign(tf.sub(p, tf.reshape(step[i]!, p.shape))));
        });
      }
      const checkLoss = tf.tidy(() => tf.mean(tf.squaredDifference(mlpForward(xCheck, vars, o.activation), yCheck)).dataSync()[0]!);
      if (checkLoss < best * (1 - 1e-4)) {
        best = checkLoss;
        bestEpoch = epoch;
        bestParams = snapshot(vars);
        sinceBest = 0;
        sincePlateau = 0;
      } else {
        sinceBest++;
        sincePlateau++;
      }
      if (o.schedule.kind === "exponential") lr *= o.schedule.decay;
      else if (o.schedule.kind === "plateau" && sincePlateau >= (o.schedule.patience ?? 10)) {
        lr = Math.max(lr * (o.schedule.factor ?? 0.5), o.schedule.minLearningRate ?? 1e-5);
        sincePlateau = 0;
      }
      if (nVal > 0 && sinceBest >= o.patience) break;
    }
  } finally {
    tf.dispose([xCheck, yCheck, ...flat, moments.m, moments.v]);
  }
  if (!Number.isFinite(best)) throw new RangeError("fitMlp: training diverged (loss is not finite); lower options.learningRate");
  return {
    layers: bestParams,
    summary: {
      nTrain,
      nValidation: nVal,
      epochsRun: Math.min(epoch, o.epochs),
      bestEpoch,
      bestLoss: best,
      finalLearningRate: lr,
    },
  };
}

function snapshot(vars: readonly DenseTensors[]): DenseParams[] {
  return vars.map((v) => ({
    shape: [v.w.shape[0], v.w.shape[1]] as const,
    weights: Float32Array.from(v.w.dataSync() as Float32Array),
    bias: Float32Array.from(v.b.dataSync() as Float32Array),
  }));
}
