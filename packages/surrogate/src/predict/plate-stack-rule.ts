/** The values of the stacking arithmetic for one row (metres; absent caps as their neutral value). */
export interface StackRule {
  readonly floorHeight: number;
  readonly maxHeight: number;
  /** FAR cap; Infinity when none. */
  readonly maxFar: number;
  /** Lot-coverage cap in (0, 1]. */
  readonly maxCoverage: number;
  readonly minPlateWidth: number;
  readonly minPlateArea: number;
  /** Sky exposure plane start height and ratio; both absent when there is none. */
  readonly skyPlaneStart?: number;
  readonly skyPlaneRatio?: number;
}

/** Why the next floor was not built (as the massing rule reports it). */
export type StackLimit = "height" | "plate" | "far" | "setbacks";

/** The massing outputs the stacking arithmetic yields. */
export interface StackResult {
  readonly floors: number;
  readonly gfa: number;
  readonly footprintArea: number;
  readonly limitedBy: StackLimit;
}

/** The name model files give this rule (the code is floorcast's; a file only names it). */
export const PLATE_STACK_RULE_NAME = "floorcast.massing-plate-stack-v1";

/** Relative tolerance of the rule: areas to 1e-9 × lot area, widths to 1e-9 × √(lot area) (as the exact evaluator). */
const REL = 1e-9;
/** Absolute tolerance of the height test, metres (as the exact evaluator). */
const HEIGHT_TOL = 1e-9;

/**
 * The sky-plane inset of storey k: d = (z − startHeight) / ratio at its top z = k × floorHeight when z is above
 * the plane's start, else 0 (the sky exposure plane as the massing rule applies it; README "The massing rule").
 * @param rule - the row's rule values.
 * @param k - storey, 1-based.
 * @returns the required distance from the street lot lines, metres.
 */
export function storeyInset(rule: StackRule, k: number): number {
  const z = k * rule.floorHeight;
  const start = rule.skyPlaneStart;
  const ratio = rule.skyPlaneRatio;
  return start !== undefined && ratio !== undefined && z > start ? (z - start) / ratio : 0;
}

/**
 * Number of storeys the height limit allows: the largest k with k × floorHeight ≤ maxHeight (+1e-9 m).
 * @param rule - the row's rule values.
 */
export function storeysAllowed(rule: StackRule): number {
  let k = 0;
  while ((k + 1) * rule.floorHeight <= rule.maxHeight + HEIGHT_TOL) k++;
  return k;
}

/**
 * The base plate area after the lot-coverage cap: the buildable area B, or the cap maxCoverage × lotArea when B
 * exceeds it (the exact rule insets B until its area equals the cap; the area is then the cap).
 * @param rule - the row's rule values.
 * @param lotArea - lot area, m².
 * @param buildableArea - buildable area before the cap, m².
 * @returns the base plate area, m² (≥ 0).
 */
export function coveredBaseArea(rule: StackRule, lotArea: number, buildableArea: number): number {
  const tol = REL * lotArea;
  const target = rule.maxCoverage * lotArea;
  const b = Math.max(0, buildableArea);
  return b > tol && b > target + tol ? target : b;
}

/**
 * Stacks floors exactly as the massing rule (version 1, step 3) does, given the lot area, the buildable area and
 * the plate of each storey before the stops: the height limit, an empty buildable area, the minimum plate area and
 * width, and the FAR cap at whole floors, tested storey by storey from the ground.
 * @param rule - the row's rule values.
 * @param lotArea - lot area, m².
 * @param buildableArea - buildable area before the coverage cap, m².
 * @param plateAt - area (m²) and least width (m) of storey k's plate (after the coverage cap and the sky-plane cut).
 * @returns floors, gross floor area, footprint area and the reason the next floor was not built.
 */
export function stackPlates(
  rule: StackRule,
  lotArea: number,
  buildableArea: number,
  plateAt: (k: number) => readonly [number, number],
): StackResult {
  const areaTol = REL * Math.max(0, lotArea);
  const widthTol = REL * Math.sqrt(Math.max(0, lotArea));
  const farCap = Number.isFinite(rule.maxFar) ? rule.maxFar * lotArea + areaTol : Infinity;
  let gfa = 0;
  let floors = 0;
  let footprintArea = 0;
  for (let k = 1; ; k++) {
    if (k * rule.floorHeight > rule.maxHeight + HEIGHT_TOL) return { floors, gfa, footprintArea, limitedBy: "height" };
    if (buildableArea <= areaTol) return { floors, gfa, footprintArea, limitedBy: "setbacks" };
    const [area, width] = plateAt(k);
    const fails =
      area <= areaTol ||
      area < rule.minPlateArea - areaTol ||
      (rule.minPlateWidth > 0 && width < rule.minPlateWidth - widthTol);
    if (fails) return { floors, gfa, footprintArea, limitedBy: "plate" };
    if (gfa + area > farCap) return { floors, gfa, footprintArea, limitedBy: "far" };
    gfa += area;
    floors = k;
    if (k === 1) footprintArea = area;
  }
}
