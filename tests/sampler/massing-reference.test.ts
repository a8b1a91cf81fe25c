import { describe, expect, it } from "vitest";
import { evaluateMassing } from "@floorcast/sampler";
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
  const cases = randomMassingCases(400, "massing-reference-v1");
  const ref = runReference<{ results: RefResult[] }>("massing_shapely.py", { cases }).results;

  it("agrees on 400 random convex parcels (areas to 1e-6 × lot area; floors, limitedBy, coverageCapped exactly)", () => {
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
