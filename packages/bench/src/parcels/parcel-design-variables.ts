import type { MassingInput, Variable } from "@floorcast/sampler";
import type { Design } from "../optimize/optimization-problem.js";

/**
 * The design variables over which a parcel's best achievable objective is sought, the same on every parcel:
 * yards deeper than the zoning minimums (metres added to the front and street, side and rear yards), the
 * building's height limit and coverage cap as shares of the zone's caps (so a design never exceeds a cap), and
 * the floor-to-floor height.
 */
export const PARCEL_DESIGN_VARIABLES: readonly Variable[] = [
  { kind: "continuous", name: "frontYardExtra", min: 0, max: 3, unit: "m", description: "Front (and street) yard beyond the zone's minimum." },
  { kind: "continuous", name: "sideYardExtra", min: 0, max: 2, unit: "m", description: "Side yard beyond the zone's minimum." },
  { kind: "continuous", name: "rearYardExtra", min: 0, max: 3, unit: "m", description: "Rear yard beyond the zone's minimum." },
  { kind: "continuous", name: "heightShare", min: 0.5, max: 1, unit: "1", description: "Building height limit as a share of the zone's height cap." },
  { kind: "continuous", name: "coverageShare", min: 0.5, max: 1, unit: "1", description: "Coverage cap as a share of the zone's coverage cap (1 when the zone has none)." },
  { kind: "continuous", name: "floorHeight", min: 2.9, max: 4.2, unit: "m", description: "Floor-to-floor height." },
];

const num = (design: Design, name: string): number => {
  const v = design[name];
  if (typeof v !== "number" || !Number.isFinite(v)) throw new RangeError(`parcelDesignInput: design.${name} must be a finite number, got ${String(v)}`);
  return v;
};

/**
 * A parcel's massing input under one design of {@link PARCEL_DESIGN_VARIABLES}: each yard is the zone's minimum
 * plus its extra, the height limit and coverage cap are the zone's times their shares, the floor-to-floor height
 * is the design's; the FAR cap, sky plane and plate minimums stay the zone's.
 * @param zone - the parcel's massing input at the zone's controls (metres).
 * @param design - values of every design variable.
 * @returns the massing input to evaluate.
 * @throws RangeError when a design value is missing or not finite.
 */
export function parcelDesignInput(zone: MassingInput, design: Design): MassingInput {
  const front = num(design, "frontYardExtra");
  const s = zone.setbacks;
  return {
    ...zone,
    setbacks: {
      front: s.front + front,
      side: s.side + num(design, "sideYardExtra"),
      rear: s.rear + num(design, "rearYardExtra"),
      ...(s.street === undefined ? {} : { street: s.street + front }),
    },
    maxHeight: zone.maxHeight * num(design, "heightShare"),
    maxCoverage: (zone.maxCoverage ?? 1) * num(design, "coverageShare"),
    floorHeight: num(design, "floorHeight"),
  };
}
