import { describe, expect, it } from "vitest";
import { evaluateMassing, massingProfile, type MassingInput } from "@floorcast/sampler";
import { stackPlates, type StackRule } from "@floorcast/surrogate";
import { referenceAvailable, runReference } from "../reference/python.js";
import { randomMassingCases } from "./massing-random-cases.js";

function ruleOf(c: MassingInput): StackRule {
  return {
    floorHeight: c.floorHeight,
    maxHeight: c.maxHeight,
    maxFar: c.maxFar ?? Infinity,
    maxCoverage: c.maxCoverage ?? 1,
    minPlateWidth: c.minPlateWidth ?? 0,
    minPlateArea: c.minPlateArea ?? 0,
    ...(c.skyPlane ? { skyPlaneStart: c.skyPlane.startHeight, skyPlaneRatio: c.skyPlane.ratio } : {}),
  };
}

describe("massingProfile: the plates before the stops", () => {
  // Worked example (derived by hand): 20 × 30 m lot, front yard 5, side yards 3, rear yard 6 → plate 14 × 19 m =
  // 266 m², least width 14 m; 3.5 m floors under 24 m → ⌊24 / 3.5⌋ = 6 storeys. A sky exposure plane from the
  // front lot line starting at 7 m and rising 2 m per metre back requires d = (z − 7) / 2 from the front line:
  // storey 5 (z = 17.5) needs 5.25 m > the 5 m yard → 14 × (24 − 5.25) = 262.5 m²; storey 6 (z = 21) needs 7 m
  // → 14 × 17 = 238 m²; storeys 3 and 4 (d = 1.75, 3.5) stay inside the yard.
  const example: MassingInput = {
    parcel: { vertices: [[0, 0], [20, 0], [20, 30], [0, 30]], lotLines: ["front", "side", "rear", "side"] },
    setbacks: { front: 5, side: 3, rear: 6 },
    floorHeight: 3.5,
    maxHeight: 24,
  };
  it("lists every storey the height limit allows, with the plate's area and width", () => {
    const p = massingProfile(example);
    expect(p.lotArea).toBeCloseTo(600, 9);
    expect(p.buildableArea).toBeCloseTo(266, 9);
    expect(p.storeys.map((s) => s.topHeight)).toEqual([3.5, 7, 10.5, 14, 17.5, 21]);
    for (const s of p.storeys) {
      expect(s.area).toBeCloseTo(266, 9);
      expect(s.width).toBeCloseTo(14, 9);
      expect(s.inset).toBe(0);
    }
  });
  it("cuts the storeys above the sky exposure plane's start (worked example)", () => {
    const p = massingProfile({ ...example, skyPlane: { startHeight: 7, ratio: 2 } });
    expect(p.storeys.map((s) => s.inset)).toEqual([0, 0, 1.75, 3.5, 5.25, 7]);
    expect(p.storeys.map((s) => Number(s.area.toFixed(9)))).toEqual([266, 266, 266, 266, 262.5, 238]);
  });
  it("lists plates the FAR cap and the plate minimum would stop (no stop applied)", () => {
    const capped = { ...example, maxFar: 1, minPlateArea: 300 };
    expect(evaluateMassing(capped).floors).toBe(0);
    expect(massingProfile(capped).storeys).toHaveLength(6);
  });
  it("refuses bad options", () => {
    expect(() => evaluateMassing(example, { profile: "yes" as unknown as boolean })).toThrow(TypeError);
  });
});

describe("the stacking rule applied to the profile reproduces evaluateMassing", () => {
  // Derived: the profile's plates are the rule's plates before the stops, so stacking them with the plate
  // minima and the FAR cap must give the same floors, limiting reason and GFA. The only difference allowed is
  // the coverage-capped base area, which stackPlates takes from the profile as is: none, so 1e-9 × lot area.
  it("on 2,000 random convex parcels with yards, coverage, FAR, plate minima and sky planes", () => {
    const cases = randomMassingCases(2000, "plate-profile-v1");
    const reasons = new Set<string>();
    for (const c of cases) {
      const exact = evaluateMassing(c);
      const p = massingProfile(c);
      const r = stackPlates(ruleOf(c), p.lotArea, p.buildableArea, (k) => [p.storeys[k - 1]!.area, p.storeys[k - 1]!.width]);
      const at = JSON.stringify(c);
      expect(r.floors, at).toBe(exact.floors);
      expect(r.limitedBy, at).toBe(exact.limitedBy);
      expect(Math.abs(r.gfa - exact.gfa), at).toBeLessThanOrEqual(1e-9 * exact.lotArea);
      expect(Math.abs(r.footprintArea - exact.footprintArea), at).toBeLessThanOrEqual(1e-9 * exact.lotArea);
      reasons.add(r.limitedBy);
    }
    expect([...reasons].sort()).toEqual(["far", "height", "plate", "setbacks"]);
  });
});

const hasRef = referenceAvailable(["shapely", "numpy"]);

interface RefProfile {
  lotArea: number;
  buildableArea: number;
  profile: { topHeight: number; inset: number; area: number; width: number }[];
}

// Source: the independent Shapely implementation of the rule (tests/reference/massing_shapely.py, Debian
// python3-shapely 1.8.5): GEOS intersection for yards and the sky-plane cut, GEOS negative mitre buffer for the
// coverage inset, plate width as the least extent over the edge directions.
describe.skipIf(!hasRef)("massingProfile against the Shapely reference", () => {
  it("agrees on 300 random convex parcels (areas to 1e-6 × lot area, widths to 1e-6 × √lot area)", () => {
    const cases = randomMassingCases(300, "plate-profile-shapely-v1");
    const ref = runReference<{ results: RefProfile[] }>("massing_shapely.py", { cases, profile: true }).results;
    let cut = 0;
    cases.forEach((c, i) => {
      const mine = massingProfile(c);
      const r = ref[i]!;
      const at = `case ${i}: ${JSON.stringify(c)}`;
      // Tolerance: both sides solve the coverage inset to 1e-9 × lot area; 1e-6 leaves room for GEOS's round-off.
      const tol = 1e-6 * r.lotArea;
      expect(mine.storeys.length, at).toBe(r.profile.length);
      expect(Math.abs(mine.buildableArea - r.buildableArea), at).toBeLessThanOrEqual(tol);
      mine.storeys.forEach((s, k) => {
        const q = r.profile[k]!;
        expect(Math.abs(s.inset - q.inset), at).toBeLessThanOrEqual(1e-12 * Math.max(1, q.inset));
        expect(Math.abs(s.area - q.area), `${at} storey ${k + 1}`).toBeLessThanOrEqual(tol);
        expect(Math.abs(s.width - q.width), `${at} storey ${k + 1}`).toBeLessThanOrEqual(1e-6 * Math.sqrt(r.lotArea));
        if (s.inset > 0 && s.area > 0 && s.area < mine.storeys[0]!.area - tol) cut++;
      });
    });
    expect(cut).toBeGreaterThan(50); // the sky-plane cut is exercised, not only the uncut base
  });
});
