import type { ReportedDesign } from "./bench-report-types.js";
import type { TrialSetup } from "./trial-setup.js";

/**
 * The fields every surrogate trial record in report.json starts with: which surrogate, sampler,
 * training size and seed, and the exactly re-evaluated design it reports (nulls when none was found).
 * @param setup - the trial's setup.
 * @param reported - the reported design, or null.
 */
export function trialRecordHead(setup: TrialSetup, reported: ReportedDesign | null) {
  return {
    surrogate: setup.trainer.name,
    sampler: setup.sampler ?? "lhs-maximin",
    trainingSize: setup.trainingSize,
    seed: setup.seed,
    design: reported?.design ?? null,
    input: reported?.input ?? null,
    result: reported?.result ?? null,
    value: reported?.value ?? null,
  };
}
