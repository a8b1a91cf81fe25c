import { describe, expect, it } from "vitest";
import { createDesign, extendDesign, minPairwiseDistance } from "@floorcast/sampler";

describe("extendDesign (greedy maximin from seeded candidates)", () => {
  it("adds m points whose combined design has a larger minimum distance than a random extension (median over seeds)", () => {
    const ratios: number[] = [];
    for (let seed = 0; seed < 7; seed++) {
      const old = createDesign({ n: 60, dims: 4, design: "lhs-maximin", seed, eseIterations: 10 });
      const added = extendDesign(old, 20, { seed });
      expect(added).toHaveLength(20);
      const random = createDesign({ n: 20, dims: 4, design: "random", seed: 1000 + seed });
      ratios.push(minPairwiseDistance([...old, ...added]) / minPairwiseDistance([...old, ...random]));
    }
    ratios.sort((a, b) => a - b);
    expect(ratios[3]).toBeGreaterThan(1.5);
  });

  it("never moves the old points, stays in the unit cube and is deterministic in the seed", () => {
    const old = createDesign({ n: 16, dims: 3, design: "sobol", seed: 2 });
    const copy = old.map((r) => [...r]);
    const a = extendDesign(old, 8, { seed: "s" });
    expect(old).toEqual(copy);
    expect(extendDesign(old, 8, { seed: "s" })).toEqual(a);
    expect(extendDesign(old, 8, { seed: "t" })).not.toEqual(a);
    for (const row of a) for (const v of row) expect(v >= 0 && v < 1).toBe(true);
    // A new point never duplicates an old one or another new one.
    expect(minPairwiseDistance([...old, ...a])).toBeGreaterThan(0);
  });

  it("works from a single point in one dimension and with more points asked than default candidates", () => {
    expect(extendDesign([[0.5]], 3, { seed: 1 })).toHaveLength(3);
    expect(extendDesign([[0.5, 0.5]], 1200, { seed: 1, candidatesPerPoint: 1 })).toHaveLength(1200);
  });

  it("rejects bad input with the field named", () => {
    expect(() => extendDesign([], 3, { seed: 1 })).toThrow(/^extendDesign: existing must hold at least one point/);
    for (const m of [0, -1, 1.5, NaN, Infinity]) expect(() => extendDesign([[0.5]], m, { seed: 1 })).toThrow(/^extendDesign: m must be/);
    expect(() => extendDesign([[1.5]], 2, { seed: 1 })).toThrow(/must be in \[0, 1\]/);
    expect(() => extendDesign([[0.5]], 2, { seed: NaN })).toThrow(/seed/);
    expect(() => extendDesign([[0.5]], 2, undefined as unknown as { seed: number })).toThrow(TypeError);
  });
});
