import type { ProblemReport } from "./bench-report-types.js";

/**
 * Median fit time of a surrogate relative to floorcast's GP at the same training size, so peers
 * compare as ratios measured in one run rather than as absolute times.
 * @param p - the problem's report.
 * @param s - one gap summary row.
 * @returns the ratio, or null without a floorcast GP row at that size.
 */
export function fitRatio(p: ProblemReport, s: ProblemReport["summary"][number]): number | null {
  const gp = p.summary.find((g) => g.surrogate === "gp" && g.sampler === "lhs-maximin" && g.trainingSize === s.trainingSize);
  return gp && gp.medianFitSeconds > 0 ? s.medianFitSeconds / gp.medianFitSeconds : null;
}
