import type { ActivationCode } from "./dense-layer.js";

/**
 * Weights of one dense layer rearranged for {@link sparseInputLayer}: columns in blocks of four,
 * interleaved so the four weights of one input are adjacent (`blocks[(b · inDim + k) · 4 + c]` is
 * W[k][4b + c]), and the transposed weights for the columns left over (outDim mod 4).
 */
export interface InterleavedWeights {
  readonly blocks: Float64Array;
  readonly wt: Float64Array;
}

/**
 * Interleaves a row-major inputs × outputs weight matrix for {@link sparseInputLayer}.
 * @param wt - the transposed weights (outDim × inDim), as used by denseLayer.
 */
export function interleaveWeights(wt: Float64Array, inDim: number, outDim: number): InterleavedWeights {
  const nb = Math.floor(outDim / 4);
  const blocks = new Float64Array(nb * inDim * 4);
  for (let b = 0; b < nb; b++) {
    for (let k = 0; k < inDim; k++) for (let c = 0; c < 4; c++) blocks[(b * inDim + k) * 4 + c] = wt[(4 * b + c) * inDim + k]!;
  }
  return { blocks, wt };
}

/**
 * One dense layer whose inputs are mostly exact zeros (the outputs of a ReLU layer): each row's
 * non-zero inputs are gathered first and only they are multiplied, eight outputs at a time. Skipping
 * an exact zero changes no sum (0 · w adds 0), so the result equals {@link denseLayer}'s bit for bit.
 * No allocation: `idx` and `val` are caller-owned scratch of at least inDim entries.
 */
export function sparseInputLayer(
  src: Float64Array,
  rows: number,
  inDim: number,
  w: InterleavedWeights,
  bias: Float64Array,
  outDim: number,
  dst: Float64Array,
  act: ActivationCode,
  idx: Int32Array,
  val: Float64Array,
): void {
  const q = w.blocks;
  const wt = w.wt;
  const nb = Math.floor(outDim / 4);
  const stride = inDim * 4;
  for (let r = 0; r < rows; r++) {
    const a0 = r * inDim;
    const d0 = r * outDim;
    let m = 0;
    for (let k = 0; k < inDim; k++) {
      const x = src[a0 + k]!;
      if (x !== 0) {
        idx[m] = k;
        val[m] = x;
        m++;
      }
    }
    let b = 0;
    for (; b + 2 <= nb; b += 2) {
      const base = b * stride;
      const base2 = base + stride;
      const j = 4 * b;
      let s0 = bias[j]!;
      let s1 = bias[j + 1]!;
      let s2 = bias[j + 2]!;
      let s3 = bias[j + 3]!;
      let s4 = bias[j + 4]!;
      let s5 = bias[j + 5]!;
      let s6 = bias[j + 6]!;
      let s7 = bias[j + 7]!;
      for (let t = 0; t < m; t++) {
        const x = val[t]!;
        const k4 = idx[t]! * 4;
        const p = base + k4;
        const p2 = base2 + k4;
        s0 += x * q[p]!;
        s1 += x * q[p + 1]!;
        s2 += x * q[p + 2]!;
        s3 += x * q[p + 3]!;
        s4 += x * q[p2]!;
        s5 += x * q[p2 + 1]!;
        s6 += x * q[p2 + 2]!;
        s7 += x * q[p2 + 3]!;
      }
      dst[d0 + j] = act === 1 ? (s0 > 0 ? s0 : 0) : s0;
      dst[d0 + j + 1] = act === 1 ? (s1 > 0 ? s1 : 0) : s1;
      dst[d0 + j + 2] = act === 1 ? (s2 > 0 ? s2 : 0) : s2;
      dst[d0 + j + 3] = act === 1 ? (s3 > 0 ? s3 : 0) : s3;
      dst[d0 + j + 4] = act === 1 ? (s4 > 0 ? s4 : 0) : s4;
      dst[d0 + j + 5] = act === 1 ? (s5 > 0 ? s5 : 0) : s5;
      dst[d0 + j + 6] = act === 1 ? (s6 > 0 ? s6 : 0) : s6;
      dst[d0 + j + 7] = act === 1 ? (s7 > 0 ? s7 : 0) : s7;
    }
    // A last block of four, then the columns left over, from the transposed weights.
    for (let j = 4 * b; j < outDim; j++) {
      const w0 = j * inDim;
      let s = bias[j]!;
      for (let t = 0; t < m; t++) s += val[t]! * wt[w0 + idx[t]!]!;
      dst[d0 + j] = act === 1 ? (s > 0 ? s : 0) : s;
    }
  }
}
