/** Hyperparameters of one GP in scaled units (inputs in the unit cube, standardised target). */
export interface KernelHyperparameters {
  /** One lengthscale per input (with a shared lengthscale every entry is equal). */
  readonly lengthscales: readonly number[];
  /** Signal variance σ_f². */
  readonly signalVariance: number;
  /** Gaussian noise variance σ_n². */
  readonly noiseVariance: number;
}

/** Which hyperparameters are free and how they map to the log-parameter vector θ. */
export interface HyperparameterLayout {
  readonly dims: number;
  /** true: one lengthscale per input (ARD); false: one shared lengthscale. */
  readonly ard: boolean;
  /** true: log σ_n² is the last entry of θ; false: the noise is held at `fixedNoise`. */
  readonly learnNoise: boolean;
  readonly fixedNoise: number;
}

/**
 * Number of entries of θ = (log ℓ…, log σ_f², [log σ_n²]).
 * @param layout - the layout.
 * @returns the length of θ.
 */
export function thetaLength(layout: HyperparameterLayout): number {
  return (layout.ard ? layout.dims : 1) + 1 + (layout.learnNoise ? 1 : 0);
}

/**
 * Unpacks θ (natural logs, layout above) into hyperparameters.
 * @param layout - the layout.
 * @param theta - log-parameter vector.
 * @returns the hyperparameters.
 */
export function hyperparametersFromTheta(layout: HyperparameterLayout, theta: ArrayLike<number>): KernelHyperparameters {
  const nl = layout.ard ? layout.dims : 1;
  const lengthscales: number[] = [];
  for (let k = 0; k < layout.dims; k++) lengthscales.push(Math.exp(theta[layout.ard ? k : 0]!));
  return {
    lengthscales,
    signalVariance: Math.exp(theta[nl]!),
    noiseVariance: layout.learnNoise ? Math.exp(theta[nl + 1]!) : layout.fixedNoise,
  };
}

/**
 * Packs hyperparameters into θ (the inverse of {@link hyperparametersFromTheta}).
 * @param layout - the layout.
 * @param h - hyperparameters.
 * @returns θ.
 */
export function thetaFromHyperparameters(layout: HyperparameterLayout, h: KernelHyperparameters): Float64Array {
  const theta = new Float64Array(thetaLength(layout));
  const nl = layout.ard ? layout.dims : 1;
  for (let k = 0; k < nl; k++) theta[k] = Math.log(h.lengthscales[k]!);
  theta[nl] = Math.log(h.signalVariance);
  if (layout.learnNoise) theta[nl + 1] = Math.log(h.noiseVariance);
  return theta;
}
