import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { evaluateMassing, quadParcel } from "@floorcast/sampler";
import type { LotLine, MassingInput, MassingResult, Point } from "@floorcast/sampler";
import { evaluateSimpleLot } from "../../packages/sampler/src/massing/evaluate-simple-lot.js";

type Mutable<T> = { -readonly [K in keyof T]: T[K] };

/** The L-shaped lot of the README's worked check. */
const L: MassingInput = {
  parcel: {
    vertices: [[0, 0], [20, 0], [20, 10], [10, 10], [10, 20], [0, 20]],
    lotLines: ["front", "side", "rear", "side", "rear", "side"],
  },
  setbacks: { front: 2, side: 1, rear: 3 },
  floorHeight: 3,
  maxHeight: 10,
};

/** The non-convex path on any simple lot, as evaluateMassing would call it (relative to the first vertex). */
function simplePath(input: MassingInput, plates = false): MassingResult {
  const v = input.parcel.vertices;
  const n = v.length;
  const xy = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    xy[2 * i] = v[i]![0] - v[0]![0];
    xy[2 * i + 1] = v[i]![1] - v[0]![1];
  }
  let twice = 0;
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    twice += xy[2 * i]! * xy[2 * j + 1]! - xy[2 * j]! * xy[2 * i + 1]!;
  }
  return evaluateSimpleLot(xy, n, input, twice > 0, { plates, profile: false }, v[0]![0], v[0]![1]);
}

describe("the yard rule on an L-shaped lot (worked check)", () => {
  // Derived by hand: B is the L less a 2 m front strip, 1 m side strips, the 3 m rear yard of the notch's
  // rear line (bounded at the re-entrant corner (10, 10) by the perpendicular x = 10), the notch side's
  // 1 m yard (bounded at the same corner by y = 10) and the far rear line's 3 m yard:
  // rows y ∈ [2, 7] × x ∈ [1, 19], y ∈ [7, 10] × x ∈ [1, 10], y ∈ [10, 17] × x ∈ [1, 9]
  // → 18 × 5 + 9 × 3 + 8 × 7 = 173 m².
  it("B = 18 × 5 + 9 × 3 + 8 × 7 = 173 m²; three 3 m storeys under 10 m", () => {
    const r = evaluateMassing(L);
    expect(r.lotArea).toBeCloseTo(300, 12);
    expect(r.buildableArea).toBeCloseTo(173, 12);
    expect(r.footprintArea).toBeCloseTo(173, 12);
    expect(r.floors).toBe(3);
    expect(r.gfa).toBeCloseTo(519, 11);
    expect(r.limitedBy).toBe("height");
    // Perimeter of B: 18 + 5 + 9 + 3 + 1 + 7 + 8 + 15 (derived from the rows above).
    expect(r.facadeLength).toBeCloseTo(66, 12);
  });

  it("clockwise input with the lot lines following their edges gives the same result", () => {
    const v = L.parcel.vertices;
    const n = v.length;
    const cw = { ...L, parcel: { vertices: [...v].reverse(), lotLines: v.map((_, i) => L.parcel.lotLines[(2 * n - 2 - i) % n]!) } };
    expect(evaluateMassing(cw).buildableArea).toBeCloseTo(173, 12);
  });

  it("the sky plane takes the front yard at depth (z − start)/ratio by the same rule: 173 + 137 + 83 m²", () => {
    // Derived: storey tops at 3, 6, 9 m, start 2 m, ratio 1 → depths 1 (inside the 2 m front yard),
    // 4 (B ∩ y ≥ 4: 173 − 18 × 2 = 137) and 7 (B ∩ y ≥ 7: 27 + 56 = 83).
    const r = evaluateMassing({ ...L, skyPlane: { startHeight: 2, ratio: 1 } });
    expect(r.gfa).toBeCloseTo(173 + 137 + 83, 11);
  });

  it("the coverage cap offsets B's edges uniformly with mitred corners to maxCoverage × lot area", () => {
    const r = evaluateMassing({ ...L, maxCoverage: 0.4 }, { plates: true });
    expect(r.coverageCapped).toBe(true);
    expect(r.footprintArea).toBeCloseTo(120, 9);
    // Every plate edge is axis-parallel (mitred corners of an axis-parallel B; derived).
    for (const plate of r.plates!) {
      for (let i = 0; i < plate.length; i++) {
        const [x0, y0] = plate[i]!;
        const [x1, y1] = plate[(i + 1) % plate.length]!;
        expect(Math.min(Math.abs(x1 - x0), Math.abs(y1 - y0))).toBeLessThan(1e-9);
      }
    }
    expect(r.plateFloors).toEqual([1, 2, 3]);
  });
});

describe("plates in several pieces", () => {
  // A U-shaped lot: two 10 m prongs joined by a 4 m deep base; a 5 m front yard on the base's front
  // line leaves the prongs only (derived: each prong 10 × 16 after the rear 0 and side 0 yards).
  const U: MassingInput = {
    parcel: {
      vertices: [[0, 0], [30, 0], [30, 20], [20, 20], [20, 4], [10, 4], [10, 20], [0, 20]],
      lotLines: ["front", "side", "rear", "side", "rear", "side", "rear", "side"],
    },
    setbacks: { front: 5, side: 0, rear: 0 },
    floorHeight: 3,
    maxHeight: 6,
  };

  it("every piece is returned, storey by storey, and counts towards GFA", () => {
    const r = evaluateMassing(U, { plates: true });
    expect(r.buildableArea).toBeCloseTo(2 * 10 * 15, 9);
    expect(r.floors).toBe(2);
    expect(r.plates).toHaveLength(4);
    expect(r.plateFloors).toEqual([1, 1, 2, 2]);
    expect(r.gfa).toBeCloseTo(600, 9);
  });

  it("a piece narrower than minPlateWidth is not built; the storey keeps the others", () => {
    const narrow: MassingInput = {
      ...U,
      parcel: {
        vertices: [[0, 0], [30, 0], [30, 20], [24, 20], [24, 4], [10, 4], [10, 20], [0, 20]],
        lotLines: U.parcel.lotLines,
      },
      minPlateWidth: 8,
    };
    const r = evaluateMassing(narrow, { plates: true });
    // Left prong 10 × 15 kept, right prong 6 wide dropped (derived).
    expect(r.footprintArea).toBeCloseTo(150, 9);
    expect(r.plateFloors).toEqual([1, 2]);
    expect(evaluateMassing({ ...narrow, minPlateWidth: 11 }).limitedBy).toBe("plate");
  });

  it("the plate profile sums the pieces and reports the widest piece's width", () => {
    const r = evaluateMassing({ ...U, minPlateArea: 1000 }, { profile: true });
    expect(r.floors).toBe(0);
    expect(r.profile!.map((p) => p.area)).toEqual([expect.closeTo(300, 9), expect.closeTo(300, 9)]);
    expect(r.profile!.map((p) => p.width)).toEqual([expect.closeTo(10, 9), expect.closeTo(10, 9)]);
  });

  it("yards that leave nothing stop with limitedBy setbacks", () => {
    expect(evaluateMassing({ ...U, setbacks: { front: 20, side: 0, rear: 0 } }).limitedBy).toBe("setbacks");
  });
});

describe("lots that are not simple are refused, naming the problem", () => {
  it.each([
    ["a bow tie", [[0, 0], [10, 10], [10, 0], [0, 10]], /parcel\.vertices is not simple: edge 0 crosses or touches edge 2/],
    ["touching itself", [[0, 0], [20, 0], [10, 10], [20, 20], [0, 20], [10, 10]], /parcel\.vertices is not simple/],
    ["a spike", [[0, 0], [20, 0], [20, 20], [20, 10], [0, 20]], /doubles back/],
  ])("%s", (_name, vertices, message) => {
    const input = { ...L, parcel: { vertices: vertices as Point[], lotLines: vertices.map((_, i) => (i === 0 ? "front" : "side") as LotLine) } };
    expect(() => evaluateMassing(input)).toThrow(RangeError);
    expect(() => evaluateMassing(input)).toThrow(message);
  });
});

const d = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

describe("on convex lots both paths agree (the simple-lot rule reduces to the half-plane rule)", () => {
  const input = fc
    .record({
      frontage: d(8, 60), depth: d(12, 70), rearWidth: d(6, 60), skew: d(-30, 30),
      corner: fc.constantFrom("none", "left", "right") as fc.Arbitrary<"none" | "left" | "right">,
      front: d(0, 10), side: d(0, 6), rear: d(0, 12), street: fc.option(d(0, 8), { nil: undefined }),
      floorHeight: d(2.5, 5), maxHeight: d(2, 100),
      maxFar: fc.option(d(0.2, 10), { nil: undefined }),
      maxCoverage: fc.option(d(0.1, 1), { nil: undefined }),
      sky: fc.option(fc.record({ startHeight: d(0, 50), ratio: d(0.3, 8) }), { nil: undefined }),
      minPlateWidth: fc.option(d(0, 20), { nil: undefined }),
      minPlateArea: fc.option(d(0, 800), { nil: undefined }),
      x0: d(-5e5, 5e5), y0: d(-5e5, 5e5),
    })
    .map((p): MassingInput => {
      const parcel = quadParcel({ frontage: p.frontage, depth: p.depth, rearWidth: p.rearWidth, skew: p.skew, corner: p.corner });
      const x: Mutable<MassingInput> = {
        parcel: { vertices: parcel.vertices.map(([vx, vy]) => [vx + p.x0, vy + p.y0] as Point), lotLines: parcel.lotLines },
        setbacks: { front: p.front, side: p.side, rear: p.rear, ...(p.street === undefined ? {} : { street: p.street }) },
        floorHeight: p.floorHeight,
        maxHeight: p.maxHeight,
      };
      if (p.maxFar !== undefined) x.maxFar = p.maxFar;
      if (p.maxCoverage !== undefined) x.maxCoverage = p.maxCoverage;
      if (p.sky !== undefined) x.skyPlane = p.sky;
      if (p.minPlateWidth !== undefined) x.minPlateWidth = p.minPlateWidth;
      if (p.minPlateArea !== undefined) x.minPlateArea = p.minPlateArea;
      return x;
    });

  it("floors, limitedBy and coverageCapped identical; areas within the rule's 1e-9 × lot area", () => {
    fc.assert(
      fc.property(input, (x) => {
        const convex = evaluateMassing(x);
        const simple = simplePath(x);
        const tol = 1e-9 * convex.lotArea;
        expect(simple.floors).toBe(convex.floors);
        expect(simple.limitedBy).toBe(convex.limitedBy);
        expect(simple.coverageCapped).toBe(convex.coverageCapped);
        for (const k of ["lotArea", "buildableArea", "footprintArea", "gfa", "openSpace"] as const) {
          expect(Math.abs(simple[k] - convex[k])).toBeLessThanOrEqual(tol * Math.max(1, convex.floors));
        }
        expect(Math.abs(simple.facadeLength - convex.facadeLength)).toBeLessThanOrEqual(1e-9 * Math.sqrt(convex.lotArea));
      }),
      { numRuns: 300, seed: 20261202 },
    );
  });
});
