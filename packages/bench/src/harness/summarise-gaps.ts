import { percentile } from "@floorcast/surrogate";
import type { GapSummary, SurrogateOptimumRecord } from "./bench-report-types.js";

function median(v: readonly number[]): number | null {
  return v.length === 0 ? null : percentile(v, 0.5);
}

/**
 * Gap statistics per surrogate, sampler and training size over seeds: median and worst gap, with
 * and without exact refinement, fallbacks, median R² of the first target, evaluations and fit time.
 * A trial with no exactly-feasible design counts as a gap of 1 (everything lost); within a group where
 * refinement ran, a trial without a refined design keeps its gap. Where no trial was refined (two
 * objectives), the refined figures are null.
 * @param records - the problem's surrogate optima.
 * @returns one summary per (surrogate, sampler, training size), in first-seen order.
 */
export function summariseGaps(records: readonly SurrogateOptimumRecord[]): GapSummary[] {
  const groups = new Map<string, SurrogateOptimumRecord[]>();
  for (const r of records) {
    const k = `${r.surrogate}|${r.sampler}|${r.trainingSize}`;
    groups.set(k, [...(groups.get(k) ?? []), r]);
  }
  return [...groups.values()].map((g) => {
    const gaps = g.map((r) => r.gap ?? 1);
    // No trial refined (fronts are never refined): no refined figures, rather than the gap again.
    const refinedRan = g.some((r) => r.refined !== null && r.refined !== undefined);
    const refined = g.map((r) => r.refined?.gap ?? r.gap ?? 1);
    const r2 = g.map((r) => r.accuracy[0]?.r2 ?? Number.NaN).filter(Number.isFinite);
    return {
      surrogate: g[0]!.surrogate,
      sampler: g[0]!.sampler,
      trainingSize: g[0]!.trainingSize,
      trials: g.length,
      medianGap: median(gaps),
      worstGap: Math.max(...gaps),
      medianGapRefined: refinedRan ? median(refined) : null,
      worstGapRefined: refinedRan ? Math.max(...refined) : null,
      fallbacks: g.filter((r) => r.source !== "surrogate-optimum").length,
      medianR2: median(r2),
      medianEvaluations: median(g.map((r) => r.evaluations)) ?? 0,
      medianFitSeconds: median(g.map((r) => r.seconds.fit)) ?? 0,
    };
  });
}
