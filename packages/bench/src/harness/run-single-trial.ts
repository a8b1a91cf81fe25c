import { patternSearch } from "../optimize/pattern-search.js";
import type { EvaluatedDesign } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import type { SurrogateOptimumRecord } from "./bench-report-types.js";
import { exactEvaluator } from "./exact-evaluator.js";
import { optimumGap } from "./optimum-gap.js";
import { reevaluateSurrogateOptimum } from "./reevaluate-surrogate-optimum.js";
import { reportDesign } from "./report-design.js";
import { trainForTrial } from "./train-for-trial.js";
import { searchSurrogate } from "./search-surrogate.js";
import { surrogateEvaluator } from "./surrogate-evaluator.js";
import { trialRecordHead } from "./trial-record-head.js";
import type { TrialSetup } from "./trial-setup.js";


const seconds = (t0: number): number => (performance.now() - t0) / 1000;

/**
 * One single-objective trial: sample `trainingSize` exact designs, fit the surrogate, assess it on
 * the test set, search the surrogate, re-evaluate its optimum exactly (falling back on the ranked
 * list and the training set, never reporting an exactly infeasible design), compute the gap, then
 * spend a small budget of exact pattern-search refinement and compute the gap again.
 * @param problem - a single-objective problem.
 * @param setup - the surrogate, size, seed, test set, exact optimum value and budgets.
 * @returns the report.json entry.
 */
export async function runSingleTrial(problem: BenchProblem, setup: TrialSetup): Promise<SurrogateOptimumRecord> {
  const { train, model, fitSeconds, accuracy, seconds: assessSeconds } = await trainForTrial(problem, setup);
  const op = problem.optimization;
  const sense = op.objectives[0]!.sense;
  const tOpt = performance.now();
  const searched = await searchSurrogate(op, surrogateEvaluator(model, problem.trainingVariables), {
    seed: setup.seed,
    ...(setup.candidates ? { candidates: setup.candidates } : {}),
  });
  const optimize = seconds(tOpt);
  setup.trainer.release?.(model);
  const tRe = performance.now();
  const exact = exactEvaluator(problem);
  const chosen = await reevaluateSurrogateOptimum(op, searched, exact, train.designs);
  const reevaluate = seconds(tRe);
  const tRef = performance.now();
  let refined: SurrogateOptimumRecord["refined"] = null;
  const budget = setup.refineBudget ?? 20;
  if (chosen.exact && budget > 0) {
    const r = await patternSearch(op, exactEvaluator(problem), chosen.exact.design, {
      maxEvaluations: budget,
      initialStep: 0.05,
    });
    let best: EvaluatedDesign = chosen.exact;
    if (r.best && r.best.feasible) {
      const better = sense === "max" ? r.best.objectives[0]! > best.objectives[0]! : r.best.objectives[0]! < best.objectives[0]!;
      if (better) best = r.best;
    }
    const rd = reportDesign(problem, best);
    refined = { ...rd, gap: optimumGap(setup.exactValue, rd.value, sense), evaluations: r.evaluations };
  }
  const refine = seconds(tRef);
  const reported = chosen.exact ? reportDesign(problem, chosen.exact) : null;
  const training = train.designs.length;
  return {
    ...trialRecordHead(setup, reported),
    gap: reported ? optimumGap(setup.exactValue, reported.value, sense) : null,
    source: chosen.source,
    predicted: chosen.predicted?.outputs ?? null,
    refined,
    evaluations: training + chosen.evaluations,
    evaluationsBreakdown: {
      training,
      reevaluation: chosen.evaluations,
      refinement: refined?.evaluations ?? 0,
      testSet: setup.test.designs.length,
    },
    accuracy,
    seconds: { sample: train.seconds, fit: fitSeconds, assess: assessSeconds, optimize, reevaluate, refine },
  };
}
