import { checkTrainingData } from "../check-training-data.js";
import { createInputScaling, scaleInputs, type InputScaling } from "../scaling/input-scaling.js";
import { createOutputScaling, standardiseTarget, type OutputScaling } from "../scaling/output-scaling.js";
import type { TrainingData } from "../surrogate-types.js";
import { checkGpMemory } from "./check-gp-memory.js";
import type { HyperparameterSearch } from "./fit/fit-hyperparameters.js";
import { greedyMaximinSubset } from "./fit/greedy-maximin-subset.js";
import type { GaussianProcessOptions } from "./gaussian-process-options.js";
import type { HyperparameterLayout } from "./kernels/kernel-hyperparameters.js";
import { resolveGpOptions, type ResolvedGpOptions } from "./resolve-gp-options.js";

/** One target's part of a GP fit: its standardised values and, unless hyperparameters are given, its search. */
export interface GpTargetPlan {
  /** Standardised target on all rows. */
  readonly y: Float64Array;
  /** The same on the hyperparameter rows (the subset, or all rows). */
  readonly yFit: Float64Array;
  /** Search settings (undefined when the hyperparameters are fixed). */
  readonly search: HyperparameterSearch | undefined;
}

/** Everything a GP fit decides before its hyperparameter searches (shared by the serial and the threaded fit). */
export interface GpFitPlan {
  readonly data: TrainingData;
  readonly options: ResolvedGpOptions;
  readonly started: number;
  readonly n: number;
  readonly d: number;
  /** Rows the hyperparameters are fitted on (0 when fixed). */
  readonly m: number;
  /** L-BFGS iterations on all rows after a subset fit (0 for none). */
  readonly polish: number;
  /** Whether the polish compares the subset's optimum with its shorter-lengthscale probes on all rows first. */
  readonly probe: boolean;
  readonly inputScaling: InputScaling;
  readonly outputScaling: OutputScaling;
  readonly layout: HyperparameterLayout;
  /** Scaled inputs on all rows, flat. */
  readonly x: Float64Array;
  /** Scaled inputs on the hyperparameter rows, flat. */
  readonly xFit: Float64Array;
  readonly targets: readonly GpTargetPlan[];
}

/**
 * Checks the data and options of a GP fit and prepares it: options resolved, memory checked, inputs scaled to the
 * unit cube, each target standardised, the greedy maximin subset picked, one search per target (seed
 * options.seed + 7919·j).
 * @param fn - the public function named in messages. @param data - training rows. @param options - GP options.
 * @returns the plan.
 * @throws TypeError / RangeError naming the field; RangeError beyond the memory budget.
 */
export function planGpFit(fn: string, data: TrainingData, options: GaussianProcessOptions): GpFitPlan {
  const started = performance.now();
  checkTrainingData(fn, data);
  const o = resolveGpOptions(fn, options, data.inputs.length, data.targets.length);
  const n = data.x.length;
  const d = data.inputs.length;
  const t = data.targets.length;
  const m = o.fixed ? 0 : o.subset === false ? n : Math.min(n, o.subset);
  const polish = m < n ? (o.polishIterations ?? (n <= 2000 ? 10 : 0)) : 0;
  checkGpMemory(fn, n, d, t, polish > 0 ? n : m, o.memoryBudgetBytes);
  const inputScaling = createInputScaling(data.x, o.inputBounds);
  const outputScaling = createOutputScaling(data.y);
  const x = scaleInputs(inputScaling, data.x);
  const layout: HyperparameterLayout = {
    dims: d,
    ard: o.ard,
    learnNoise: o.noiseVariance === undefined,
    fixedNoise: o.noiseVariance ?? 0,
  };
  const subsetRows = m < n ? greedyMaximinSubset(x, n, d, m) : undefined;
  const xFit = subsetRows ? pick(x, d, subsetRows) : x;
  const targets: GpTargetPlan[] = [];
  for (let j = 0; j < t; j++) {
    const y = standardiseTarget(outputScaling, data.y, j);
    const yFit = subsetRows ? Float64Array.from(subsetRows, (i) => y[i]!) : y;
    const search = o.fixed
      ? undefined
      : { kernel: o.kernel, layout, ...o.search(layout), restarts: o.restarts, seed: o.seed + 7919 * j, maxIterations: o.maxIterations };
    targets.push({ y, yFit, search });
  }
  const probe = polish > 0 && o.probeLengthscales && o.ard;
  return { data, options: o, started, n, d, m, polish, probe, inputScaling, outputScaling, layout, x, xFit, targets };
}

function pick(x: Float64Array, d: number, rows: readonly number[]): Float64Array {
  const out = new Float64Array(rows.length * d);
  rows.forEach((r, i) => out.set(x.subarray(r * d, (r + 1) * d), i * d));
  return out;
}
