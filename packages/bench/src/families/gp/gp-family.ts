import { KERNEL_NAMES, fitGaussianProcess, fitGaussianProcessParallel, type KernelName } from "@floorcast/surrogate";
import { UsageError } from "../../cli/usage-error.js";
import type { ModelFamily } from "../model-family.js";
import { parseWhole } from "../../cli/parse-whole.js";

/**
 * The Gaussian-process family (`--model gp`): fitGaussianProcessParallel (the restarts on worker threads; the same
 * model as fitGaussianProcess) with a Matérn 5/2 ARD kernel by default,
 * hyperparameters by maximum marginal likelihood with seeded restarts (Rasmussen & Williams 2006, ch. 5).
 */
export const gpFamily: ModelFamily = {
  name: "gp",
  modelType: "gp",
  summary: "Gaussian process (kernel, ARD lengthscales, restarts)",
  options: [
    { flags: "--kernel <name>", description: `gp: kernel family (${KERNEL_NAMES.join(", ")})`, default: "matern52" },
    { flags: "--shared-lengthscale", description: "gp: one lengthscale for every input instead of one per input (ARD)" },
    { flags: "--noise <variance>", description: "gp: fix the noise variance (standardised target units) instead of learning it" },
    { flags: "--restarts <n>", description: "gp: optimizer starts per target", default: "3" },
    { flags: "--subset <m>", description: "gp: fit hyperparameters on a maximin subset of m rows, then condition on all (0 = all rows)", default: "600" },
    { flags: "--polish <k>", description: "gp: after a subset fit, at most k optimizer iterations on all rows (default 10 up to 2,000 rows, else 0)" },
    { flags: "--threads <n>", description: "gp: worker threads for the optimizer starts (default: one per core; the model does not depend on it)" },
  ],
  async fit(data, opts, seed, say) {
    const kernel = String(opts.kernel);
    if (!(KERNEL_NAMES as readonly string[]).includes(kernel)) throw new UsageError(`fit: --kernel must be one of ${KERNEL_NAMES.join(", ")}, got ${kernel}`);
    const noise = opts.noise === undefined ? undefined : String(opts.noise).trim() === "" ? NaN : Number(opts.noise);
    if (noise !== undefined && !(Number.isFinite(noise) && noise >= 0)) throw new UsageError(`fit: --noise must be a number ≥ 0, got ${String(opts.noise)}`);
    const subset = parseWhole("fit", "--subset", String(opts.subset), 0);
    const gp = await fitGaussianProcessParallel(data, {
      kernel: kernel as KernelName,
      ard: opts.sharedLengthscale !== true,
      noiseVariance: noise,
      restarts: parseWhole("fit", "--restarts", String(opts.restarts), 1),
      seed,
      hyperparameterSubset: subset === 0 ? false : subset,
      polishIterations: opts.polish === undefined ? undefined : parseWhole("fit", "--polish", String(opts.polish), 0),
      ...(opts.threads === undefined ? {} : { workers: parseWhole("fit", "--threads", String(opts.threads), 1) }),
    });
    gp.diagnostics.targets.forEach((t, j) => {
      const polish = t.polishStart === undefined ? "" : `; polished on all rows from the ${t.polishStart}`;
      say(`fit: ${t.target}: log marginal likelihood ${gp.logMarginalLikelihood()[j]!.toFixed(3)} (standardised target)${polish}`);
      for (const w of t.warnings) say(`fit: ${t.target}: warning: ${w}`);
    });
    return gp;
  },
  refit(file) {
    const p = file.payload as { kernel: KernelName; ard: boolean };
    return async (data, seed) => fitGaussianProcess(data, { kernel: p.kernel, ard: p.ard, seed });
  },
};
