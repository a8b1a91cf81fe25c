/** Activation codes for {@link denseLayer}: 0 linear, 1 relu, 2 tanh, 3 elu (α = 1). */
export type ActivationCode = 0 | 1 | 2 | 3;

/**
 * One dense layer over a block of rows, dst = act(src · W + b), written for speed: `wt` is the
 * weight matrix transposed (outDim × inDim, row-major) so every dot product runs over contiguous
 * memory, and each block of two rows × four outputs keeps eight sums in registers. No allocation.
 * @param src - rows × inDim values, row-major.
 * @param rows - number of rows in the block.
 * @param inDim - inputs per row.
 * @param wt - outDim × inDim transposed weights.
 * @param bias - outDim biases.
 * @param outDim - outputs per row.
 * @param dst - receives rows × outDim values.
 * @param act - activation code.
 */
export function denseLayer(
  src: Float64Array,
  rows: number,
  inDim: number,
  wt: Float64Array,
  bias: Float64Array,
  outDim: number,
  dst: Float64Array,
  act: ActivationCode,
): void {
  const out4 = outDim - (outDim % 4);
  let r = 0;
  // Main block: two rows × four outputs, eight accumulators in registers; six loads per eight products.
  for (; r + 2 <= rows; r += 2) {
    const a0 = r * inDim;
    const a1 = a0 + inDim;
    const d0 = r * outDim;
    const d1 = d0 + outDim;
    let j = 0;
    for (; j < out4; j += 4) {
      const w0 = j * inDim;
      const w1 = w0 + inDim;
      const w2 = w1 + inDim;
      const w3 = w2 + inDim;
      let s00 = bias[j]!;
      let s01 = bias[j + 1]!;
      let s02 = bias[j + 2]!;
      let s03 = bias[j + 3]!;
      let s10 = s00;
      let s11 = s01;
      let s12 = s02;
      let s13 = s03;
      for (let k = 0; k < inDim; k++) {
        const x0 = src[a0 + k]!;
        const x1 = src[a1 + k]!;
        let w = wt[w0 + k]!;
        s00 += x0 * w;
        s10 += x1 * w;
        w = wt[w1 + k]!;
        s01 += x0 * w;
        s11 += x1 * w;
        w = wt[w2 + k]!;
        s02 += x0 * w;
        s12 += x1 * w;
        w = wt[w3 + k]!;
        s03 += x0 * w;
        s13 += x1 * w;
      }
      dst[d0 + j] = activate(s00, act);
      dst[d0 + j + 1] = activate(s01, act);
      dst[d0 + j + 2] = activate(s02, act);
      dst[d0 + j + 3] = activate(s03, act);
      dst[d1 + j] = activate(s10, act);
      dst[d1 + j + 1] = activate(s11, act);
      dst[d1 + j + 2] = activate(s12, act);
      dst[d1 + j + 3] = activate(s13, act);
    }
    for (; j < outDim; j++) {
      const w0 = j * inDim;
      let s0 = bias[j]!;
      let s1 = s0;
      for (let k = 0; k < inDim; k++) {
        const w = wt[w0 + k]!;
        s0 += src[a0 + k]! * w;
        s1 += src[a1 + k]! * w;
      }
      dst[d0 + j] = activate(s0, act);
      dst[d1 + j] = activate(s1, act);
    }
  }
  for (; r < rows; r++) {
    const a0 = r * inDim;
    const d0 = r * outDim;
    for (let j = 0; j < outDim; j++) {
      const w0 = j * inDim;
      let s = bias[j]!;
      for (let k = 0; k < inDim; k++) s += src[a0 + k]! * wt[w0 + k]!;
      dst[d0 + j] = activate(s, act);
    }
  }
}

function activate(v: number, act: ActivationCode): number {
  switch (act) {
    case 0:
      return v;
    case 1:
      return v > 0 ? v : 0;
    case 2:
      return Math.tanh(v);
    case 3:
      return v > 0 ? v : Math.expm1(v);
  }
}
