import type { TrainingData } from "../surrogate-types.js";
import { completeGpFit } from "./complete-gp-fit.js";
import { fitHyperparameters, runProbe } from "./fit/fit-hyperparameters.js";
import { choosePolishStart, polishCandidates } from "./fit/polish-start.js";
import type { GaussianProcess } from "./gaussian-process.js";
import type { GaussianProcessOptions } from "./gaussian-process-options.js";
import { planGpFit } from "./gp-fit-plan.js";
import { polishSearch } from "./polish-search.js";

/**
 * Fits a Gaussian-process surrogate: inputs to the unit cube, each target standardised, one independent GP per
 * target; hyperparameters by type-II maximum likelihood (analytic gradient, bounded projected L-BFGS, seeded
 * Latin-hypercube restarts), optionally on a greedy maximin subset of the rows (then polished by a few iterations
 * on all rows, from the best of the subset's optimum and its shorter-lengthscale probes), then conditioned on all rows
 * (Rasmussen & Williams 2006, Alg. 2.1 and §5.4.1). Everything runs on the calling thread, restarts one after
 * another; fitGaussianProcessParallel gives the same model with the restarts on worker threads.
 * @param data - training rows (finite numbers; at least one row).
 * @param options - kernel, ARD, noise, bounds, restarts, seed, subset size, memory budget (see GaussianProcessOptions).
 * @returns the fitted GaussianProcess.
 * @throws TypeError / RangeError naming the field (row and column for a bad cell); RangeError beyond the memory budget.
 */
export function fitGaussianProcess(data: TrainingData, options: GaussianProcessOptions = {}): GaussianProcess {
  const plan = planGpFit("fitGaussianProcess", data, options);
  const searches = plan.targets.map((target) => {
    if (target.search === undefined) return undefined;
    const search = target.search;
    const fit = fitHyperparameters(plan.xFit, target.yFit, search);
    if (plan.polish === 0) return { fit, polished: undefined };
    // Polish on all rows: a few L-BFGS iterations from the best of the subset's optimum and its probes.
    const candidates = polishCandidates(search, fit, plan.probe, plan.data.inputs);
    const outcomes = candidates.length > 1 ? candidates.map((c) => runProbe(plan.x, target.y, search, c.theta)) : [];
    const start = choosePolishStart(candidates, outcomes);
    const polished = fitHyperparameters(plan.x, target.y, polishSearch(search, start.theta, plan.polish));
    return { fit, polished, polishStart: start.label };
  });
  return completeGpFit(plan, searches);
}
