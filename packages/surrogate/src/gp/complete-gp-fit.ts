import { conditionEstimate } from "../linalg/condition-estimate.js";
import type { HyperparameterFitResult } from "./fit/fit-hyperparameters.js";
import { GaussianProcess } from "./gaussian-process.js";
import type { GpFitPlan } from "./gp-fit-plan.js";
import { GpComponent } from "./gp-component.js";
import type { GpTargetDiagnostics } from "./gp-diagnostics.js";
import type { HyperparameterLayout, KernelHyperparameters } from "./kernels/kernel-hyperparameters.js";
import { hyperparametersFromTheta } from "./kernels/kernel-hyperparameters.js";

/** A target's searches: the hyperparameter-row fit and, after a subset fit, its polish on all rows. */
export interface GpTargetSearchResult {
  readonly fit: HyperparameterFitResult;
  readonly polished: HyperparameterFitResult | undefined;
  /** Label of the polish's start (see polishCandidates), when there was a polish. */
  readonly polishStart?: string;
}

/**
 * Finishes a planned GP fit: each target conditioned on all rows with its fitted (or given) hyperparameters
 * (Rasmussen & Williams 2006, Alg. 2.1), with its diagnostics (jitter, condition number, θ on a bound, the
 * restarts' log marginal likelihoods).
 * @param plan - from planGpFit. @param searches - one per target (undefined when the hyperparameters are fixed).
 * @returns the fitted GaussianProcess.
 */
export function completeGpFit(plan: GpFitPlan, searches: readonly (GpTargetSearchResult | undefined)[]): GaussianProcess {
  const o = plan.options;
  const train = { x: plan.x, n: plan.n, d: plan.d };
  const components: GpComponent[] = [];
  const diagnostics: GpTargetDiagnostics[] = [];
  plan.targets.forEach((target, j) => {
    let h: KernelHyperparameters;
    let restarts: number[] = [];
    let onBounds: string[] = [];
    let polishStart: string | undefined;
    const s = searches[j];
    if (o.fixed || s === undefined) {
      h = o.fixed![j]!;
    } else {
      restarts = s.fit.restarts.map((r) => r.logMarginalLikelihood);
      const fit = s.polished ?? s.fit;
      polishStart = s.polishStart;
      h = hyperparametersFromTheta(plan.layout, fit.theta);
      onBounds = fit.onBound.flatMap((b, i) => (b ? [`${thetaName(plan.layout, plan.data.inputs, i)}=${b}`] : []));
    }
    const c = GpComponent.condition(train, target.y, o.kernel, h);
    components.push(c);
    const f = c.factor();
    const cond = conditionEstimate(f.factor, plan.n);
    const warnings: string[] = [];
    if (c.jitter > 0) warnings.push(`kernel matrix near-singular: added jitter ${c.jitter.toExponential(2)} to its diagonal`);
    if (cond > 1e10) warnings.push(`kernel matrix near-singular: condition number ≈ ${cond.toExponential(2)}`);
    if (onBounds.length) warnings.push(`hyperparameters on a bound: ${onBounds.join(", ")}`);
    diagnostics.push({
      target: plan.data.targets[j]!,
      jitter: c.jitter,
      conditionNumber: cond,
      onBounds,
      warnings,
      restartLogMarginalLikelihoods: restarts,
      ...(polishStart === undefined ? {} : { polishStart }),
    });
  });
  return new GaussianProcess({
    inputs: [...plan.data.inputs],
    targets: [...plan.data.targets],
    inputScaling: plan.inputScaling,
    outputScaling: plan.outputScaling,
    kernel: o.kernel,
    ard: o.ard,
    components,
    seed: o.seed,
    diagnostics: {
      targets: diagnostics,
      fitTimeMs: performance.now() - plan.started,
      hyperparameterRows: o.fixed ? 0 : plan.m,
      polishIterations: plan.polish,
    },
  });
}

function thetaName(layout: HyperparameterLayout, inputs: readonly string[], i: number): string {
  const nl = layout.ard ? layout.dims : 1;
  if (i < nl) return layout.ard ? `lengthscale[${inputs[i]}]` : "lengthscale";
  return i === nl ? "signalVariance" : "noiseVariance";
}
