import { describe, expect, it } from "vitest";
import { evaluateMassing } from "@floorcast/sampler";
import type { MassingInput } from "@floorcast/sampler";
import { referenceAvailable, runReference } from "../reference/python.js";
import { randomMassingCases } from "./massing-random-cases.js";

interface RefResult {
  lotArea: number;
  buildableArea: number;
  footprintArea: number;
  floors: number;
  gfa: number;
  facadeLength: number;
  limitedBy: string;
  coverageCapped: boolean;
}

const hasRef = referenceAvailable(["shapely", "numpy"]);

// Source: an independent implementation of the same rule with Debian's python3-shapely 1.8.5
// (tests/reference/massing_shapely.py): GEOS polygon intersection for the yards and the sky plane,
// GEOS negative mitre buffer plus bisection for the coverage inset.
describe.skipIf(!hasRef)("evaluateMassing against the Shapely reference", () => {
  // Case 0 anchors the reference itself to the hand-worked example (derived; yards measured at
  // right angles to the lot line, Town of Woodway WA 14.08.350): 20 × 30 m, front 5, sides 3, rear 6,
  // 3.5 m floors under 24 m, FAR 2.5 → 266 m² plates, 5 floors, 1,330 m².
  const worked: MassingInput = {
    parcel: { vertices: [[0, 0], [20, 0], [20, 30], [0, 30]], lotLines: ["front", "side", "rear", "side"] },
    setbacks: { front: 5, side: 3, rear: 6 },
    floorHeight: 3.5,
    maxHeight: 24,
    maxFar: 2.5,
  };
  const cases = [worked, ...randomMassingCases(400, "massing-reference-v1")];
  const ref = runReference<{ results: RefResult[] }>("massing_shapely.py", { cases }).results;

  it("the reference reproduces the hand-worked 20 × 30 m example", () => {
    expect(ref[0]!.footprintArea).toBeCloseTo(266, 9);
    expect(ref[0]!.floors).toBe(5);
    expect(ref[0]!.gfa).toBeCloseTo(1330, 9);
    expect(ref[0]!.limitedBy).toBe("far");
  });

  it("agrees on the example and 400 random convex parcels (areas to 1e-6 × lot area; floors, limitedBy, coverageCapped exactly)", () => {
    const reasons = new Map<string, number>();
    let capped = 0;
    for (let i = 0; i < cases.length; i++) {
      const mine = evaluateMassing(cases[i]!);
      const r = ref[i]!;
      const at = `case ${i}: ${JSON.stringify(cases[i])}`;
      // Tolerance: both sides solve the coverage inset to 1e-9 × lot area; 1e-6 leaves room for
      // GEOS's and our round-off over up to ~30 floors.
      const tol = 1e-6 * r.lotArea;
      expect(Math.abs(mine.lotArea - r.lotArea), at).toBeLessThanOrEqual(tol);
      expect(Math.abs(mine.buildableArea - r.buildableArea), at).toBeLessThanOrEqual(tol);
      expect(Math.abs(mine.footprintArea - r.footprintArea), at).toBeLessThanOrEqual(tol);
      expect(Math.abs(mine.gfa - r.gfa), at).toBeLessThanOrEqual(tol);
      expect(Math.abs(mine.facadeLength - r.facadeLength), at).toBeLessThanOrEqual(1e-6 * Math.sqrt(r.lotArea));
      expect(mine.floors, at).toBe(r.floors);
      expect(mine.limitedBy, at).toBe(r.limitedBy);
      expect(mine.coverageCapped, at).toBe(r.coverageCapped);
      reasons.set(mine.limitedBy, (reasons.get(mine.limitedBy) ?? 0) + 1);
      if (mine.coverageCapped) capped++;
    }
    // The sample must exercise every stop and the coverage cap, or the comparison proves little.
    for (const why of ["height", "plate", "far", "setbacks"]) expect(reasons.get(why) ?? 0, why).toBeGreaterThan(5);
    expect(capped).toBeGreaterThan(40);
  });
});
