import type { VariableCodec } from "@floorcast/sampler";
import { pollPoints } from "./pattern-search.js";
import { unitSamples, type Rng } from "./unit-samples.js";

/** Options of {@link maximiseAcquisition}. */
export interface MaximiseAcquisitionOptions {
  /** Random legal designs scored in one batch. */
  readonly candidates: number;
  /** The best candidates refined by pattern search. */
  readonly starts: number;
  /** Pattern-search steps at most. */
  readonly maxSteps: number;
  /** Refine only starts with a positive score (a start at zero has nothing to climb). */
  readonly positiveOnly: boolean;
}

/**
 * Maximises an acquisition function over a problem's designs by multi-start on the model: `candidates` random
 * legal designs scored in one batch, the best `starts` refined together by mixed-variable pattern search (poll
 * steps from 0.05 of each range, halved on failure down to 1e-4; lattice values by whole steps, categoricals by
 * level swaps), one `score` call per step. Shared by Bayesian optimization on a GP and through the plate stack.
 * Pattern search: Torczon (1997), "On the convergence of pattern search algorithms", SIAM J. Optim. 7.
 * @param codec - the problem's variable codec.
 * @param score - the acquisition of a batch of coded designs (higher is better; −1 for designs to skip).
 * @param rng - the optimizer's seeded generator (draws the candidates).
 * @param options - candidates, starts, maxSteps, positiveOnly.
 * @returns the best refined design and its score (x undefined only when there are no starts).
 */
export function maximiseAcquisition(
  codec: VariableCodec,
  score: (cands: readonly (readonly number[])[]) => number[],
  rng: Rng,
  options: MaximiseAcquisitionOptions,
): { x: number[] | undefined; score: number } {
  const cands = unitSamples(options.candidates, codec.dims, "random", rng).map((u) => codec.fromUnit(u));
  const sc = score(cands);
  const starts = sc
    .map((s, i) => [s, i] as const)
    .sort((a, b) => b[0] - a[0])
    .slice(0, options.starts)
    .map(([s, i]) => ({ x: cands[i]!, s, delta: 0.05 }));
  for (let steps = 0; steps < options.maxSteps; steps++) {
    const active = starts.filter((st) => st.delta > 1e-4 && (!options.positiveOnly || st.s > 0));
    if (active.length === 0) break;
    const polls = active.map((st) => pollPoints(codec, st.x, st.delta));
    const ps = score(polls.flat());
    let at = 0;
    active.forEach((st, a) => {
      const mine = ps.slice(at, at + polls[a]!.length);
      at += mine.length;
      const k = mine.reduce((bi, v, i) => (v > mine[bi]! ? i : bi), 0);
      if (mine.length > 0 && mine[k]! > st.s) [st.x, st.s] = [polls[a]![k]!, mine[k]!];
      else st.delta /= 2;
    });
  }
  let x: number[] | undefined;
  let best = -Infinity;
  for (const st of starts) if (st.s > best) [x, best] = [st.x, st.s];
  return { x, score: best };
}
