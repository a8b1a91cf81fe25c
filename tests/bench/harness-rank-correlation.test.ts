import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { referenceAvailable, runReference } from "../reference/python.js";
import { spearmanRho } from "../../packages/bench/src/harness/spearman-rho.js";
import { kendallTau } from "../../packages/bench/src/harness/kendall-tau.js";
import { topKOverlap } from "../../packages/bench/src/harness/top-k-overlap.js";
import { averageRanks } from "../../packages/bench/src/harness/average-ranks.js";

interface RefResult {
  scipy: string;
  results: { spearman: number | null; kendall: number | null }[];
}

function makeCases(): { x: number[]; y: number[] }[] {
  const rng = seedrandom("rank-cases");
  const cases: { x: number[]; y: number[] }[] = [];
  for (const n of [2, 3, 5, 10, 50, 240]) {
    const x = Array.from({ length: n }, () => rng());
    const y = x.map((v) => v + 0.3 * rng());
    cases.push({ x, y });
    // heavy ties, as floor counts and plateaued gfa produce
    cases.push({ x: x.map((v) => Math.round(v * 4)), y: y.map((v) => Math.round(v * 3)) });
  }
  cases.push({ x: [1, 2, 3, 4], y: [4, 3, 2, 1] });
  cases.push({ x: [1, 1, 2, 2, 3], y: [1, 2, 1, 2, 3] });
  return cases;
}

const hasRef = referenceAvailable(["scipy"]);

describe.skipIf(!hasRef)("rank correlations against scipy.stats (Debian python3-scipy 1.10.1)", () => {
  it("spearmanRho and kendallTau (tau-b) match spearmanr / kendalltau to 1e-12", () => {
    const cases = makeCases();
    const ref = runReference<RefResult>("rank_correlation.py", { cases });
    cases.forEach((c, i) => {
      const r = ref.results[i]!;
      // tolerance 1e-12 absolute: both are sums of O(n²) integers divided once, so only rounding differs
      expect(Math.abs(spearmanRho(c.x, c.y) - r.spearman!)).toBeLessThan(1e-12);
      expect(Math.abs(kendallTau(c.x, c.y) - r.kendall!)).toBeLessThan(1e-12);
    });
  });
});

describe("rank correlations: hand-computed values and edge cases", () => {
  it("perfect agreement and reversal give ±1 (definition)", () => {
    expect(spearmanRho([1, 2, 3], [10, 20, 30])).toBe(1);
    expect(kendallTau([1, 2, 3], [30, 20, 10])).toBe(-1);
  });
  it("a hand-counted Kendall case: x=[1,2,3], y=[1,3,2] has 2 concordant, 1 discordant → 1/3 (derived)", () => {
    expect(kendallTau([1, 2, 3], [1, 3, 2])).toBeCloseTo(1 / 3, 14);
    // Spearman: ranks d = [0, 1, 1], rho = 1 − 6Σd²/(n(n²−1)) = 1 − 12/24 = 0.5 (derived, no ties)
    expect(spearmanRho([1, 2, 3], [1, 3, 2])).toBeCloseTo(0.5, 14);
  });
  it("average ranks share tied positions (derived)", () => {
    expect(averageRanks([10, 20, 20, 5])).toEqual([2, 3.5, 3.5, 1]);
  });
  it("a constant sample has no ranking: NaN", () => {
    expect(spearmanRho([1, 1, 1], [1, 2, 3])).toBeNaN();
    expect(kendallTau([1, 2, 3], [2, 2, 2])).toBeNaN();
  });
  it("rejects bad input", () => {
    expect(() => spearmanRho([1], [1])).toThrow(RangeError);
    expect(() => kendallTau([1, 2], [1])).toThrow(/same length/);
    expect(() => spearmanRho([1, Number.NaN], [1, 2])).toThrow(/x\[1\] must be finite/);
    expect(() => kendallTau([1, Number.POSITIVE_INFINITY], [1, 2])).toThrow(RangeError);
    expect(() => spearmanRho("a" as unknown as number[], [1, 2])).toThrow(TypeError);
    expect(() => topKOverlap([1, 2, 3], [1, 2, 3], 4)).toThrow(/k must be/);
  });
  it("property: both lie in [−1, 1], are symmetric and invariant under monotone maps", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: -50, max: 50 }), fc.integer({ min: -50, max: 50 })), {
          minLength: 2,
          maxLength: 40,
        }),
        (pairs) => {
          const x = pairs.map((p) => p[0]);
          const y = pairs.map((p) => p[1]);
          for (const f of [spearmanRho, kendallTau]) {
            const r = f(x, y);
            if (Number.isNaN(r)) continue;
            expect(r).toBeGreaterThanOrEqual(-1);
            expect(r).toBeLessThanOrEqual(1);
            expect(f(y, x)).toBeCloseTo(r, 12);
            expect(f(x.map((v) => v * v * v + 3), y)).toBeCloseTo(r, 12);
          }
        },
      ),
    );
  });
});

describe("topKOverlap", () => {
  it("counts the shared shortlist (hand-made)", () => {
    const exact = [10, 9, 8, 7, 6, 5];
    const est = [10, 1, 8, 7, 9, 5]; // top-3: {0,4,2} vs exact {0,1,2} → 2 shared
    expect(topKOverlap(exact, est, 3)).toBeCloseTo(2 / 3, 14);
    expect(topKOverlap(exact, exact, 6)).toBe(1);
  });
});
