import { mkdir, mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { BenchProblem } from "../problem/bench-problem.js";
import type { ExactOptimumRecord, ProblemReport, SurrogateOptimumRecord } from "./bench-report-types.js";
import type { BenchTrainer } from "./bench-trainer.js";
import { evaluationsToTarget, type TargetBudgets } from "./evaluations-to-target.js";
import { findExactOptimum } from "./find-exact-optimum.js";
import { frontEvaluationsToTarget } from "./front-evaluations-to-target.js";
import { frontHypervolume, frontReference } from "./front-hypervolume.js";
import { reportDesign } from "./report-design.js";
import { runFrontTrial } from "./run-front-trial.js";
import { runSingleTrial } from "./run-single-trial.js";
import type { TrialSetup } from "./trial-setup.js";
import { runSiteTrial } from "./run-site-trial.js";
import { sampleTrainingSet, type TrainingSet } from "./sample-training-set.js";
import { summariseGaps } from "./summarise-gaps.js";

/** A trainer with the training design it uses: floorcast's maximin LHS, or rows from a peer sampler. */
export interface TrialPlan {
  readonly trainer: BenchTrainer;
  readonly sampler: string;
  /** Unit rows for a training size and seed (peer samplers), or undefined for floorcast's own. */
  readonly unitRows?: (n: number, dims: number, seed: number) => Promise<number[][]>;
  readonly sizes: readonly number[];
  readonly seeds: readonly number[];
}

/** How one problem is measured. */
export interface RunProblemOptions {
  readonly plans: readonly TrialPlan[];
  /** Independent test-set size (default 300). */
  readonly testSize: number;
  /** Exact refinement budget after each surrogate search (default 20). */
  readonly refineBudget: number;
  readonly targets: TargetBudgets;
  /** Surrogate search candidates. */
  readonly candidates?: number;
  /** Grid points per variable for the exact optimum, overriding the problem's (tests only). */
  readonly gridPoints?: number;
  readonly notes?: readonly string[];
  /** Folder for the training and test CSVs (with manifests) and model files (default: a temporary folder, removed at the end). */
  readonly workDir?: string;
  /** Progress: a short label of each step as it starts, and trial counts. */
  readonly onStep?: (label: string, done: number, total: number) => void;
}

/**
 * Measures one problem: the exact optimum (grid + exact refinement, or per site, or the exact
 * front), an independent test set, every planned surrogate trial (sample, fit, assess, optimize on
 * the surrogate, exact re-evaluation, gap, refinement), and the exact evaluations each optimizer
 * needs to come within the target (of the optimum, or of the exact front's hypervolume).
 * @param problem - the problem.
 * @param options - trial plans, budgets and progress callback.
 * @returns the problem's section of report.json.
 */
export async function runProblem(problem: BenchProblem, options: RunProblemOptions): Promise<ProblemReport> {
  const temporary = options.workDir === undefined ? await mkdtemp(join(tmpdir(), "floorcast-bench-")) : undefined;
  const workDir = options.workDir ?? temporary!;
  await mkdir(workDir, { recursive: true });
  try {
    return await measureProblem(problem, options, workDir);
  } finally {
    if (temporary !== undefined) await rm(temporary, { recursive: true, force: true });
  }
}

async function measureProblem(problem: BenchProblem, options: RunProblemOptions, workDir: string): Promise<ProblemReport> {
  const t0 = performance.now();
  const step = options.onStep ?? (() => undefined);
  const op = problem.optimization;
  const total = options.plans.reduce((s, p) => s + p.sizes.length * p.seeds.length, 0);
  step("exact optimum", 0, total);
  const grid = options.gridPoints === undefined ? {} : { gridPoints: options.gridPoints };
  let exactOptimum: ExactOptimumRecord;
  let exactValue: number;
  let reference: number[] = [];
  let exactFrontPoints: number[][] = [];
  let exactBest: number[] = [];
  if (problem.kind === "site-selection") {
    const sites = problem.sites!.sites;
    const tSites = performance.now();
    const optima = [];
    for (const site of sites) optima.push(await findExactOptimum(problem, { site, ...grid }));
    exactBest = optima.map((o) => o.best?.objectives[0] ?? 0);
    const sign = op.objectives[0]!.sense === "max" ? 1 : -1;
    const bestIndex = exactBest.reduce((b, v, i) => (sign * v > sign * exactBest[b]! ? i : b), 0);
    const o = optima[bestIndex]!;
    const best = { ...o.best!, design: { ...sites[bestIndex]!, ...o.best!.design } };
    exactOptimum = {
      ...reportDesign(problem, best),
      evaluations: optima.reduce((s, x) => s + x.evaluations, 0),
      gridEvaluations: optima.reduce((s, x) => s + x.gridEvaluations, 0),
      refineEvaluations: optima.reduce((s, x) => s + x.refineEvaluations, 0),
      gridPoints: o.gridPoints,
      seconds: (performance.now() - tSites) / 1000,
    };
    exactValue = best.objectives[0]!;
  } else {
    const o = await findExactOptimum(problem, grid);
    if (!o.best) throw new RangeError(`runProblem: ${problem.name}: the exact grid found no feasible design`);
    exactOptimum = { ...reportDesign(problem, o.best), evaluations: o.evaluations, gridEvaluations: o.gridEvaluations, refineEvaluations: o.refineEvaluations, gridPoints: o.gridPoints, seconds: o.seconds };
    exactValue = o.best.objectives[0]!;
    if (problem.kind === "two-objective") {
      exactFrontPoints = o.front.map((e) => [...e.objectives]);
      reference = frontReference(op, exactFrontPoints);
      exactValue = frontHypervolume(op, exactFrontPoints, reference);
    }
  }
  const test = await sampleTrainingSet(problem, options.testSize, `test-${problem.name}`, workDir, undefined, "random");
  const records: SurrogateOptimumRecord[] = [];
  const cache = new Map<string, TrainingSet>();
  let done = 0;
  for (const plan of options.plans) {
    for (const n of plan.sizes) {
      for (const seed of plan.seeds) {
        step(`${plan.trainer.name}${plan.sampler === "lhs-maximin" ? "" : ` (${plan.sampler})`} n=${n} seed=${seed}`, done, total);
        const cached = cache.has(`${plan.sampler}|${n}|${seed}`);
        const unitRows = plan.unitRows && !cached ? await plan.unitRows(n, problem.trainingVariables.length, seed) : undefined;
        const setup: TrialSetup = {
          trainer: plan.trainer,
          trainingSize: n,
          seed,
          test,
          exactValue,
          refineBudget: options.refineBudget,
          sampler: plan.sampler,
          cache,
          workDir,
          ...(unitRows ? { unitRows } : {}),
          ...(options.candidates ? { candidates: options.candidates } : {}),
        };
        const r =
          problem.kind === "site-selection"
            ? await runSiteTrial(problem, setup, exactBest)
            : problem.kind === "two-objective"
              ? await runFrontTrial(problem, setup, reference)
              : await runSingleTrial(problem, setup);
        records.push(r);
        done++;
      }
    }
  }
  step("evaluations to target", done, total);
  const toTarget =
    problem.kind === "single"
      ? await evaluationsToTarget(problem, exactValue, options.targets)
      : problem.kind === "two-objective"
        ? await frontEvaluationsToTarget(problem, reference, exactValue, options.targets)
        : [];
  step("done", total, total);
  return {
    name: problem.name,
    title: problem.title,
    description: problem.description,
    kind: problem.kind,
    file: problem.file,
    objectives: op.objectives,
    constraints: op.constraints ?? [],
    variables: op.variables.map((v) => v.name),
    exactOptimum,
    surrogateOptimum: records,
    summary: summariseGaps(records),
    target: options.targets.target ?? 0.005,
    evaluationsToTarget: toTarget,
    ...(problem.kind === "two-objective" ? { exactFront: { points: exactFrontPoints, hypervolume: exactValue, reference } } : {}),
    ...(problem.sites ? { sites: { parameters: problem.sites.parameters, exactBest, count: problem.sites.sites.length } } : {}),
    notes: options.notes ?? [],
    seconds: (performance.now() - t0) / 1000,
  };
}
