import { choleskyInverseInPlace } from "../../linalg/cholesky-inverse.js";
import { choleskyWithJitter } from "../../linalg/cholesky-with-jitter.js";
import { logDeterminant } from "../../linalg/log-determinant.js";
import { solveLower, solveLowerTransposed } from "../../linalg/triangular-solve.js";
import { kernelGradientContraction } from "../kernels/kernel-gradient-contraction.js";
import type { HyperparameterLayout } from "../kernels/kernel-hyperparameters.js";
import { hyperparametersFromTheta } from "../kernels/kernel-hyperparameters.js";
import { kernelMatrix } from "../kernels/kernel-matrix.js";
import type { KernelName } from "../kernels/kernel-name.js";

/** Log marginal likelihood at θ, its gradient with respect to θ when asked, and the jitter that was needed. */
export interface LogMarginalLikelihoodResult {
  readonly value: number;
  readonly gradient: Float64Array | undefined;
  readonly jitter: number;
}

const LOG_2PI = Math.log(2 * Math.PI);

/**
 * log p(y | X, θ) = −½ yᵀα − Σ log L_ii − (n/2) log 2π with K = L Lᵀ, α = K⁻¹y (Rasmussen & Williams 2006,
 * Alg. 2.1), and ∂/∂θ_j = ½ tr((ααᵀ − K⁻¹) ∂K/∂θ_j) (eq. 5.9). Uses a single n × n buffer: K is factored
 * in place and L is then overwritten by K⁻¹.
 * @param x - flat scaled inputs (n × d).
 * @param y - standardised targets (length n).
 * @param kernel - family.
 * @param layout - θ layout.
 * @param theta - log hyperparameters.
 * @param withGradient - whether to compute the gradient (costs about two more Cholesky-sized passes).
 * @param work - optional n × n buffer.
 * @returns value, gradient and jitter.
 */
export function logMarginalLikelihood(
  x: Float64Array,
  y: Float64Array,
  kernel: KernelName,
  layout: HyperparameterLayout,
  theta: ArrayLike<number>,
  withGradient: boolean,
  work?: Float64Array,
): LogMarginalLikelihoodResult {
  const n = y.length;
  const h = hyperparametersFromTheta(layout, theta);
  const k = kernelMatrix(x, n, layout.dims, kernel, h, 0, work);
  const chol = choleskyWithJitter(k, n);
  const alpha = solveLowerTransposed(chol.factor, n, solveLower(chol.factor, n, Float64Array.from(y)));
  let quad = 0;
  for (let i = 0; i < n; i++) quad += y[i]! * alpha[i]!;
  const value = -0.5 * quad - 0.5 * logDeterminant(chol.factor, n) - 0.5 * n * LOG_2PI;
  if (!withGradient) return { value, gradient: undefined, jitter: chol.jitter };
  const w = choleskyInverseInPlace(chol.factor, n);
  for (let a = 0; a < n; a++) {
    const ra = a * n;
    const aa = alpha[a]!;
    for (let b = 0; b <= a; b++) w[ra + b] = aa * alpha[b]! - w[ra + b]!;
  }
  return { value, gradient: kernelGradientContraction(w, x, n, kernel, h, layout), jitter: chol.jitter };
}
