import { availableParallelism } from "node:os";
import type { TrainingData } from "../surrogate-types.js";
import { completeGpFit, type GpTargetSearchResult } from "./complete-gp-fit.js";
import { bestOfRestarts, hyperparameterStarts } from "./fit/fit-hyperparameters.js";
import { choosePolishStart, polishCandidates } from "./fit/polish-start.js";
import { runRestartsOnWorkers } from "./fit/run-restarts-on-workers.js";
import type { GaussianProcess } from "./gaussian-process.js";
import type { GaussianProcessOptions } from "./gaussian-process-options.js";
import { planGpFit } from "./gp-fit-plan.js";
import { polishSearch } from "./polish-search.js";

const FN = "fitGaussianProcessParallel";

/** Options of fitGaussianProcessParallel: those of fitGaussianProcess plus the number of threads. */
export interface ParallelGaussianProcessOptions extends GaussianProcessOptions {
  /** Most worker threads at once (an integer ≥ 1; default os.availableParallelism()). 1 runs on the calling thread. */
  readonly workers?: number;
}

/**
 * fitGaussianProcess with the hyperparameter restarts of every target (and, after a subset fit, each target's probes
 * and polish on all rows) run side by side on worker threads: the same plan, the same restarts from the same starts, the best
 * chosen in start order, so the model is the one fitGaussianProcess returns, bit for bit (only `fitTimeMs` differs).
 * Conditioning on all rows (one Cholesky factorisation per target) stays on the calling thread.
 * @param data - training rows (finite numbers; at least one row).
 * @param options - fitGaussianProcess's options and `workers`.
 * @returns a promise of the fitted GaussianProcess.
 * @throws TypeError / RangeError naming the field (before any thread starts).
 */
export async function fitGaussianProcessParallel(data: TrainingData, options: ParallelGaussianProcessOptions = {}): Promise<GaussianProcess> {
  if (typeof options !== "object" || options === null) throw new TypeError(`${FN}: options must be an object`);
  const { workers: given, ...gpOptions } = options;
  let workers = availableParallelism();
  if (given !== undefined) {
    if (typeof given !== "number") throw new TypeError(`${FN}: options.workers must be a number, got ${typeof given}`);
    if (!Number.isSafeInteger(given) || given < 1) throw new RangeError(`${FN}: options.workers must be an integer ≥ 1, got ${given}`);
    workers = given;
  }
  const plan = planGpFit(FN, data, gpOptions);
  const searched = plan.targets.flatMap((t, j) => (t.search === undefined ? [] : [{ j, target: t, search: t.search }]));
  const tasks = searched.flatMap(({ j, target, search }) =>
    hyperparameterStarts(search).map((start) => ({ j, x: plan.xFit, y: target.yFit, search, start })),
  );
  const restarts = await runRestartsOnWorkers(tasks, workers);
  const searches: (GpTargetSearchResult | undefined)[] = plan.targets.map(() => undefined);
  const fits = searched.map(({ j, search }) => ({ j, search, fit: bestOfRestarts(search, restarts.filter((_, i) => tasks[i]!.j === j)) }));
  if (plan.polish === 0) {
    fits.forEach(({ j, fit }) => (searches[j] = { fit, polished: undefined }));
    return completeGpFit(plan, searches);
  }
  // Probes of every target's subset optimum on all rows, side by side; then each polish from its best candidate.
  const candidates = fits.map(({ search, fit }) => polishCandidates(search, fit, plan.probe, plan.data.inputs));
  const probeTasks = fits.flatMap(({ j, search }, k) =>
    candidates[k]!.length > 1 ? candidates[k]!.map((c) => ({ k, x: plan.x, y: plan.targets[j]!.y, search, start: c.theta, probe: true })) : [],
  );
  const probeOutcomes = await runRestartsOnWorkers(probeTasks, workers);
  const starts = fits.map((_, k) => choosePolishStart(candidates[k]!, probeOutcomes.filter((_, i) => probeTasks[i]!.k === k)));
  const polishes = fits.map(({ search }, k) => polishSearch(search, starts[k]!.theta, plan.polish));
  const polishTasks = fits.map(({ j }, k) => ({ x: plan.x, y: plan.targets[j]!.y, search: polishes[k]!, start: starts[k]!.theta }));
  const polishOutcomes = await runRestartsOnWorkers(polishTasks, workers);
  fits.forEach(({ j, fit }, k) => {
    searches[j] = { fit, polished: bestOfRestarts(polishes[k]!, [polishOutcomes[k]!]), polishStart: starts[k]!.label };
  });
  return completeGpFit(plan, searches);
}
