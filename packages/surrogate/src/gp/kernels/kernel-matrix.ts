import type { KernelName } from "./kernel-name.js";
import type { KernelHyperparameters } from "./kernel-hyperparameters.js";
import { radialProfile } from "./radial-profile.js";

/**
 * Assembles K = σ_f² g(r²(x_a, x_b)) + (σ_n² + extraDiagonal) δ_ab into a flat row-major n × n array
 * (both triangles) (Rasmussen & Williams 2006, eq. 2.20 with stationary g of §4.2).
 * @param x - flat scaled inputs (n × d).
 * @param n - rows.
 * @param d - inputs.
 * @param kernel - family.
 * @param h - hyperparameters.
 * @param extraDiagonal - added to the diagonal beside the noise (e.g. recorded jitter); default 0.
 * @param out - optional n × n buffer to fill.
 * @returns the kernel matrix.
 */
export function kernelMatrix(
  x: Float64Array,
  n: number,
  d: number,
  kernel: KernelName,
  h: KernelHyperparameters,
  extraDiagonal = 0,
  out?: Float64Array,
): Float64Array {
  const k = out ?? new Float64Array(n * n);
  const g = radialProfile(kernel);
  const inv = new Float64Array(d);
  for (let p = 0; p < d; p++) inv[p] = 1 / (h.lengthscales[p]! * h.lengthscales[p]!);
  const s2 = h.signalVariance;
  const diag = s2 + h.noiseVariance + extraDiagonal;
  for (let a = 0; a < n; a++) {
    const ra = a * d;
    for (let b = 0; b < a; b++) {
      const rb = b * d;
      let r2 = 0;
      for (let p = 0; p < d; p++) {
        const t = x[ra + p]! - x[rb + p]!;
        r2 += t * t * inv[p]!;
      }
      const v = s2 * g.value(r2);
      k[a * n + b] = v;
      k[b * n + a] = v;
    }
    k[a * n + a] = diag;
  }
  return k;
}

/**
 * Cross-covariances k(x*, x_i) = σ_f² g(r²) of one query point against every training row.
 * @param point - flat scaled query (length d), read from `offset`.
 * @param offset - index of the query's first coordinate in `point`.
 * @param x - flat scaled training inputs (n × d).
 * @param n - training rows.
 * @param d - inputs.
 * @param kernel - family.
 * @param h - hyperparameters.
 * @param out - length-n buffer to fill.
 * @returns out.
 */
export function crossKernelRow(
  point: Float64Array,
  offset: number,
  x: Float64Array,
  n: number,
  d: number,
  kernel: KernelName,
  h: KernelHyperparameters,
  out: Float64Array,
): Float64Array {
  const g = radialProfile(kernel);
  const inv = new Float64Array(d);
  for (let p = 0; p < d; p++) inv[p] = 1 / (h.lengthscales[p]! * h.lengthscales[p]!);
  for (let i = 0; i < n; i++) {
    const ri = i * d;
    let r2 = 0;
    for (let p = 0; p < d; p++) {
      const t = point[offset + p]! - x[ri + p]!;
      r2 += t * t * inv[p]!;
    }
    out[i] = h.signalVariance * g.value(r2);
  }
  return out;
}
