import { evaluateMassing } from "./evaluate-massing.js";
import type { MassingInput, StoreyPlate } from "./massing-types.js";

/** The smooth quantities behind one massing result (see {@link massingProfile}). */
export interface MassingProfile {
  /** Lot area, m². */
  readonly lotArea: number;
  /** Buildable area inside the yards, before the lot-coverage cap, m². */
  readonly buildableArea: number;
  /** Storey k = 1..⌊maxHeight / floorHeight⌋: top height, sky-plane inset, plate area and width before the stops. */
  readonly storeys: readonly StoreyPlate[];
}

/**
 * The plate profile of a massing input: for every storey the height limit allows (top at z_k = k × floorHeight),
 * the plate the rule offers — after the yards, the lot-coverage cap and the sky exposure plane, before the
 * minimum-plate and FAR stops — with the lot area and the pre-cap buildable area. The stacking arithmetic
 * (plate stops, FAR cap at whole floors) applied to these reproduces evaluateMassing exactly; the geometry
 * is computed by the same code as evaluateMassing (README "The massing rule (version 1)").
 * @param input - the massing input (validated as by evaluateMassing).
 * @returns lot area, buildable area and one entry per storey.
 * @throws TypeError / RangeError as evaluateMassing.
 */
export function massingProfile(input: MassingInput): MassingProfile {
  const r = evaluateMassing(input, { profile: true });
  return { lotArea: r.lotArea, buildableArea: r.buildableArea, storeys: r.profile! };
}
