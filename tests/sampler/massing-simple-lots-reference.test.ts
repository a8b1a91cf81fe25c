import { describe, expect, it } from "vitest";
import { evaluateMassing } from "@floorcast/sampler";
import { SIMPLE_LOT_FAMILIES } from "../../packages/bench/src/benchmarks/simple-lot-families.js";
import { referenceAvailable, runReference } from "../reference/python.js";
import { simpleLotCases } from "./simple-lot-cases.js";

interface RefResult {
  lotArea: number;
  buildableArea: number;
  footprintArea: number;
  floors: number;
  gfa: number;
  facadeLength: number;
  limitedBy: string;
  coverageCapped: boolean;
  pieces: number;
}

const hasRef = referenceAvailable(["shapely", "numpy", "scipy"]);

// Source: an independent implementation of the yard rule for simple lots with Debian's python3-shapely
// 1.8.5 (tests/reference/massing_simple_lots_shapely.py): GEOS intersections of large strip polygons,
// pieces touching the segment kept by GEOS's distance, GEOS differences for B and the plates, GEOS's
// negative mitre buffer plus bisection for the coverage inset.
describe.skipIf(!hasRef)("evaluateMassing on non-convex lots against the Shapely reference", () => {
  for (const family of SIMPLE_LOT_FAMILIES) {
    it(`agrees on 400 random ${family} lots (areas to 1e-6 × lot area; floors, limitedBy, coverageCapped exactly)`, () => {
      const cases = simpleLotCases(family, 400, "simple-lots-reference-v1");
      const ref = runReference<{ results: RefResult[] }>("massing_simple_lots_shapely.py", { cases }).results;
      const reasons = new Map<string, number>();
      let capped = 0;
      let worst = 0;
      for (let i = 0; i < cases.length; i++) {
        const mine = evaluateMassing(cases[i]!);
        const r = ref[i]!;
        const at = `case ${i}: ${JSON.stringify(cases[i])}`;
        // Tolerance: both sides solve the coverage inset to 1e-9 × lot area and recover exact float
        // vertices; 1e-6 leaves room for GEOS's and our round-off over up to ~30 storeys.
        const tol = 1e-6 * r.lotArea;
        for (const key of ["lotArea", "buildableArea", "footprintArea", "gfa"] as const) {
          const diff = Math.abs(mine[key] - r[key]);
          worst = Math.max(worst, diff / r.lotArea);
          expect(diff, `${key} ${at}`).toBeLessThanOrEqual(tol);
        }
        expect(Math.abs(mine.facadeLength - r.facadeLength), at).toBeLessThanOrEqual(1e-6 * Math.sqrt(r.lotArea));
        expect(mine.floors, at).toBe(r.floors);
        expect(mine.limitedBy, at).toBe(r.limitedBy);
        expect(mine.coverageCapped, at).toBe(r.coverageCapped);
        reasons.set(mine.limitedBy, (reasons.get(mine.limitedBy) ?? 0) + 1);
        if (mine.coverageCapped) capped++;
      }
      console.log(`${family}: worst area difference ${worst.toExponential(2)} of lot area; stops ${JSON.stringify([...reasons])}; capped ${capped}`);
      for (const why of ["height", "plate", "far"]) expect(reasons.get(why) ?? 0, why).toBeGreaterThan(5);
      expect(capped).toBeGreaterThan(40);
    }, 600_000);
  }
});
