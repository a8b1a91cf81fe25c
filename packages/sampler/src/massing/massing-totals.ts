import type { LimitedBy, MassingResult } from "./massing-types.js";

/**
 * The massing result from the stacked totals, shared by the convex and the simple-lot paths: height =
 * floors × floorHeight, FAR = GFA / lot area, coverage = footprint / lot area, open space = lot − footprint.
 * @param t - the lot and buildable areas, the footprint, the floors, the floor height, the GFA, the facade
 *   length, what stopped the stacking and whether the coverage cap applied.
 * @returns the MassingResult without plates or profile.
 */
export function massingTotals(t: {
  readonly lotArea: number;
  readonly buildableArea: number;
  readonly footprintArea: number;
  readonly floors: number;
  readonly floorHeight: number;
  readonly gfa: number;
  readonly facadeLength: number;
  readonly limitedBy: LimitedBy;
  readonly coverageCapped: boolean;
}): MassingResult {
  return {
    lotArea: t.lotArea,
    buildableArea: t.buildableArea,
    footprintArea: t.footprintArea,
    floors: t.floors,
    height: t.floors * t.floorHeight,
    gfa: t.gfa,
    far: t.gfa / t.lotArea,
    coverage: t.footprintArea / t.lotArea,
    openSpace: t.lotArea - t.footprintArea,
    facadeLength: t.facadeLength,
    limitedBy: t.limitedBy,
    coverageCapped: t.coverageCapped,
  };
}
