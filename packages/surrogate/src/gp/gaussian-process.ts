import type { InputScaling } from "../scaling/input-scaling.js";
import { inputSpan, scaleInputs } from "../scaling/input-scaling.js";
import type { OutputScaling } from "../scaling/output-scaling.js";
import type { Prediction, Surrogate } from "../surrogate-types.js";
import { checkMatrix } from "../check-training-data.js";
import { MODEL_FILE_KIND, MODEL_FORMAT_VERSION } from "../model-file/model-file-version.js";
import type { GpModelFile } from "../model-file/gp-model-file-schema.js";
import { sealModelFile } from "../model-file/seal-model-file.js";
import type { GpComponent } from "./gp-component.js";
import type { GpDiagnostics } from "./gp-diagnostics.js";
import type { KernelName } from "./kernels/kernel-name.js";

/** GP predictions: `sd` is the predictive sd of a new observation (with noise), `sdLatent` that of f. */
export interface GpPrediction extends Prediction {
  readonly sd: number[][];
  readonly sdLatent: number[][];
}

/** Everything a fitted GP is made of (built by fitGaussianProcess or loadSurrogate). */
export interface GaussianProcessParts {
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly inputScaling: InputScaling;
  readonly outputScaling: OutputScaling;
  readonly kernel: KernelName;
  readonly ard: boolean;
  readonly components: readonly GpComponent[];
  readonly diagnostics: GpDiagnostics;
  readonly seed: number;
}

/**
 * A fitted Gaussian-process surrogate: one independent GP per target on unit-cube inputs and standardised
 * targets (Rasmussen & Williams 2006, Alg. 2.1). Predictions, gradients and leave-one-out values are in
 * the original units.
 */
export class GaussianProcess implements Surrogate {
  readonly kind = "gp";
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly kernel: KernelName;
  readonly ard: boolean;
  readonly diagnostics: GpDiagnostics;
  readonly #parts: GaussianProcessParts;

  /** @param parts - fitted parts; use fitGaussianProcess or loadSurrogate rather than calling this directly. */
  constructor(parts: GaussianProcessParts) {
    this.#parts = parts;
    this.inputs = parts.inputs;
    this.targets = parts.targets;
    this.kernel = parts.kernel;
    this.ard = parts.ard;
    this.diagnostics = parts.diagnostics;
  }

  /**
   * Posterior mean and standard deviations for a batch of rows (original units).
   * @param x - rows × inputs.
   * @returns mean, sd with noise, latent sd (rows × targets).
   */
  predict(x: readonly (readonly number[])[]): GpPrediction {
    checkMatrix("GaussianProcess.predict", "x", x, this.inputs.length);
    const { inputScaling, outputScaling, components } = this.#parts;
    const q = scaleInputs(inputScaling, x);
    const m = x.length;
    const mean = Array.from({ length: m }, () => new Array<number>(components.length));
    const sd = Array.from({ length: m }, () => new Array<number>(components.length));
    const sdLatent = Array.from({ length: m }, () => new Array<number>(components.length));
    components.forEach((c, j) => {
      const p = c.predict(q, m, true);
      const mu = outputScaling.mean[j]!;
      const s = outputScaling.std[j]!;
      for (let r = 0; r < m; r++) {
        mean[r]![j] = mu + s * p.mean[r]!;
        sdLatent[r]![j] = s * Math.sqrt(p.variance[r]!);
        sd[r]![j] = s * Math.sqrt(p.variance[r]! + c.hyperparameters.noiseVariance);
      }
    });
    return { mean, sd, sdLatent };
  }

  /**
   * Gradient of the posterior mean with respect to the inputs, in original units (chain rule through the scalings).
   * @param x - one row.
   * @returns targets × inputs.
   */
  gradient(x: readonly number[]): number[][] {
    checkMatrix("GaussianProcess.gradient", "x", [x], this.inputs.length);
    const { inputScaling, outputScaling, components } = this.#parts;
    const u = scaleInputs(inputScaling, [x]);
    return components.map((c, j) => {
      const g = c.meanGradient(u);
      return Array.from(g, (v, p) => (outputScaling.std[j]! * v) / inputSpan(inputScaling, p));
    });
  }

  /**
   * Closed-form leave-one-out predictions of every training row (Rasmussen & Williams 2006, eq. 5.12),
   * original units; `sd` includes the noise.
   * @returns mean and sd, rows × targets.
   */
  leaveOneOut(): { mean: number[][]; sd: number[][] } {
    const { outputScaling, components } = this.#parts;
    const n = components[0]?.train.n ?? 0;
    const mean = Array.from({ length: n }, () => new Array<number>(components.length));
    const sd = Array.from({ length: n }, () => new Array<number>(components.length));
    components.forEach((c, j) => {
      const loo = c.leaveOneOut();
      for (let i = 0; i < n; i++) {
        mean[i]![j] = outputScaling.mean[j]! + outputScaling.std[j]! * loo.mean[i]!;
        sd[i]![j] = outputScaling.std[j]! * Math.sqrt(loo.variance[i]!);
      }
    });
    return { mean, sd };
  }

  /**
   * Log marginal likelihood of each target's standardised data at the fitted hyperparameters (R&W eq. 2.30).
   * @returns one value per target.
   */
  logMarginalLikelihood(): number[] {
    return this.#parts.components.map((c) => c.logMarginalLikelihood);
  }

  /** The hyperparameters of each target (scaled units). */
  hyperparameters(): { lengthscales: number[]; signalVariance: number; noiseVariance: number }[] {
    return this.#parts.components.map((c) => ({
      lengthscales: [...c.hyperparameters.lengthscales],
      signalVariance: c.hyperparameters.signalVariance,
      noiseVariance: c.hyperparameters.noiseVariance,
    }));
  }

  /** The versioned model file (see the README, "Model file format"). */
  toJSON(): GpModelFile {
    const p = this.#parts;
    const train = p.components[0]!.train;
    const xs: number[][] = [];
    for (let i = 0; i < train.n; i++) xs.push(Array.from(train.x.subarray(i * train.d, (i + 1) * train.d)));
    return sealModelFile({
      kind: MODEL_FILE_KIND,
      formatVersion: MODEL_FORMAT_VERSION,
      modelType: "gp",
      inputs: [...p.inputs],
      targets: [...p.targets],
      inputScaling: { lower: [...p.inputScaling.lower], upper: [...p.inputScaling.upper] },
      outputScaling: { mean: [...p.outputScaling.mean], std: [...p.outputScaling.std] },
      payload: {
        kernel: p.kernel,
        ard: p.ard,
        trainingInputs: xs,
        components: p.components.map((c) => ({
          lengthscales: [...c.hyperparameters.lengthscales],
          signalVariance: c.hyperparameters.signalVariance,
          noiseVariance: c.hyperparameters.noiseVariance,
          jitter: c.jitter,
          alpha: Array.from(c.alpha),
          logMarginalLikelihood: c.logMarginalLikelihood,
        })),
      },
      training: {
        n: train.n,
        seed: p.seed,
        hyperparameterRows: p.diagnostics.hyperparameterRows,
        polishIterations: p.diagnostics.polishIterations,
        diagnostics: p.diagnostics.targets.map((t) => ({ ...t, conditionNumber: finiteOrNull(t.conditionNumber) })),
      },
    });
  }
}

function finiteOrNull(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}
