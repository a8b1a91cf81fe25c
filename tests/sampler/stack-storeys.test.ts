import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { stackStoreys } from "../../packages/sampler/src/massing/stack-storeys.js";
import type { StoreyStack } from "../../packages/sampler/src/massing/stack-storeys.js";

/**
 * A stack whose storey plates are given area by area (−1: no piece passes), counting the calls the
 * loop makes. Expected values below are derived by hand from the stacking rule of the README ("The
 * massing rule (version 1)", step 3).
 */
function stack(
  areas: (k: number) => number,
  o: { floorHeight?: number; maxHeight?: number; buildableArea?: number; farCap?: number } = {},
): StoreyStack & { facades: number; recorded: number[]; zs: number[] } {
  const s = {
    floorHeight: o.floorHeight ?? 3,
    maxHeight: o.maxHeight ?? 10,
    buildableArea: o.buildableArea ?? 100,
    areaTol: 1e-7,
    farCap: o.farCap ?? Infinity,
    facades: 0,
    recorded: [] as number[],
    zs: [] as number[],
    plate(z: number): number {
      s.zs.push(z);
      return areas(Math.round(z / s.floorHeight));
    },
    facade(): number {
      s.facades++;
      return 42;
    },
    record(k: number): void {
      s.recorded.push(k);
    },
  };
  return s;
}

describe("stackStoreys (step 3 of the massing rule on simple lots)", () => {
  it("stops at the height limit: 3 m storeys under 10 m give 3 floors (derived: 9 ≤ 10 < 12)", () => {
    const s = stack(() => 50);
    expect(stackStoreys(s)).toEqual({ floors: 3, gfa: 150, footprintArea: 50, facadeLength: 42, limitedBy: "height" });
    expect(s.zs).toEqual([3, 6, 9]);
    expect(s.recorded).toEqual([1, 2, 3]);
    expect(s.facades).toBe(1);
  });

  it("keeps a storey whose top is within 1e-9 m above maxHeight (the rule's height tolerance), not one 1e-6 m above", () => {
    expect(stackStoreys(stack(() => 50, { maxHeight: 9 - 1e-10 })).floors).toBe(3);
    expect(stackStoreys(stack(() => 50, { maxHeight: 9 - 1e-6 })).floors).toBe(2);
  });

  it("builds nothing when B is empty (at or below the area tolerance): limitedBy setbacks, no plate asked for", () => {
    const s = stack(() => 50, { buildableArea: 1e-7 });
    expect(stackStoreys(s)).toEqual({ floors: 0, gfa: 0, footprintArea: 0, facadeLength: 0, limitedBy: "setbacks" });
    expect(s.zs).toEqual([]);
    expect(s.facades).toBe(0);
  });

  it("the height test comes before the setbacks test (a storey taller than maxHeight gives height)", () => {
    expect(stackStoreys(stack(() => 50, { buildableArea: 0, floorHeight: 11 })).limitedBy).toBe("height");
  });

  it("stops at the first storey with no piece (limitedBy plate), keeping the storeys below", () => {
    const s = stack((k) => (k >= 3 ? -1 : 80 - 10 * k), { maxHeight: 30 });
    // Derived: storeys 1 and 2 (70 + 60 = 130), storey 3 fails.
    expect(stackStoreys(s)).toEqual({ floors: 2, gfa: 130, footprintArea: 70, facadeLength: 42, limitedBy: "plate" });
    expect(s.recorded).toEqual([1, 2]);
  });

  it("stops before the storey that would pass the FAR cap (limitedBy far); a plate failing on floor 1 gives 0 floors", () => {
    // Derived: 50 + 50 = 100 ≤ 120, + 50 = 150 > 120.
    expect(stackStoreys(stack(() => 50, { maxHeight: 30, farCap: 120 }))).toMatchObject({ floors: 2, gfa: 100, limitedBy: "far" });
    // GFA exactly at the cap is allowed (the cap already carries the area tolerance).
    expect(stackStoreys(stack(() => 50, { maxHeight: 30, farCap: 100 }))).toMatchObject({ floors: 2, limitedBy: "far" });
    expect(stackStoreys(stack(() => -1))).toEqual({ floors: 0, gfa: 0, footprintArea: 0, facadeLength: 0, limitedBy: "plate" });
  });

  it("property: floors = the first storey that fails any test, less one, and gfa is the sum of the plates built (derived)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.oneof(fc.constant(-1), fc.double({ min: 1, max: 500, noNaN: true })), { minLength: 1, maxLength: 30 }),
        fc.double({ min: 2.5, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 120, noNaN: true }),
        fc.option(fc.double({ min: 0, max: 5000, noNaN: true }), { nil: undefined }),
        (plates, floorHeight, maxHeight, farCap) => {
          const areaAt = (k: number): number => plates[(k - 1) % plates.length]!;
          const got = stackStoreys(stack(areaAt, { floorHeight, maxHeight, farCap }));
          let gfa = 0;
          let k = 1;
          for (; k * floorHeight <= maxHeight + 1e-9; k++) {
            const a = areaAt(k);
            if (a < 0 || gfa + a > (farCap ?? Infinity)) break;
            gfa += a;
          }
          expect(got.floors).toBe(k - 1);
          expect(got.gfa).toBe(gfa);
          expect(got.footprintArea).toBe(k > 1 ? areaAt(1) : 0);
        },
      ),
    );
  });
});
