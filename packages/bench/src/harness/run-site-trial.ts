import { gridAxes } from "../optimize/grid-search.js";
import { patternSearch } from "../optimize/pattern-search.js";
import { createVariableCodec } from "@floorcast/sampler";
import { scoreOutputs } from "../optimize/evaluation-session.js";
import { compareFeasibility } from "../optimize/feasibility-rules.js";
import type { Design, EvaluatedDesign } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import type { SurrogateOptimumRecord } from "./bench-report-types.js";
import { exactEvaluator } from "./exact-evaluator.js";
import { kendallTau } from "./kendall-tau.js";
import { optimumGap } from "./optimum-gap.js";
import { reevaluateSurrogateOptimum } from "./reevaluate-surrogate-optimum.js";
import { reportDesign } from "./report-design.js";
import type { TrialSetup } from "./trial-setup.js";
import { spearmanRho } from "./spearman-rho.js";
import { surrogateEvaluator } from "./surrogate-evaluator.js";
import { topKOverlap } from "./top-k-overlap.js";
import { trainForTrial } from "./train-for-trial.js";
import { trialRecordHead } from "./trial-record-head.js";

/**
 * One site-selection trial: a surrogate trained across sites estimates each site's best value by
 * a grid search on the surrogate at the problem's resolution (all sites in one batch); the sites
 * are ranked by those estimates and compared with the exact ranking (Spearman's rho, Kendall's
 * tau-b, overlap of the shortlists). The reported design is the surrogate's top site at its
 * surrogate-best design, re-evaluated exactly (down the surrogate's ranking when exactly
 * infeasible); its gap is against the exact best site, before and after a small budget of exact
 * pattern-search refinement of that site's design.
 * @param problem - a site-selection problem.
 * @param setup - as for a single trial; `exactValue` is the best site's exact optimum.
 * @param exactBest - each site's exact best value, in site order.
 */
export async function runSiteTrial(
  problem: BenchProblem,
  setup: TrialSetup,
  exactBest: readonly number[],
): Promise<SurrogateOptimumRecord> {
  const { train, model, fitSeconds, accuracy, seconds: assessSeconds } = await trainForTrial(problem, setup);
  const op = problem.optimization;
  const sites = problem.sites!;
  const t0 = performance.now();
  const codec = createVariableCodec(op.variables);
  const { axes } = gridAxes(op, problem.exact.gridPoints);
  const grid: Design[] = [];
  const walk = (i: number, x: number[]): void => {
    if (i === axes.length) {
      grid.push(codec.toDesign(x));
      return;
    }
    for (const v of axes[i]!) walk(i + 1, [...x, v]);
  };
  walk(0, []);
  const batch = sites.sites.flatMap((s) => grid.map((d) => ({ ...s, ...d })));
  const predicted = await surrogateEvaluator(model, problem.trainingVariables).evaluate(batch);
  setup.trainer.release?.(model);
  const perSite: EvaluatedDesign[] = sites.sites.map((_, k) => {
    let best: EvaluatedDesign | null = null;
    for (let j = 0; j < grid.length; j++) {
      const i = k * grid.length + j;
      const e = scoreOutputs(op, batch[i]!, predicted[i]!);
      if (e.valid && (best === null || compareFeasibility(op, e, best) < 0)) best = e;
    }
    return best ?? scoreOutputs(op, batch[k * grid.length]!, predicted[k * grid.length]!);
  });
  const estimates = perSite.map((e) => (Number.isFinite(e.objectives[0]) ? e.objectives[0]! : 0));
  const optimize = (performance.now() - t0) / 1000;
  const t1 = performance.now();
  // the surrogate's ranked list of sites, each at its surrogate-best design
  const chosen = await reevaluateSurrogateOptimum(op, perSite, exactEvaluator(problem), train.designs, 10, 0);
  const reevaluate = (performance.now() - t1) / 1000;
  const reported = chosen.exact ? reportDesign(problem, chosen.exact) : null;
  const sense = op.objectives[0]!.sense;
  // exact refinement of the chosen site's design (the site itself stays fixed)
  const t2 = performance.now();
  let refined: SurrogateOptimumRecord["refined"] = null;
  const budget = setup.refineBudget ?? 20;
  if (chosen.exact && budget > 0) {
    const site = Object.fromEntries(sites.parameters.map((k) => [k, chosen.exact!.design[k]!]));
    const start = Object.fromEntries(op.variables.map((v) => [v.name, chosen.exact!.design[v.name]!]));
    const r = await patternSearch(op, exactEvaluator(problem, site), start, { maxEvaluations: budget, initialStep: 0.05 });
    const better = r.best && r.best.feasible && (sense === "max" ? r.best.objectives[0]! > chosen.exact.objectives[0]! : r.best.objectives[0]! < chosen.exact.objectives[0]!);
    const best = better ? { ...r.best!, design: { ...site, ...r.best!.design } } : chosen.exact;
    const rd = reportDesign(problem, best);
    refined = { ...rd, gap: optimumGap(setup.exactValue, rd.value, sense), evaluations: r.evaluations };
  }
  const refine = (performance.now() - t2) / 1000;
  const senses = sense === "max" ? 1 : -1;
  const signed = (v: readonly number[]): number[] => v.map((x) => senses * x);
  return {
    ...trialRecordHead(setup, reported),
    gap: reported ? optimumGap(setup.exactValue, reported.value, sense) : null,
    source: chosen.source,
    predicted: chosen.predicted?.outputs ?? null,
    refined,
    evaluations: train.designs.length + chosen.evaluations,
    evaluationsBreakdown: { training: train.designs.length, reevaluation: chosen.evaluations, refinement: refined?.evaluations ?? 0, testSet: setup.test.designs.length },
    accuracy,
    seconds: { sample: train.seconds, fit: fitSeconds, assess: assessSeconds, optimize, reevaluate, refine },
    ranking: {
      spearman: spearmanRho(signed(exactBest), signed(estimates)),
      kendall: kendallTau(signed(exactBest), signed(estimates)),
      topOverlap: topKOverlap(signed(exactBest), signed(estimates), sites.shortlist),
      shortlist: sites.shortlist,
      estimates,
    },
  };
}
