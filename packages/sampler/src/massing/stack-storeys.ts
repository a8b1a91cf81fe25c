import type { LimitedBy } from "./massing-types.js";

/** Absolute tolerance of the height test, metres. */
const HEIGHT_TOL = 1e-9;

/** What a massing path supplies to {@link stackStoreys}: the limits and the plate of each storey. */
export interface StoreyStack {
  readonly floorHeight: number;
  readonly maxHeight: number;
  /** Area of B; at or below `areaTol` nothing is built ("setbacks"). */
  readonly buildableArea: number;
  readonly areaTol: number;
  /** maxFar × lot area + areaTol (Infinity without a FAR cap). */
  readonly farCap: number;
  /**
   * The plate of the storey whose top is at z: its area when it passes the plate tests (area, width),
   * or −1 when no piece passes. The path keeps the plate for `facade` and `record`.
   */
  plate(z: number): number;
  /** Facade length of the plate last returned (called for storey 1 only). */
  facade(): number;
  /** Called for each storey built, after `plate`, with its number (for the plates output). */
  record?(k: number): void;
}

/** The totals of {@link stackStoreys}. */
export interface StackedStoreys {
  readonly floors: number;
  readonly gfa: number;
  readonly footprintArea: number;
  readonly facadeLength: number;
  readonly limitedBy: LimitedBy;
}

/**
 * Step 3 of the massing rule on simple lots: storeys k = 1, 2, … with top z = k × floorHeight are
 * stacked while z ≤ maxHeight (+1e-9 m), B is not empty, the storey's plate passes (area and width
 * tests, applied by the path) and the GFA stays within the FAR cap; the first test that fails names
 * `limitedBy` (README, "The massing rule (version 1)"). The convex path in evaluateMassing keeps the
 * same loop written inline: calling this function from there measured 6–13 % slower on convex lots,
 * so a change to the stopping rule must be made in both (tests/sampler/massing-simple-lots.test.ts
 * checks that the two paths agree on convex lots).
 * @param s - the limits and the storey plates.
 * @returns floors built, their GFA, floor 1's area and facade length, and what stopped the stack.
 */
export function stackStoreys(s: StoreyStack): StackedStoreys {
  let floors = 0;
  let gfa = 0;
  let footprintArea = 0;
  let facadeLength = 0;
  let limitedBy: LimitedBy;
  for (let k = 1; ; k++) {
    const z = k * s.floorHeight;
    if (z > s.maxHeight + HEIGHT_TOL) {
      limitedBy = "height";
      break;
    }
    if (s.buildableArea <= s.areaTol) {
      limitedBy = "setbacks";
      break;
    }
    const area = s.plate(z);
    if (area < 0) {
      limitedBy = "plate";
      break;
    }
    if (gfa + area > s.farCap) {
      limitedBy = "far";
      break;
    }
    gfa += area;
    floors = k;
    if (k === 1) {
      footprintArea = area;
      facadeLength = s.facade();
    }
    s.record?.(k);
  }
  return { floors, gfa, footprintArea, facadeLength, limitedBy };
}
