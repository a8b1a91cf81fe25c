// "lhs-maximin-cd": ESE maximin, then discrepancy-lowering column exchanges under a distance floor.
import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { centredL2Discrepancy, createDesign, isLatin, minPairwiseDistance } from "@floorcast/sampler";
import { polishCentredDiscrepancy } from "../../packages/sampler/src/design/polish-centred-discrepancy.js";
import type { SeededRandom } from "../../packages/sampler/src/design/check-design-args.js";

const rng = (seed: string): SeededRandom => seedrandom(seed) as unknown as SeededRandom;

describe("polishCentredDiscrepancy", () => {
  const start = createDesign({ n: 80, dims: 5, design: "lhs-maximin", seed: 3 });

  it("tracks the discrepancy it reports: equal to centredL2Discrepancy of its points (checked against scipy elsewhere) to 1e-10 relative", () => {
    // centredL2Discrepancy is checked against scipy.stats.qmc.discrepancy(method="CD") in design-metrics and design-fixtures tests.
    const r = polishCentredDiscrepancy(start, rng("a"));
    expect(Math.abs(r.cdStart - centredL2Discrepancy(start)) / r.cdStart).toBeLessThan(1e-10);
    // The running sums accumulate every accepted update (CD² is a small difference of O(1) terms):
    // measured 1.4e-12 to 3.9e-12 relative on three seeds; 1e-10 leaves room for round-off, not for a wrong update.
    expect(Math.abs(r.cdEnd - centredL2Discrepancy(r.points)) / r.cdEnd).toBeLessThan(1e-10);
    expect(r.accepted).toBeGreaterThan(0);
    expect(r.cdEnd).toBeLessThan(r.cdStart);
  });

  it("keeps every pairwise distance at or above the floor and keeps a Latin hypercube Latin", () => {
    const r = polishCentredDiscrepancy(start, rng("b"));
    expect(r.minDistanceFloor).toBeCloseTo(0.7 * minPairwiseDistance(start), 12);
    expect(minPairwiseDistance(r.points)).toBeGreaterThanOrEqual(r.minDistanceFloor);
    expect(isLatin(r.points)).toBe(true);
    const tight = polishCentredDiscrepancy(start, rng("b"), { minDistanceFloor: minPairwiseDistance(start) });
    expect(minPairwiseDistance(tight.points)).toBeGreaterThanOrEqual(minPairwiseDistance(start));
  });

  it("gives the same design with and without the pair-product matrix", () => {
    const a = polishCentredDiscrepancy(start, rng("c"), { pairMatrix: true });
    const b = polishCentredDiscrepancy(start, rng("c"), { pairMatrix: false });
    expect(b.points).toEqual(a.points);
    expect(Math.abs(a.cdEnd - b.cdEnd) / a.cdEnd).toBeLessThan(1e-12);
  });

  it("handles degenerate designs without NaN: one point, one dimension, duplicated points", () => {
    expect(polishCentredDiscrepancy([[0.3, 0.6]], rng("d")).points).toEqual([[0.3, 0.6]]);
    const one = polishCentredDiscrepancy([[0.1], [0.5], [0.9]], rng("d"));
    expect(Number.isFinite(one.cdEnd)).toBe(true);
    const dup = polishCentredDiscrepancy([[0.2, 0.2], [0.2, 0.2], [0.7, 0.9], [0.9, 0.4]], rng("d"));
    expect(Number.isFinite(dup.cdEnd)).toBe(true);
    expect(Math.abs(dup.cdEnd - centredL2Discrepancy(dup.points))).toBeLessThan(1e-12);
  });
});

describe('createDesign "lhs-maximin-cd"', () => {
  it("polishes the lhs-maximin design of the same seed and ESE budget: lower discrepancy, at least 0.7 of its minimum distance", () => {
    for (const seed of [1, 2, 3]) {
      // "lhs-maximin-cd" runs 20 ESE outer iterations by default, then polishes that very design.
      const maximin = createDesign({ n: 120, dims: 6, design: "lhs-maximin", seed, eseIterations: 20 });
      const cd = createDesign({ n: 120, dims: 6, design: "lhs-maximin-cd", seed });
      expect(centredL2Discrepancy(cd)).toBeLessThan(centredL2Discrepancy(maximin));
      expect(minPairwiseDistance(cd)).toBeGreaterThanOrEqual(0.7 * minPairwiseDistance(maximin));
      expect(isLatin(cd)).toBe(true);
    }
  });
  it("is deterministic by seed", () => {
    expect(createDesign({ n: 40, dims: 3, design: "lhs-maximin-cd", seed: 9 })).toEqual(createDesign({ n: 40, dims: 3, design: "lhs-maximin-cd", seed: 9 }));
    expect(createDesign({ n: 40, dims: 3, design: "lhs-maximin-cd", seed: 9 })).not.toEqual(createDesign({ n: 40, dims: 3, design: "lhs-maximin-cd", seed: 10 }));
  });
});
