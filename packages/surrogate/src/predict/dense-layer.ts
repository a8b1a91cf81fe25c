/** Activation codes for {@link denseLayer}: 0 linear, 1 relu, 2 tanh, 3 elu (α = 1). */
export type ActivationCode = 0 | 1 | 2 | 3;

/** Rows per panel of the activation layout and outputs per panel of the weight layout (a 3 × 4 tile). */
export const DENSE_TILE = { rows: 3, cols: 4 } as const;

/**
 * Packs a row-major inputs × outputs weight matrix (the model file's layout) into panels of four
 * output columns, the four weights of one input adjacent: `panels[(b · inDim + k) · 4 + c]` is
 * W[k][4b + c]; columns past outDim (the last panel's padding) are zero, so every tile is full.
 * @param weights - inDim × outDim values, row-major.
 * @returns ceil(outDim / 4) · inDim · 4 values.
 */
export function packDenseWeights(weights: ArrayLike<number>, inDim: number, outDim: number): Float64Array {
  const nb = Math.ceil(outDim / 4);
  const panels = new Float64Array(nb * inDim * 4);
  for (let b = 0; b < nb; b++) {
    for (let k = 0; k < inDim; k++) {
      for (let c = 0; c < 4 && 4 * b + c < outDim; c++) panels[(b * inDim + k) * 4 + c] = weights[k * outDim + 4 * b + c]!;
    }
  }
  return panels;
}

/**
 * One dense layer over a block of rows, dst = act(src · W + b), written for speed on one
 * Float64Array `mem` that holds activations, weights and biases at the given offsets (one typed
 * array in the inner loop: one map check, one length). Activations are stored in panels of three
 * rows, element (row r, column k) of a block at `((r − r mod 3) · dim + 3k + r mod 3)`, so the
 * three inputs of a tile's step are adjacent, as are its four weights (see {@link packDenseWeights}).
 * Each 3-row × 4-output tile keeps twelve sums in registers: seven loads per twelve products.
 * Every sum is bias + Σₖ xₖ·wₖ in increasing k, the textbook order, so results equal a naive
 * forward pass bit for bit. Integer offsets use `| 0` so the JIT drops overflow checks. No allocation.
 * @param mem - the arena.
 * @param src - offset of the input block (rows × inDim, 3-row panels).
 * @param rows - rows in the block (a last partial panel of one or two rows runs a one-row kernel).
 * @param inDim - inputs per row.
 * @param w - offset of the packed weights ({@link packDenseWeights}).
 * @param bias - offset of the biases, padded with zeros to a multiple of 4.
 * @param outDim - outputs per row.
 * @param dst - offset of the output block (rows × outDim, 3-row panels).
 * @param act - activation code.
 */
export function denseLayer(
  mem: Float64Array,
  src: number,
  rows: number,
  inDim: number,
  w: number,
  bias: number,
  outDim: number,
  dst: number,
  act: ActivationCode,
): void {
  const span = (inDim * 3) | 0;
  const full = rows - (rows % 3);
  for (let r = 0; r < full; r += 3) {
    const a = (src + r * inDim) | 0;
    const d = (dst + r * outDim) | 0;
    const end = (a + span) | 0;
    for (let j = 0; j < outDim; j += 4) {
      const b0 = mem[(bias + j) | 0]!;
      const b1 = mem[(bias + j + 1) | 0]!;
      const b2 = mem[(bias + j + 2) | 0]!;
      const b3 = mem[(bias + j + 3) | 0]!;
      let s00 = b0, s01 = b1, s02 = b2, s03 = b3;
      let s10 = b0, s11 = b1, s12 = b2, s13 = b3;
      let s20 = b0, s21 = b1, s22 = b2, s23 = b3;
      let p = (w + j * inDim) | 0;
      for (let x = a; x < end; x = (x + 3) | 0, p = (p + 4) | 0) {
        const x0 = mem[x]!;
        const x1 = mem[(x + 1) | 0]!;
        const x2 = mem[(x + 2) | 0]!;
        let v = mem[p]!;
        s00 += x0 * v;
        s10 += x1 * v;
        s20 += x2 * v;
        v = mem[(p + 1) | 0]!;
        s01 += x0 * v;
        s11 += x1 * v;
        s21 += x2 * v;
        v = mem[(p + 2) | 0]!;
        s02 += x0 * v;
        s12 += x1 * v;
        s22 += x2 * v;
        v = mem[(p + 3) | 0]!;
        s03 += x0 * v;
        s13 += x1 * v;
        s23 += x2 * v;
      }
      const o = (d + j * 3) | 0;
      const left = outDim - j;
      if (left > 3 && act === 1) {
        // The common case, a full ReLU tile, inline (measurably faster than through store()).
        mem[o] = s00 > 0 ? s00 : 0;
        mem[(o + 1) | 0] = s10 > 0 ? s10 : 0;
        mem[(o + 2) | 0] = s20 > 0 ? s20 : 0;
        mem[(o + 3) | 0] = s01 > 0 ? s01 : 0;
        mem[(o + 4) | 0] = s11 > 0 ? s11 : 0;
        mem[(o + 5) | 0] = s21 > 0 ? s21 : 0;
        mem[(o + 6) | 0] = s02 > 0 ? s02 : 0;
        mem[(o + 7) | 0] = s12 > 0 ? s12 : 0;
        mem[(o + 8) | 0] = s22 > 0 ? s22 : 0;
        mem[(o + 9) | 0] = s03 > 0 ? s03 : 0;
        mem[(o + 10) | 0] = s13 > 0 ? s13 : 0;
        mem[(o + 11) | 0] = s23 > 0 ? s23 : 0;
      } else {
        store(mem, o, s00, s10, s20, act);
        if (left > 1) store(mem, (o + 3) | 0, s01, s11, s21, act);
        if (left > 2) store(mem, (o + 6) | 0, s02, s12, s22, act);
        if (left > 3) store(mem, (o + 9) | 0, s03, s13, s23, act);
      }
    }
  }
  // The one or two rows of a last, partial panel: one row × four outputs (no padded rows, so one row costs one).
  for (let r = full; r < rows; r++) {
    const a = (src + full * inDim + (r - full)) | 0;
    const d = (dst + full * outDim + (r - full)) | 0;
    const end = (a + span) | 0;
    for (let j = 0; j < outDim; j += 4) {
      let s0 = mem[(bias + j) | 0]!;
      let s1 = mem[(bias + j + 1) | 0]!;
      let s2 = mem[(bias + j + 2) | 0]!;
      let s3 = mem[(bias + j + 3) | 0]!;
      let p = (w + j * inDim) | 0;
      for (let x = a; x < end; x = (x + 3) | 0, p = (p + 4) | 0) {
        const x0 = mem[x]!;
        s0 += x0 * mem[p]!;
        s1 += x0 * mem[(p + 1) | 0]!;
        s2 += x0 * mem[(p + 2) | 0]!;
        s3 += x0 * mem[(p + 3) | 0]!;
      }
      const o = (d + j * 3) | 0;
      const left = outDim - j;
      mem[o] = activate(s0, act);
      if (left > 1) mem[(o + 3) | 0] = activate(s1, act);
      if (left > 2) mem[(o + 6) | 0] = activate(s2, act);
      if (left > 3) mem[(o + 9) | 0] = activate(s3, act);
    }
  }
}

/** Writes one output column of a tile (three rows) through the activation. */
function store(mem: Float64Array, o: number, v0: number, v1: number, v2: number, act: ActivationCode): void {
  if (act === 1) {
    mem[o] = v0 > 0 ? v0 : 0;
    mem[(o + 1) | 0] = v1 > 0 ? v1 : 0;
    mem[(o + 2) | 0] = v2 > 0 ? v2 : 0;
  } else {
    mem[o] = activate(v0, act);
    mem[(o + 1) | 0] = activate(v1, act);
    mem[(o + 2) | 0] = activate(v2, act);
  }
}

/** The activation of code `act` at `v`. */
export function activate(v: number, act: ActivationCode): number {
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
