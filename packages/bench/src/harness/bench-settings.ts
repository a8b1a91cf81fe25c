import type { TargetBudgets } from "./evaluations-to-target.js";

/** Sizes, seeds and budgets of one bench run. */
export interface BenchSettings {
  readonly trainingSizes: readonly number[];
  readonly seeds: readonly number[];
  readonly testSize: number;
  readonly refineBudget: number;
  readonly candidates: number;
  readonly targets: TargetBudgets;
  /** Training sizes the peers (scikit-learn, scipy's LHS) run at. */
  readonly peerSizes: readonly number[];
}

/**
 * The bench's settings: `quick` (the demo, sized to finish in under three minutes on two cores)
 * or the full run. `seeds` overrides the number of seeds per training size.
 * @param quick - the demo's smaller sizes and budgets.
 * @param seeds - seeds per training size (default 2 quick, 3 full).
 */
export function benchSettings(quick: boolean, seeds?: number): BenchSettings {
  if (seeds !== undefined && (!Number.isInteger(seeds) || seeds < 1 || seeds > 100)) {
    throw new RangeError(`benchSettings: seeds must be an integer in [1, 100], got ${seeds}`);
  }
  const k = seeds ?? (quick ? 2 : 3);
  const list = Array.from({ length: k }, (_, i) => i + 1);
  return quick
    ? {
        trainingSizes: [20, 40, 80],
        seeds: list,
        testSize: 200,
        refineBudget: 20,
        candidates: 1024,
        targets: { search: 400, bo: 30, seeds: Math.min(k, 2), boSeeds: 1 },
        peerSizes: [80],
      }
    : {
        trainingSizes: [25, 50, 100, 200],
        seeds: list,
        testSize: 500,
        refineBudget: 30,
        candidates: 4096,
        targets: { search: 1500, bo: 80, seeds: k, boSeeds: k },
        peerSizes: [50, 100, 200],
      };
}
