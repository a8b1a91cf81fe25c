import type { SeededRandom } from "./check-design-args.js";
import { PhiPState } from "./phi-p-state.js";

/** Settings of the enhanced stochastic evolutionary search. */
export interface EseOptions {
  /** Outer iterations (threshold updates); the search also stops after `patience` of them without improvement. */
  readonly outerIterations?: number;
  /** Stop after this many outer iterations in a row without a better design (default 10). */
  readonly patience?: number;
  /** Morris–Mitchell exponent p (default 50). */
  readonly p?: number;
  /** Called after each outer iteration with iterations done and the most there may be. */
  readonly onProgress?: (done: number, total: number) => void;
}

/** What the search did. */
export interface EseResult {
  readonly points: number[][];
  readonly phiStart: number;
  readonly phiBest: number;
  readonly outerIterations: number;
}

/**
 * Optimizes a Latin design on the Morris–Mitchell (1995) φp criterion with the enhanced stochastic
 * evolutionary algorithm of Jin, Chen & Sudjianto (2005, J. Stat. Plan. Inference 134): in each inner
 * iteration, J random exchanges of two elements of one column (columns in turn) are tried, the best is
 * accepted when φp(try) − φp(current) ≤ T·u (u uniform); the outer loop adapts the threshold T (improving
 * phase: T·0.8 when the acceptance ratio is above 0.1 and not every acceptance improved, T/0.8 when it is
 * below 0.1; exploring phase: warm by T/0.7 until the ratio exceeds 0.8, then cool by T·0.9 until it falls
 * below 0.1). J = min(n_e/5, 50) and M = min(2·n_e·d/J, 100) with n_e = C(n, 2), T0 = 0.005·φp(start): the
 * paper's settings, from memory. Exchanges keep the Latin property; φp is updated in O(n) per exchange
 * (PhiPState), and re-summed exactly after each outer iteration.
 * @param start - a Latin design in the unit cube (at least 3 points and 2 dimensions; otherwise returned as is).
 * @param rng - seeded generator.
 * @returns the best design found and its φp before and after.
 */
export function eseOptimize(start: readonly (readonly number[])[], rng: SeededRandom, options: EseOptions = {}): EseResult {
  const n = start.length;
  const d = n > 0 ? (start[0] as readonly number[]).length : 0;
  const p = options.p ?? 50;
  const state = new PhiPState(start, d, p);
  const phiStart = state.phi();
  if (n < 3 || d < 2) {
    return { points: state.points(), phiStart, phiBest: phiStart, outerIterations: 0 };
  }
  const ne = (n * (n - 1)) / 2;
  const J = Math.max(1, Math.min(Math.floor(ne / 5), 50));
  const M = Math.max(1, Math.min(Math.floor((2 * ne * d) / J), 100));
  const maxOuter = options.outerIterations ?? 100;
  const patience = options.patience ?? 10;
  let threshold = 0.005 * phiStart;
  const best = state.snapshot();
  let phiBest = phiStart;
  let current = phiStart;
  let warming = true;
  let stale = 0;
  let outer = 0;
  for (; outer < maxOuter && stale < patience; outer++) {
    const phiOldBest = phiBest;
    let accepted = 0;
    let improved = 0;
    for (let it = 0; it < M; it++) {
      const k = it % d;
      let bestSum = Infinity;
      let ba = 0;
      let bb = 1;
      for (let t = 0; t < J; t++) {
        const a = Math.floor(rng() * n);
        let b = Math.floor(rng() * (n - 1));
        if (b >= a) b++;
        const s = state.sumAfterExchange(a, b, k);
        if (s < bestSum) {
          bestSum = s;
          ba = a;
          bb = b;
        }
      }
      const phiTry = state.phi(bestSum);
      if (phiTry - current <= threshold * rng()) {
        state.exchange(ba, bb, k, bestSum);
        current = phiTry;
        accepted++;
        if (current < phiBest) {
          state.snapshot(best);
          phiBest = current;
          improved++;
        }
      }
    }
    current = state.phi((outer + 1) % 20 === 0 ? state.recompute() : state.resum());
    const ratio = accepted / M;
    if (phiBest < phiOldBest * (1 - 1e-9)) {
      stale = 0;
      if (ratio > 0.1 && improved < accepted) threshold *= 0.8;
      else if (ratio < 0.1) threshold /= 0.8;
    } else {
      stale++;
      if (warming) {
        if (ratio < 0.8) threshold /= 0.7;
        else warming = false;
      } else if (ratio > 0.1) threshold *= 0.9;
      else warming = true;
    }
    options.onProgress?.(outer + 1, maxOuter);
  }
  return { points: state.points(best), phiStart, phiBest, outerIterations: outer };
}
