/** What values one slot of the massing rule accepts. */
export interface SlotDomain {
  /** Unit the value is expressed in. */
  readonly unit: string;
  /** Lower bound. */
  readonly min: number;
  /** Whether the lower bound itself is excluded. */
  readonly exclusive: boolean;
  /** Upper bound. */
  readonly max: number;
  /** Whether the upper bound itself is excluded (default included). */
  readonly maxExclusive?: boolean;
  /** Must be given (as a parameter or a fixed value). */
  readonly required: boolean;
  /** A slot taking one of these strings instead of a number. */
  readonly choices?: readonly string[];
  /** What the slot sets on the massing rule. */
  readonly meaning: string;
}

const m = (min: number, exclusive: boolean, required: boolean, meaning: string, unit = "m", max = Infinity): SlotDomain => ({
  unit,
  min,
  exclusive,
  max,
  required,
  meaning,
});

/**
 * The names a scenario may sample or fix, each mapped onto one field of the massing rule through the quad parcel
 * family. Each parameter and each fixed value of a scenario must be one of these.
 */
export const SCENARIO_SLOTS: Readonly<Record<string, SlotDomain>> = {
  frontage: m(0, true, true, "width of the front lot line (quadParcel frontage)"),
  depth: m(0, true, true, "lot depth, front lot line to rear lot line (quadParcel depth)"),
  rearWidth: m(0, true, false, "length of the rear lot line (quadParcel rearWidth); default the frontage"),
  rearRatio: m(0, true, false, "rear lot line as a multiple of the frontage (rearWidth = rearRatio × frontage)", "1"),
  skew: {
    ...m(-90, true, false, "skew of the side lot lines; the rear line shifts by depth·tan(skew) (quadParcel skew)", "°", 90),
    maxExclusive: true,
  },
  corner: {
    ...m(0, false, false, 'which side lot line faces a street: "none", "left" or "right" (quadParcel corner)', "", 0),
    choices: ["none", "left", "right"],
  },
  setbackFront: m(0, false, true, "front yard depth (setbacks.front)"),
  setbackSide: m(0, false, true, "side yard depth (setbacks.side)"),
  setbackRear: m(0, false, true, "rear yard depth (setbacks.rear)"),
  setbackStreet: m(0, false, false, "street-side yard depth of a corner lot (setbacks.street); default the front yard"),
  floorHeight: m(0, true, true, "floor-to-floor height (floorHeight)"),
  maxHeight: m(0, true, true, "height limit (maxHeight)"),
  maxFar: m(0, true, false, "floor area ratio cap (maxFar); no cap when absent", "1"),
  maxCoverage: m(0, true, false, "lot coverage cap (maxCoverage); 1 when absent", "1", 1),
  skyPlaneStart: m(0, false, false, "height at which the sky exposure plane starts (skyPlane.startHeight)"),
  skyPlaneRatio: m(0, true, false, "sky exposure plane slope, metres up per metre back (skyPlane.ratio)", "m/m"),
  minPlateWidth: m(0, false, false, "least floor-plate width (minPlateWidth)"),
  minPlateArea: m(0, false, false, "least floor-plate area (minPlateArea)", "m²"),
};
