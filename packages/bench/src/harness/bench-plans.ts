import type { BenchProblem } from "../problem/bench-problem.js";
import type { BenchSettings } from "./bench-settings.js";
import { floorcastTrainer } from "./floorcast-trainer.js";
import type { PeerProcess } from "./peer-process.js";
import { peerTrainers } from "./peer-trainers.js";
import type { TrialPlan } from "./run-problem.js";

/** floorcast's surrogates a bench runs by default. */
export const BENCH_SURROGATES = ["gp", "nn", "plate-stack"] as const;
/** One of floorcast's surrogates in a bench. */
export type BenchSurrogate = (typeof BENCH_SURROGATES)[number];

/**
 * The trials of one problem: floorcast's GP and NN at every training size and seed; with the
 * peers, scikit-learn's GP and MLP on the same maximin-LHS rows, and floorcast's GP on scipy's
 * Latin hypercube (the alternative sampler), at the peer sizes and the same seeds.
 * @param problem - the problem.
 * @param settings - sizes, seeds.
 * @param quick - the demo's smaller fits.
 * @param peer - a running peer server, or null.
 * @param surrogates - which of floorcast's surrogates to run (default all three; plate-stack only where the
 *   problem's evaluator reports plate profiles).
 */
export function benchPlans(
  problem: BenchProblem,
  settings: BenchSettings,
  quick: boolean,
  peer: PeerProcess | null,
  surrogates: readonly BenchSurrogate[] = BENCH_SURROGATES,
): TrialPlan[] {
  const vars = problem.trainingVariables;
  const wanted = surrogates.filter((k) => k !== "plate-stack" || problem.plateProfile !== undefined);
  const plans: TrialPlan[] = wanted.map((k) => ({
    trainer: floorcastTrainer(k, quick),
    sampler: "lhs-maximin",
    sizes: settings.trainingSizes,
    seeds: settings.seeds,
  }));
  if (peer) {
    for (const t of peerTrainers(peer, vars, quick)) {
      plans.push({ trainer: t, sampler: "lhs-maximin", sizes: settings.peerSizes, seeds: settings.seeds });
    }
    plans.push({
      trainer: floorcastTrainer("gp", quick),
      sampler: "scipy-lhs",
      sizes: settings.peerSizes,
      seeds: settings.seeds,
      unitRows: async (n, d, seed) => (await peer.request<{ rows: number[][] }>({ op: "lhs", n, d, seed })).rows,
    });
  }
  return plans;
}
