import { choleskyInverseInPlace } from "../linalg/cholesky-inverse.js";
import type { CholeskyFactor } from "../linalg/cholesky-with-jitter.js";
import { choleskyWithJitter } from "../linalg/cholesky-with-jitter.js";
import { logDeterminant } from "../linalg/log-determinant.js";
import { solveLower, solveLowerMany, solveLowerTransposed } from "../linalg/triangular-solve.js";
import type { KernelHyperparameters } from "./kernels/kernel-hyperparameters.js";
import { crossKernelRow, kernelMatrix } from "./kernels/kernel-matrix.js";
import type { KernelName } from "./kernels/kernel-name.js";
import { radialProfile } from "./kernels/radial-profile.js";

/** Query rows whose variances share one pass over the Cholesky factor. */
const PREDICT_BLOCK = 64;

/** Flat scaled training inputs shared by every target's component. */
export interface TrainingInputs {
  readonly x: Float64Array;
  readonly n: number;
  readonly d: number;
}

/** The fitted, conditioned GP of one standardised target (Rasmussen & Williams 2006, Alg. 2.1). */
export class GpComponent {
  readonly #factor: { value: CholeskyFactor | undefined };

  private constructor(
    readonly train: TrainingInputs,
    readonly kernel: KernelName,
    readonly hyperparameters: KernelHyperparameters,
    readonly jitter: number,
    readonly alpha: Float64Array,
    readonly logMarginalLikelihood: number,
    factor: CholeskyFactor | undefined,
  ) {
    this.#factor = { value: factor };
  }

  /**
   * Conditions on all training rows: K + σ_n² I = L Lᵀ (jitter escalated if needed), α = L⁻ᵀL⁻¹y and the LML.
   * @param train - scaled inputs.
   * @param y - standardised targets.
   * @param kernel - family.
   * @param h - hyperparameters.
   * @returns the conditioned component (factor kept for variances).
   */
  static condition(train: TrainingInputs, y: Float64Array, kernel: KernelName, h: KernelHyperparameters): GpComponent {
    const { x, n, d } = train;
    const chol = choleskyWithJitter(kernelMatrix(x, n, d, kernel, h), n);
    const alpha = solveLowerTransposed(chol.factor, n, solveLower(chol.factor, n, Float64Array.from(y)));
    let quad = 0;
    for (let i = 0; i < n; i++) quad += y[i]! * alpha[i]!;
    const lml = -0.5 * quad - 0.5 * logDeterminant(chol.factor, n) - 0.5 * n * Math.log(2 * Math.PI);
    return new GpComponent(train, kernel, h, chol.jitter, alpha, lml, chol);
  }

  /**
   * Rebuilds a component from a model file; the Cholesky factor is recomputed (same code, same jitter, so the
   * same bits) the first time a variance is asked for.
   */
  static restore(
    train: TrainingInputs,
    kernel: KernelName,
    h: KernelHyperparameters,
    jitter: number,
    alpha: Float64Array,
    lml: number,
  ): GpComponent {
    return new GpComponent(train, kernel, h, jitter, alpha, lml, undefined);
  }

  /** Cholesky factor of K + (σ_n² + jitter) I. */
  factor(): CholeskyFactor {
    if (!this.#factor.value) {
      const { x, n, d } = this.train;
      const k = kernelMatrix(x, n, d, this.kernel, this.hyperparameters, this.jitter);
      const f = choleskyWithJitter(k, n, { maxTries: 0 });
      this.#factor.value = { factor: f.factor, n, jitter: this.jitter };
    }
    return this.#factor.value;
  }

  /**
   * Standardised posterior mean k*ᵀα and latent variance σ_f² − vᵀv, v = L⁻¹k* (R&W Alg. 2.1) per query row;
   * the solves run 64 query rows at a time (same arithmetic per row as one solve).
   * @param q - flat scaled queries (m × d).
   * @param m - rows.
   * @param withVariance - skip the O(n²) solves when false.
   */
  predict(q: Float64Array, m: number, withVariance: boolean): { mean: Float64Array; variance: Float64Array } {
    const { x, n, d } = this.train;
    const mean = new Float64Array(m);
    const variance = new Float64Array(m);
    const ks = new Float64Array(n);
    const l = withVariance ? this.factor().factor : undefined;
    const block = Math.min(PREDICT_BLOCK, Math.max(1, m));
    const kb = l ? new Float64Array(n * block) : undefined;
    for (let r0 = 0; r0 < m; r0 += block) {
      const mb = Math.min(block, m - r0);
      for (let c = 0; c < mb; c++) {
        crossKernelRow(q, (r0 + c) * d, x, n, d, this.kernel, this.hyperparameters, ks);
        let mu = 0;
        for (let i = 0; i < n; i++) mu += ks[i]! * this.alpha[i]!;
        mean[r0 + c] = mu;
        if (kb) for (let i = 0; i < n; i++) kb[i * mb + c] = ks[i]!;
      }
      if (l && kb) {
        solveLowerMany(l, n, kb, mb);
        for (let c = 0; c < mb; c++) {
          let vv = 0;
          for (let i = 0; i < n; i++) vv += kb[i * mb + c]! * kb[i * mb + c]!;
          variance[r0 + c] = Math.max(0, this.hyperparameters.signalVariance - vv);
        }
      }
    }
    return { mean, variance };
  }

  /**
   * ∂(standardised mean)/∂u_p at one scaled point u: Σ_i α_i σ_f² g'(r_i²) · 2(u_p − x_ip)/ℓ_p² (derived).
   * @param u - scaled point (length d).
   */
  meanGradient(u: Float64Array): Float64Array {
    const { x, n, d } = this.train;
    const g = radialProfile(this.kernel);
    const inv = this.hyperparameters.lengthscales.map((l) => 1 / (l * l));
    const out = new Float64Array(d);
    const diff = new Float64Array(d);
    for (let i = 0; i < n; i++) {
      let r2 = 0;
      for (let p = 0; p < d; p++) {
        const t = u[p]! - x[i * d + p]!;
        diff[p] = t;
        r2 += t * t * inv[p]!;
      }
      const c = this.alpha[i]! * this.hyperparameters.signalVariance * g.dValueDr2(r2) * 2;
      for (let p = 0; p < d; p++) out[p] = out[p]! + c * diff[p]! * inv[p]!;
    }
    return out;
  }

  /**
   * Closed-form leave-one-out (R&W eq. 5.12): μ_i = y_i − α_i/[K⁻¹]_ii, σ_i² = 1/[K⁻¹]_ii (this variance
   * includes the noise σ_n²). y is recovered as K α = L(Lᵀα). Uses one extra n × n copy of L.
   */
  leaveOneOut(): { mean: Float64Array; variance: Float64Array } {
    const { factor: l, n } = this.factor();
    const t = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = i; k < n; k++) s += l[k * n + i]! * this.alpha[k]!;
      t[i] = s;
    }
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k <= i; k++) s += l[i * n + k]! * t[k]!;
      y[i] = s;
    }
    const inv = choleskyInverseInPlace(Float64Array.from(l), n);
    const mean = new Float64Array(n);
    const variance = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const kii = inv[i * n + i]!;
      mean[i] = y[i]! - this.alpha[i]! / kii;
      variance[i] = 1 / kii;
    }
    return { mean, variance };
  }
}
