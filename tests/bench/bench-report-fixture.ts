import { evaluateMassing, FLOORCAST_CAUTION, quadParcel, type MassingInput } from "@floorcast/sampler";
import type { BenchReport, ProblemReport, SurrogateOptimumRecord } from "../../packages/bench/src/harness/bench-report-types.js";
import { summariseGaps } from "../../packages/bench/src/harness/summarise-gaps.js";

/** The five model series a demo with peers shows: floorcast's GP and NN, the peers, and the GP on scipy's LHS. */
export const SERIES: readonly (readonly [string, string])[] = [
  ["gp", "lhs-maximin"],
  ["nn", "lhs-maximin"],
  ["sklearn-gp", "lhs-maximin"],
  ["sklearn-mlp", "lhs-maximin"],
  ["gp", "scipy-lhs"],
];

/** A Larkspur Terraces lot with no sky plane, so every floor plate equals the ground floor's. */
export function larkspurInput(setbackSide: number, maxHeight: number): MassingInput {
  return {
    parcel: quadParcel({ frontage: 12, depth: 35 }),
    setbacks: { front: 4, side: setbackSide, rear: 6 },
    floorHeight: 2.9,
    maxHeight,
    maxFar: 1.2,
  };
}

function trial(surrogate: string, sampler: string, n: number, seed: number, gap: number, input: MassingInput | null, refined: boolean): SurrogateOptimumRecord {
  const result = input ? evaluateMassing(input) : null;
  return {
    surrogate,
    sampler,
    trainingSize: n,
    seed,
    design: input ? { setbackSide: input.setbacks.side } : null,
    input,
    result,
    value: result?.gfa ?? null,
    gap,
    source: "surrogate-optimum",
    predicted: null,
    refined: refined && input && result ? { design: { setbackSide: input.setbacks.side }, input, result, value: result.gfa, gap, evaluations: 20 } : null,
    evaluations: n + 1,
    evaluationsBreakdown: { training: n, reevaluation: 1, refinement: refined ? 20 : 0, testSet: 200 },
    accuracy: [{ target: "gfa", rmse: 1, mae: 1, maxAbsError: 2, r2: 0.63, medianRelError: 0.01, p95RelError: 0.02 }] as never,
    seconds: { sample: 0.1, fit: 0.2, assess: 0.1, optimize: 0.1, reevaluate: 0, refine: 0 },
  };
}

/**
 * A bench report that exercises the report's hard cases: a single-objective massing problem where
 * every trial's gap is exactly 0 for five model series, an exact optimum whose design carries float
 * noise (42.900000000000006), plates that coincide in plan, a surrogate-driven design under a lower
 * height limit than the exact one; and a two-objective problem (hypervolume gap, never refined).
 */
export function hardCaseReport(): BenchReport {
  const exactInput = larkspurInput(1.2, 42.900000000000006);
  const exactResult = evaluateMassing(exactInput);
  const trials = SERIES.flatMap(([s, sampler]) => [20, 40, 80].flatMap((n) => [1, 2].map((seed) => trial(s, sampler, n, seed, 0, larkspurInput(1.2, 9), true))));
  const single: ProblemReport = {
    name: "larkspur-fit-gfa",
    title: "Larkspur fit (report test)",
    description: "Side yards that fit the FAR in whole floors.",
    kind: "single",
    file: "larkspur-fit-gfa.json",
    objectives: [{ output: "gfa", sense: "max" }],
    constraints: [],
    variables: ["setbackSide", "maxHeight"],
    exactOptimum: { design: { setbackSide: 1.2, maxHeight: 42.900000000000006 }, input: exactInput, result: exactResult, value: exactResult.gfa, evaluations: 5115, gridEvaluations: 5000, refineEvaluations: 115, gridPoints: 41, seconds: 1 },
    surrogateOptimum: trials,
    summary: summariseGaps(trials),
    target: 0.005,
    evaluationsToTarget: [],
    notes: [],
    seconds: 1,
  };
  const frontTrials = SERIES.slice(0, 2).flatMap(([s, sampler]) => [20, 40, 80].flatMap((n) => [1, 2].map((seed) => ({ ...trial(s, sampler, n, seed, 0.2 / n, null, false), front: [[2800, 300], [2500, 600]], hypervolumeRatio: 1 - 0.2 / n }))));
  const two: ProblemReport = {
    ...single,
    name: "ferrow-gfa-open-space",
    title: "Ferrow trade-off (report test)",
    kind: "two-objective",
    objectives: [{ output: "gfa", sense: "max" }, { output: "openSpace", sense: "max" }],
    exactOptimum: { ...single.exactOptimum, value: 2880 },
    surrogateOptimum: frontTrials,
    summary: summariseGaps(frontTrials),
    exactFront: { points: [[2880, 250], [2600, 620], [2000, 900]], hypervolume: 1.9e6, reference: [0, 0] },
  };
  return {
    kind: "floorcast.bench-report",
    formatVersion: 1,
    caution: FLOORCAST_CAUTION,
    suite: "demo",
    options: { refineBudget: 20 },
    environment: { node: process.version, cpus: 2, peers: true },
    problems: [single, two],
    seconds: 2,
  };
}
