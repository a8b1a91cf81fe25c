import { activate, DENSE_TILE, denseLayer, packDenseWeights, type ActivationCode } from "./dense-layer.js";
import type { ModelFileShape } from "./model-file-shape.js";
import type { Predictor, PredictorOutput } from "./predictor.js";
import { finiteVector, objectField, packRows, unpackRows } from "./predictor-checks.js";

const FN = "loadPredictor";
const PANEL = DENSE_TILE.rows;
const BLOCK = 64 * PANEL;
const ACTIVATIONS: Record<string, ActivationCode> = { relu: 1, tanh: 2, elu: 3 };

/** A plain-arithmetic MLP predictor that can also fill caller-owned buffers. */
export interface MlpPredictor extends Predictor {
  /**
   * Predicts `rows` rows from a row-major Float64Array (rows × inputs) into `out` (rows × targets,
   * original units), without allocating. Inputs are not checked.
   */
  predictInto(x: Float64Array, rows: number, out: Float64Array): void;
  /**
   * Gradient of every target with respect to every input at one row, in original units (targets ×
   * inputs), by back-propagation through the layers (chain rule through both scalings).
   * @throws RangeError naming the column of a non-finite value.
   */
  gradient(x: readonly number[]): number[][];
}

/**
 * Builds a dependency-free predictor from an "mlp" model file (payload described in mlp-payload.ts):
 * inputs mapped from bounds to [-1, 1], dense layers with the hidden activation, a linear output
 * layer, then de-standardised targets. Runs blocks of 192 rows through one preallocated Float64Array
 * (activations, packed weights and biases; see dense-layer.ts).
 * @param file - a model file whose modelType is "mlp" (structure checked here; zod validation is the loader's).
 * @returns the predictor.
 * @throws TypeError / RangeError naming the faulty field.
 */
export function createMlpPredictor(file: ModelFileShape): MlpPredictor {
  const payload = objectField(FN, "payload", file.payload);
  const act = ACTIVATIONS[String(payload.activation)];
  if (act === undefined) throw new RangeError(`${FN}: payload.activation must be relu, tanh or elu, got ${String(payload.activation)}`);
  if (!Array.isArray(payload.layers) || payload.layers.length === 0) {
    throw new RangeError(`${FN}: payload.layers must be a non-empty array`);
  }
  const nIn = file.inputs.length;
  const nOut = file.targets.length;
  const lower = finiteVector(FN, "inputScaling.lower", file.inputScaling.lower, nIn);
  const upper = finiteVector(FN, "inputScaling.upper", file.inputScaling.upper, nIn);
  const yMean = finiteVector(FN, "outputScaling.mean", file.outputScaling.mean, nOut);
  const yStd = finiteVector(FN, "outputScaling.std", file.outputScaling.std, nOut);
  const scale = new Float64Array(nIn);
  const shift = new Float64Array(nIn);
  for (let j = 0; j < nIn; j++) {
    const w = upper[j]! - lower[j]!;
    scale[j] = w > 0 ? 2 / w : 0;
    shift[j] = w > 0 ? -1 : 0; // z = scale·(x − lower) − 1: subtracting lower first keeps large offsets exact
  }
  const dims: number[] = [nIn];
  const wts: Float64Array[] = [];
  const biases: Float64Array[] = [];
  const panels: Float64Array[] = [];
  (payload.layers as unknown[]).forEach((raw, l) => {
    const layer = objectField(FN, `payload.layers[${l}]`, raw);
    const shape = layer.shape;
    const din = dims[l]!;
    if (!Array.isArray(shape) || shape.length !== 2 || shape[0] !== din || !Number.isInteger(shape[1]) || (shape[1] as number) < 1) {
      throw new RangeError(`${FN}: payload.layers[${l}].shape must be [${din}, width ≥ 1], got ${JSON.stringify(shape)}`);
    }
    const dout = shape[1] as number;
    const w = finiteVector(FN, `payload.layers[${l}].weights`, layer.weights, din * dout);
    const wt = new Float64Array(din * dout);
    for (let k = 0; k < din; k++) for (let j = 0; j < dout; j++) wt[j * din + k] = w[k * dout + j]!;
    wts.push(wt);
    panels.push(packDenseWeights(w, din, dout));
    biases.push(finiteVector(FN, `payload.layers[${l}].bias`, layer.bias, dout));
    dims.push(dout);
  });
  if (dims[dims.length - 1] !== nOut) {
    throw new RangeError(`${FN}: the last layer must have ${nOut} outputs (one per target), got ${dims[dims.length - 1]}`);
  }
  const nLayers = wts.length;
  // The arena: two activation blocks, then each layer's packed weights and zero-padded biases.
  const half = BLOCK * Math.max(...dims);
  const wOff: number[] = [];
  const bOff: number[] = [];
  let size = 2 * half;
  for (let l = 0; l < nLayers; l++) {
    wOff.push(size);
    size += panels[l]!.length;
    bOff.push(size);
    size += 4 * Math.ceil(dims[l + 1]! / 4);
  }
  const mem = new Float64Array(size);
  for (let l = 0; l < nLayers; l++) {
    mem.set(panels[l]!, wOff[l]);
    mem.set(biases[l]!, bOff[l]);
  }

  function predictInto(x: Float64Array, rows: number, out: Float64Array): void {
    for (let start = 0; start < rows; start += BLOCK) {
      const m = Math.min(BLOCK, rows - start);
      const base = start * nIn;
      for (let i = 0; i < m; i++) {
        const at = (i - (i % PANEL)) * nIn + (i % PANEL);
        for (let j = 0; j < nIn; j++) mem[at + j * PANEL] = scale[j]! * (x[base + i * nIn + j]! - lower[j]!) + shift[j]!;
      }
      let src = 0;
      let dst = half;
      for (let l = 0; l < nLayers; l++) {
        denseLayer(mem, src, m, dims[l]!, wOff[l]!, bOff[l]!, dims[l + 1]!, dst, l === nLayers - 1 ? 0 : act!);
        const t = src;
        src = dst;
        dst = t;
      }
      const o = start * nOut;
      for (let i = 0; i < m; i++) {
        const at = src + (i - (i % PANEL)) * nOut + (i % PANEL);
        for (let j = 0; j < nOut; j++) out[o + i * nOut + j] = yMean[j]! + yStd[j]! * mem[at + j * PANEL]!;
      }
    }
  }

  function gradient(x: readonly number[]): number[][] {
    const z = packRows("gradient", [x as number[]], nIn);
    for (let j = 0; j < nIn; j++) z[j] = scale[j]! * (z[j]! - lower[j]!) + shift[j]!;
    // Forward pass keeping every layer's pre-activation.
    const pre: Float64Array[] = [];
    let h = z;
    for (let l = 0; l < nLayers; l++) {
      const din = dims[l]!;
      const wt = wts[l]!;
      const a = Float64Array.from(biases[l]!, (b, j) => {
        let s = b;
        for (let k = 0; k < din; k++) s += h[k]! * wt[j * din + k]!;
        return s;
      });
      pre.push(a);
      h = l === nLayers - 1 ? a : a.map((v) => activate(v, act));
    }
    const grads: number[][] = [];
    for (let t = 0; t < nOut; t++) {
      let g: Float64Array = new Float64Array(nOut);
      g[t] = yStd[t]!;
      for (let l = nLayers - 1; l >= 0; l--) {
        const din = dims[l]!;
        const dout = dims[l + 1]!;
        const back = new Float64Array(din);
        const wt = wts[l]!;
        for (let j = 0; j < dout; j++) {
          const gj = g[j]!;
          if (gj === 0) continue;
          for (let k = 0; k < din; k++) back[k]! += gj * wt[j * din + k]!;
        }
        if (l > 0) {
          const a = pre[l - 1]!;
          for (let k = 0; k < din; k++) {
            const v = a[k]!;
            back[k]! *= act === 1 ? (v > 0 ? 1 : 0) : act === 2 ? 1 - Math.tanh(v) ** 2 : v > 0 ? 1 : Math.exp(v);
          }
        }
        g = back;
      }
      grads.push(Array.from(g, (v, k) => v * scale[k]!));
    }
    return grads;
  }

  return {
    modelType: "mlp",
    gradient,
    inputs: [...file.inputs],
    targets: [...file.targets],
    predictInto,
    predict(x: readonly (readonly number[])[]): PredictorOutput {
      const packed = packRows("predict", x, nIn);
      const out = new Float64Array(x.length * nOut);
      predictInto(packed, x.length, out);
      return { mean: unpackRows(out, x.length, nOut) };
    },
  };
}
