import type { GaussianProcessOptions } from "./gaussian-process-options.js";
import { DEFAULT_GP_MEMORY_BUDGET } from "./check-gp-memory.js";
import type { HyperparameterLayout, KernelHyperparameters } from "./kernels/kernel-hyperparameters.js";
import { KERNEL_NAMES } from "./kernels/kernel-name.js";
import type { KernelName } from "./kernels/kernel-name.js";

/** Options with defaults filled in and validated. */
export interface ResolvedGpOptions {
  readonly kernel: KernelName;
  readonly ard: boolean;
  readonly noiseVariance: number | undefined;
  readonly inputBounds: { readonly lower: readonly number[]; readonly upper: readonly number[] } | undefined;
  readonly fixed: KernelHyperparameters[] | undefined;
  readonly restarts: number;
  readonly seed: number;
  readonly maxIterations: number;
  readonly subset: number | false;
  readonly polishIterations: number | undefined;
  readonly probeLengthscales: boolean;
  readonly memoryBudgetBytes: number;
  /** Log-space bounds and start box for a layout. */
  search(layout: HyperparameterLayout): { logLower: Float64Array; logUpper: Float64Array; startLower: Float64Array; startUpper: Float64Array };
}

const positiveNumber = (fn: string, field: string, v: unknown, allowZero = false): number => {
  if (typeof v !== "number") throw new TypeError(`${fn}: ${field} must be a number, got ${typeof v}`);
  if (!Number.isFinite(v) || (allowZero ? v < 0 : v <= 0)) {
    throw new RangeError(`${fn}: ${field} must be a finite number ${allowZero ? "≥" : ">"} 0, got ${v}`);
  }
  return v;
};

const range = (fn: string, field: string, v: readonly [number, number] | undefined, dflt: [number, number]): [number, number] => {
  if (v === undefined) return dflt;
  const lo = positiveNumber(fn, `${field}[0]`, v[0]);
  const hi = positiveNumber(fn, `${field}[1]`, v[1]);
  if (hi < lo) throw new RangeError(`${fn}: ${field} must have lower ≤ upper, got [${lo}, ${hi}]`);
  return [lo, hi];
};

/**
 * Largest fixed noise variance (standardised target units: the target's own variance is 1). Far beyond any
 * meaningful noise; above it the kernel matrix's products overflow double precision (derived: its entries
 * reach the noise variance, and their squares must stay below Number.MAX_VALUE ≈ 1.8·10^308).
 */
const MAX_NOISE_VARIANCE = 1e100;

/**
 * Fills in and validates fitGaussianProcess options.
 * @param fn - caller name for messages.
 * @param o - user options.
 * @param d - inputs.
 * @param t - targets.
 * @returns resolved options.
 */
export function resolveGpOptions(fn: string, o: GaussianProcessOptions, d: number, t: number): ResolvedGpOptions {
  if (typeof o !== "object" || o === null) throw new TypeError(`${fn}: options must be an object`);
  const kernel = o.kernel ?? "matern52";
  if (!KERNEL_NAMES.includes(kernel)) throw new RangeError(`${fn}: options.kernel must be one of ${KERNEL_NAMES.join(", ")}, got ${String(kernel)}`);
  const ard = o.ard ?? true;
  const noiseVariance = o.noiseVariance === undefined ? undefined : positiveNumber(fn, "options.noiseVariance", o.noiseVariance, true);
  if (noiseVariance !== undefined && noiseVariance > MAX_NOISE_VARIANCE) {
    throw new RangeError(
      `${fn}: options.noiseVariance must be ≤ ${MAX_NOISE_VARIANCE} (standardised target units, where the target's variance is 1), got ${noiseVariance}`,
    );
  }
  const floor = positiveNumber(fn, "options.noiseFloor", o.noiseFloor ?? 1e-6);
  const ceiling = positiveNumber(fn, "options.noiseCeiling", o.noiseCeiling ?? 1);
  if (ceiling < floor) throw new RangeError(`${fn}: options.noiseCeiling must be ≥ options.noiseFloor`);
  const ls = range(fn, "options.lengthscaleBounds", o.lengthscaleBounds, [1e-2, 1e3]);
  const sv = range(fn, "options.signalVarianceBounds", o.signalVarianceBounds, [1e-3, 1e6]);
  const int = (field: string, v: number | undefined, dflt: number, min: number): number => {
    const x = v ?? dflt;
    if (typeof x !== "number") throw new TypeError(`${fn}: ${field} must be a number`);
    if (!Number.isInteger(x) || x < min) throw new RangeError(`${fn}: ${field} must be an integer ≥ ${min}, got ${x}`);
    return x;
  };
  let fixed: KernelHyperparameters[] | undefined;
  if (o.hyperparameters !== undefined) {
    if (!Array.isArray(o.hyperparameters) || o.hyperparameters.length !== t) {
      throw new RangeError(`${fn}: options.hyperparameters must have one entry per target (${t})`);
    }
    fixed = o.hyperparameters.map((h, j) => {
      const raw = typeof h.lengthscales === "number" ? new Array<number>(d).fill(h.lengthscales) : [...h.lengthscales];
      if (raw.length !== d) throw new RangeError(`${fn}: options.hyperparameters[${j}].lengthscales must have ${d} entries, got ${raw.length}`);
      raw.forEach((l, k) => positiveNumber(fn, `options.hyperparameters[${j}].lengthscales[${k}]`, l));
      return {
        lengthscales: raw,
        signalVariance: positiveNumber(fn, `options.hyperparameters[${j}].signalVariance`, h.signalVariance),
        noiseVariance: positiveNumber(fn, `options.hyperparameters[${j}].noiseVariance`, h.noiseVariance, true),
      };
    });
  }
  const subset = o.hyperparameterSubset === false ? false : int("options.hyperparameterSubset", o.hyperparameterSubset, 600, 1);
  const probeLengthscales = o.probeLengthscales ?? true;
  if (typeof probeLengthscales !== "boolean") throw new TypeError(`${fn}: options.probeLengthscales must be a boolean, got ${typeof probeLengthscales}`);
  const seed = o.seed ?? 0;
  if (typeof seed !== "number" || !Number.isFinite(seed)) throw new RangeError(`${fn}: options.seed must be a finite number, got ${seed}`);
  return {
    kernel,
    ard,
    noiseVariance,
    inputBounds: o.inputBounds,
    fixed,
    restarts: int("options.restarts", o.restarts, 3, 1),
    seed,
    maxIterations: int("options.maxIterations", o.maxIterations, 200, 1),
    subset,
    probeLengthscales,
    polishIterations: o.polishIterations === undefined ? undefined : int("options.polishIterations", o.polishIterations, 0, 0),
    memoryBudgetBytes: positiveNumber(fn, "options.memoryBudgetBytes", o.memoryBudgetBytes ?? DEFAULT_GP_MEMORY_BUDGET),
    search(layout) {
      const nl = layout.ard ? layout.dims : 1;
      const len = nl + 1 + (layout.learnNoise ? 1 : 0);
      const lo = new Float64Array(len);
      const hi = new Float64Array(len);
      const slo = new Float64Array(len);
      const shi = new Float64Array(len);
      const set = (i: number, b: [number, number], s: [number, number]): void => {
        lo[i] = Math.log(b[0]);
        hi[i] = Math.log(b[1]);
        slo[i] = Math.log(Math.min(Math.max(s[0], b[0]), b[1]));
        shi[i] = Math.log(Math.max(Math.min(s[1], b[1]), b[0]));
      };
      for (let k = 0; k < nl; k++) set(k, ls, [0.1, 1.5]);
      set(nl, sv, [0.5, 2]);
      if (layout.learnNoise) set(nl + 1, [floor, ceiling], [floor, Math.max(floor, 1e-2)]);
      return { logLower: lo, logUpper: hi, startLower: slo, startUpper: shi };
    },
  };
}
