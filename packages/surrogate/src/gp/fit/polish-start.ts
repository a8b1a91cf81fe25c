import type { HyperparameterFitResult, HyperparameterSearch, RestartOutcome } from "./fit-hyperparameters.js";
import { shorterLengthscaleProbes } from "./shorter-lengthscale-probes.js";

/** A θ compared on all rows before a polish, and its name in the diagnostics. */
export interface PolishCandidate {
  readonly theta: Float64Array;
  /** "subset optimum", or e.g. "lengthscale[maxFar] × 1/4" for a probe. */
  readonly label: string;
}

/**
 * The θs compared on all rows before a polish: the subset's optimum first, then (when `probe` is set) its
 * shorter-lengthscale probes.
 * @param search - the subset's search (layout, bounds). @param fit - its result. @param probe - whether to probe.
 * @param inputs - input names (for the labels).
 * @returns the candidates, the subset's optimum first.
 */
export function polishCandidates(
  search: HyperparameterSearch,
  fit: HyperparameterFitResult,
  probe: boolean,
  inputs: readonly string[],
): PolishCandidate[] {
  const probes = probe ? shorterLengthscaleProbes(fit.theta, search.layout, search.logLower) : [];
  return [
    { theta: fit.theta, label: "subset optimum" },
    ...probes.map((p) => ({ theta: p.theta, label: `lengthscale[${inputs[p.dim]}] ${p.change}` })),
  ];
}

/**
 * The candidate with the highest log marginal likelihood on all rows (the first of equal values, so the subset's
 * optimum wins ties; a candidate whose likelihood is not finite never wins over a finite one).
 * @param candidates - from polishCandidates. @param outcomes - runProbe of each candidate on all rows, in order
 *   (empty when there is one candidate: it is taken without evaluation).
 * @returns the start of the polish.
 */
export function choosePolishStart(candidates: readonly PolishCandidate[], outcomes: readonly RestartOutcome[]): PolishCandidate {
  let best = 0;
  for (let i = 1; i < outcomes.length; i++) if (outcomes[i]!.value < outcomes[best]!.value) best = i;
  return candidates[best]!;
}
