import { conditionEstimate } from "../linalg/condition-estimate.js";
import { createInputScaling, scaleInputs } from "../scaling/input-scaling.js";
import { createOutputScaling, standardiseTarget } from "../scaling/output-scaling.js";
import type { TrainingData } from "../surrogate-types.js";
import { GaussianProcess } from "./gaussian-process.js";
import type { GaussianProcessOptions } from "./gaussian-process-options.js";
import { checkGpMemory } from "./check-gp-memory.js";
import { GpComponent } from "./gp-component.js";
import type { GpTargetDiagnostics } from "./gp-diagnostics.js";
import { fitHyperparameters } from "./fit/fit-hyperparameters.js";
import { greedyMaximinSubset } from "./fit/greedy-maximin-subset.js";
import type { HyperparameterLayout, KernelHyperparameters } from "./kernels/kernel-hyperparameters.js";
import { hyperparametersFromTheta } from "./kernels/kernel-hyperparameters.js";
import { resolveGpOptions } from "./resolve-gp-options.js";
import { checkTrainingData } from "../check-training-data.js";

const FN = "fitGaussianProcess";

/**
 * Fits a Gaussian-process surrogate: inputs to the unit cube, each target standardised, one independent GP per
 * target; hyperparameters by type-II maximum likelihood (analytic gradient, bounded projected L-BFGS, seeded
 * Latin-hypercube restarts), optionally on a greedy maximin subset of the rows (then polished by a few iterations
 * on all rows), then conditioned on all rows
 * (Rasmussen & Williams 2006, Alg. 2.1 and §5.4.1).
 * @param data - training rows (finite numbers; at least one row).
 * @param options - kernel, ARD, noise, bounds, restarts, seed, subset size, memory budget (see GaussianProcessOptions).
 * @returns the fitted GaussianProcess.
 * @throws TypeError / RangeError naming the field (row and column for a bad cell); RangeError beyond the memory budget.
 */
export function fitGaussianProcess(data: TrainingData, options: GaussianProcessOptions = {}): GaussianProcess {
  const started = performance.now();
  checkTrainingData(FN, data);
  const o = resolveGpOptions(FN, options, data.inputs.length, data.targets.length);
  const n = data.x.length;
  const d = data.inputs.length;
  const t = data.targets.length;
  const m = o.fixed ? 0 : o.subset === false ? n : Math.min(n, o.subset);
  const polish = m < n ? (o.polishIterations ?? (n <= 2000 ? 10 : 0)) : 0;
  checkGpMemory(FN, n, d, t, polish > 0 ? n : m, o.memoryBudgetBytes);
  const inputScaling = createInputScaling(data.x, o.inputBounds);
  const outputScaling = createOutputScaling(data.y);
  const x = scaleInputs(inputScaling, data.x);
  const train = { x, n, d };
  const layout: HyperparameterLayout = {
    dims: d,
    ard: o.ard,
    learnNoise: o.noiseVariance === undefined,
    fixedNoise: o.noiseVariance ?? 0,
  };
  const subsetRows = m < n ? greedyMaximinSubset(x, n, d, m) : undefined;
  const xFit = subsetRows ? pick(x, d, subsetRows) : x;
  const components: GpComponent[] = [];
  const diagnostics: GpTargetDiagnostics[] = [];
  for (let j = 0; j < t; j++) {
    const y = standardiseTarget(outputScaling, data.y, j);
    let h: KernelHyperparameters;
    let restarts: number[] = [];
    let onBounds: string[] = [];
    if (o.fixed) {
      h = o.fixed[j]!;
    } else {
      const yFit = subsetRows ? Float64Array.from(subsetRows, (i) => y[i]!) : y;
      const search = { kernel: o.kernel, layout, ...o.search(layout), restarts: o.restarts, seed: o.seed + 7919 * j, maxIterations: o.maxIterations };
      let fit = fitHyperparameters(xFit, yFit, search);
      restarts = fit.restarts.map((r) => r.logMarginalLikelihood);
      if (polish > 0) {
        // Polish the subset's optimum on all rows: a few L-BFGS iterations from it (documented option).
        fit = fitHyperparameters(x, y, { ...search, starts: [fit.theta], maxIterations: polish });
      }
      h = hyperparametersFromTheta(layout, fit.theta);
      onBounds = fit.onBound.flatMap((b, i) => (b ? [`${thetaName(layout, data.inputs, i)}=${b}`] : []));
    }
    const c = GpComponent.condition(train, y, o.kernel, h);
    components.push(c);
    const f = c.factor();
    const cond = conditionEstimate(f.factor, n);
    const warnings: string[] = [];
    if (c.jitter > 0) warnings.push(`kernel matrix near-singular: added jitter ${c.jitter.toExponential(2)} to its diagonal`);
    if (cond > 1e10) warnings.push(`kernel matrix near-singular: condition number ≈ ${cond.toExponential(2)}`);
    if (onBounds.length) warnings.push(`hyperparameters on a bound: ${onBounds.join(", ")}`);
    diagnostics.push({
      target: data.targets[j]!,
      jitter: c.jitter,
      conditionNumber: cond,
      onBounds,
      warnings,
      restartLogMarginalLikelihoods: restarts,
    });
  }
  return new GaussianProcess({
    inputs: [...data.inputs],
    targets: [...data.targets],
    inputScaling,
    outputScaling,
    kernel: o.kernel,
    ard: o.ard,
    components,
    seed: o.seed,
    diagnostics: { targets: diagnostics, fitTimeMs: performance.now() - started, hyperparameterRows: o.fixed ? 0 : m, polishIterations: polish },
  });
}

function pick(x: Float64Array, d: number, rows: readonly number[]): Float64Array {
  const out = new Float64Array(rows.length * d);
  rows.forEach((r, i) => out.set(x.subarray(r * d, (r + 1) * d), i * d));
  return out;
}

function thetaName(layout: HyperparameterLayout, inputs: readonly string[], i: number): string {
  const nl = layout.ard ? layout.dims : 1;
  if (i < nl) return layout.ard ? `lengthscale[${inputs[i]}]` : "lengthscale";
  return i === nl ? "signalVariance" : "noiseVariance";
}
