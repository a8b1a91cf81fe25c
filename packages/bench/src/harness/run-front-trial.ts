import { nsga2 } from "../optimize/nsga2.js";
import { scoreOutputs } from "../optimize/evaluation-session.js";
import { nonDominatedIndices } from "../optimize/pareto-dominance.js";
import type { EvaluatedDesign } from "../optimize/optimization-problem.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import type { SurrogateOptimumRecord } from "./bench-report-types.js";
import { exactEvaluator } from "./exact-evaluator.js";
import { frontHypervolume } from "./front-hypervolume.js";
import { reportDesign } from "./report-design.js";
import { surrogateEvaluator } from "./surrogate-evaluator.js";
import type { TrialSetup } from "./trial-setup.js";
import { trainForTrial } from "./train-for-trial.js";
import { trialRecordHead } from "./trial-record-head.js";

/** The feasible non-dominated subset of exactly evaluated designs (objective senses respected). */
function exactFront(problem: BenchProblem, designs: readonly EvaluatedDesign[]): EvaluatedDesign[] {
  const feasible = designs.filter((e) => e.feasible);
  const losses = feasible.map((e) => e.objectives.map((v, k) => (problem.optimization.objectives[k]!.sense === "max" ? -v : v)));
  return nonDominatedIndices(losses).map((i) => feasible[i]!);
}

/**
 * One two-objective trial: sample, fit, assess; NSGA-II (Deb et al. 2002) on the surrogate; every
 * design of the surrogate's front re-evaluated exactly, exactly infeasible ones dropped (falling back
 * on the training set's exact front when none survives); the hypervolume of what remains relative to
 * the exact front's (same reference point). gap = 1 − that ratio; the reported design is the
 * surviving front's best in the first objective.
 * @param problem - a two-objective problem.
 * @param setup - as for a single trial; `exactValue` is the exact front's hypervolume.
 * @param reference - the reference point fixed from the exact front.
 */
export async function runFrontTrial(
  problem: BenchProblem,
  setup: TrialSetup,
  reference: readonly number[],
): Promise<SurrogateOptimumRecord> {
  const { train, model, fitSeconds, accuracy, seconds: assessSeconds } = await trainForTrial(problem, setup);
  const op = problem.optimization;
  const t0 = performance.now();
  const search = await nsga2(op, surrogateEvaluator(model, problem.trainingVariables), {
    seed: `front-${setup.seed}`,
    populationSize: 40,
    maxEvaluations: 40 * 60,
  });
  const optimize = (performance.now() - t0) / 1000;
  setup.trainer.release?.(model);
  const t1 = performance.now();
  const designs = search.front.map((e) => e.design);
  const outs = await exactEvaluator(problem).evaluate(designs);
  let survivors = exactFront(problem, designs.map((d, i) => scoreOutputs(op, d, outs[i]!)));
  let source: SurrogateOptimumRecord["source"] = survivors.length === designs.length ? "surrogate-optimum" : "ranked-list";
  if (survivors.length === 0) {
    survivors = exactFront(problem, train.designs);
    source = survivors.length > 0 ? "training-set" : "none";
  }
  const reevaluate = (performance.now() - t1) / 1000;
  const points = survivors.map((e) => [...e.objectives]);
  const ratio = frontHypervolume(op, points, reference) / setup.exactValue;
  const sense = op.objectives[0]!.sense;
  const lead = [...survivors].sort((a, b) => (sense === "max" ? b.objectives[0]! - a.objectives[0]! : a.objectives[0]! - b.objectives[0]!))[0];
  const reported = lead ? reportDesign(problem, lead) : null;
  return {
    ...trialRecordHead(setup, reported),
    gap: 1 - ratio,
    source,
    predicted: search.front[0]?.outputs ?? null,
    refined: null,
    evaluations: train.designs.length + designs.length,
    evaluationsBreakdown: { training: train.designs.length, reevaluation: designs.length, refinement: 0, testSet: setup.test.designs.length },
    accuracy,
    seconds: { sample: train.seconds, fit: fitSeconds, assess: assessSeconds, optimize, reevaluate, refine: 0 },
    hypervolumeRatio: ratio,
    front: points,
  };
}
