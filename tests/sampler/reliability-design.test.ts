import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { centredL2Discrepancy, createDesign, DESIGN_KINDS, extendDesign, isLatin, mapUnitToSpace, minPairwiseDistance, phiP } from "@floorcast/sampler";

const hostileCount = fc.constantFrom(NaN, Infinity, -Infinity, -1, 0, 1.5, -0.5, 2 ** 60, "3", null, undefined, {}, [] as unknown[], true);
const hostileSeed = fc.constantFrom(NaN, Infinity, -Infinity, null, undefined, {}, [] as unknown[], true);

describe("design generators and metrics under hostile input", () => {
  it("createDesign: a bad n, dims, seed or design is a TypeError/RangeError naming the field", () => {
    fc.assert(
      fc.property(fc.constantFrom("n", "dims", "seed", "design"), fc.oneof(hostileCount, hostileSeed, fc.string({ maxLength: 4 })), fc.constantFrom(...DESIGN_KINDS), (field, v, design) => {
        const options: Record<string, unknown> = { n: 8, dims: 3, design, seed: 1, [field]: v };
        let points: number[][];
        try {
          points = createDesign(options as never);
        } catch (e) {
          expect(e instanceof TypeError || e instanceof RangeError).toBe(true);
          expect((e as Error).message).toMatch(new RegExp(`^createDesign: (${field}|n × dims) `));
          return;
        }
        // Accepted: only a string or finite-number seed (seedrandom takes any) — then a valid design.
        expect(field === "seed" && (typeof v === "string" || Number.isFinite(v))).toBe(true);
        expect(points).toHaveLength(8);
        for (const r of points) for (const x of r) expect(x >= 0 && x <= 1).toBe(true);
      }),
      { numRuns: 300, seed: 41 },
    );
  });

  it("createDesign: tiny and edge sizes (n = 1, dims = 1, n × dims at the memory cap) behave", () => {
    for (const design of DESIGN_KINDS) {
      const one = createDesign({ n: 1, dims: 1, design, seed: 0 });
      expect(one).toHaveLength(1);
      expect(one[0]![0]! >= 0 && one[0]![0]! <= 1).toBe(true);
    }
    expect(() => createDesign({ n: 5e7 + 1, dims: 1, design: "random", seed: 1 })).toThrow(/^createDesign: n × dims = 50000001 values/);
  });

  it("metrics of duplicated points: min distance 0, φp Infinity, discrepancy finite, never NaN; isLatin false", () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 2, maxLength: 2 }), { minLength: 1, maxLength: 10 }), (pts) => {
        const dup = [...pts, pts[0]!];
        expect(minPairwiseDistance(dup)).toBe(0);
        expect(phiP(dup)).toBe(Infinity);
        expect(Number.isFinite(centredL2Discrepancy(dup))).toBe(true);
        expect(isLatin(dup)).toBe(false);
      }),
      { numRuns: 100, seed: 42 },
    );
    for (const bad of [[[NaN, 0.5]], [[Infinity, 0]], [[0.5], [0.5, 0.5]]]) {
      expect(() => phiP(bad)).toThrow(/^phiP: points/);
      expect(() => centredL2Discrepancy(bad)).toThrow(/^centredL2Discrepancy: points/);
    }
    expect(() => centredL2Discrepancy([[1.5, 0]])).toThrow(/^centredL2Discrepancy: points\[0\]\[0\] must be in \[0, 1\]/);
  });

  it("extendDesign: hostile existing designs are refused; duplicated ones get new, distinct points", () => {
    for (const bad of [[[NaN, 0.5]], [[0.5], [0.5, 0.5]], [[2, 0]], "x", [[-0.1, 0]]]) {
      expect(() => extendDesign(bad as never, 3, { seed: 1 })).toThrow(/^extendDesign: /);
    }
    for (const m of [NaN, -1, 1.5, Infinity]) expect(() => extendDesign([[0.5, 0.5]], m, { seed: 1 })).toThrow(/^extendDesign: m /);
    const existing = [[0.5, 0.5], [0.5, 0.5], [0.5, 0.5]];
    const added = extendDesign(existing, 4, { seed: 2 });
    expect(added).toHaveLength(4);
    expect(minPairwiseDistance([existing[0]!, ...added])).toBeGreaterThan(0);
  });

  it("mapUnitToSpace: rows outside the cube, NaN or the wrong width are refused naming the row", () => {
    const space = { parameters: [{ kind: "continuous", name: "w", min: 1, max: 2, unit: "m", description: "w" }, { kind: "integer", name: "k", min: 0, max: 3, unit: "1", description: "k" }] } as never;
    for (const bad of [[[NaN, 0.5]], [[1.5, 0.5]], [[0.5]], [[0.5, -0.01]], [[0.5, Infinity]]]) {
      expect(() => mapUnitToSpace(space, bad)).toThrow(/^mapUnitToSpace: /);
    }
    for (const r of mapUnitToSpace(space, [[0, 1], [1, 0], [0.5, 0.5]])) {
      expect(r.w as number).toBeGreaterThanOrEqual(1);
      expect(r.w as number).toBeLessThanOrEqual(2);
      expect([0, 1, 2, 3]).toContain(r.k);
    }
  });
});
