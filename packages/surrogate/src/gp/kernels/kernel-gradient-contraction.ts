import type { KernelName } from "./kernel-name.js";
import type { HyperparameterLayout, KernelHyperparameters } from "./kernel-hyperparameters.js";
import { thetaLength } from "./kernel-hyperparameters.js";
import { radialProfile } from "./radial-profile.js";

/**
 * ½ Σ_ab W_ab ∂K_ab/∂θ_j for every log hyperparameter θ_j, without forming any ∂K/∂θ_j matrix: one pass over
 * the pairs (a, b) accumulates all entries. With W = ααᵀ − K⁻¹ this is the gradient of the log marginal
 * likelihood (Rasmussen & Williams 2006, eq. 5.9). Derivatives (derived):
 * ∂K/∂log ℓ_k = σ_f² g'(r²)·(−2 Δ_k²/ℓ_k²), ∂K/∂log σ_f² = σ_f² g(r²), ∂K/∂log σ_n² = σ_n² δ_ab.
 * @param w - symmetric n × n weights; only the lower triangle (with diagonal) is read.
 * @param x - flat scaled inputs (n × d).
 * @param n - rows.
 * @param kernel - family.
 * @param h - hyperparameters.
 * @param layout - θ layout (ARD or shared lengthscale; learned or fixed noise).
 * @returns the contracted gradient, length {@link thetaLength}.
 */
export function kernelGradientContraction(
  w: Float64Array,
  x: Float64Array,
  n: number,
  kernel: KernelName,
  h: KernelHyperparameters,
  layout: HyperparameterLayout,
): Float64Array {
  const d = layout.dims;
  const g = radialProfile(kernel);
  const inv = new Float64Array(d);
  for (let p = 0; p < d; p++) inv[p] = 1 / (h.lengthscales[p]! * h.lengthscales[p]!);
  const acc = new Float64Array(d);
  const u = new Float64Array(d);
  let accSignal = 0;
  let accDiag = 0;
  for (let a = 0; a < n; a++) {
    const ra = a * d;
    const rw = a * n;
    for (let b = 0; b < a; b++) {
      const wab = w[rw + b]!;
      const rb = b * d;
      let r2 = 0;
      for (let p = 0; p < d; p++) {
        const t = x[ra + p]! - x[rb + p]!;
        const v = t * t * inv[p]!;
        u[p] = v;
        r2 += v;
      }
      accSignal += 2 * wab * g.value(r2);
      const c = 2 * wab * g.dValueDr2(r2);
      for (let p = 0; p < d; p++) acc[p] = acc[p]! + c * u[p]!;
    }
    accDiag += w[rw + a]!;
  }
  const s2 = h.signalVariance;
  const out = new Float64Array(thetaLength(layout));
  if (layout.ard) {
    for (let p = 0; p < d; p++) out[p] = 0.5 * s2 * -2 * acc[p]!;
  } else {
    let s = 0;
    for (let p = 0; p < d; p++) s += acc[p]!;
    out[0] = 0.5 * s2 * -2 * s;
  }
  const nl = layout.ard ? d : 1;
  // g(0) = 1 on the diagonal for all three families.
  out[nl] = 0.5 * s2 * (accSignal + accDiag);
  if (layout.learnNoise) out[nl + 1] = 0.5 * h.noiseVariance * accDiag;
  return out;
}
