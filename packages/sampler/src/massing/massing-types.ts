/**
 * Kind of a parcel edge. `street` is a street-facing side line of a corner lot.
 */
export type LotLine = "front" | "side" | "rear" | "street";

/** A point in metres, `[x, y]`. */
export type Point = readonly [number, number];

/** A parcel: a simple polygon (convex or not, no holes) and the kind of each of its edges. */
export interface Parcel {
  /** Vertices in either orientation; edge i runs from vertex i to vertex (i + 1) mod n. */
  readonly vertices: readonly Point[];
  /** `lotLines[i]` is the kind of edge i. */
  readonly lotLines: readonly LotLine[];
}

/** Required yard depths in metres, measured at right angles to each lot line. */
export interface Setbacks {
  readonly front: number;
  readonly side: number;
  readonly rear: number;
  /** Street-side yard of a corner lot; defaults to `front`. */
  readonly street?: number;
}

/** A sky exposure plane: starts `startHeight` above the street lot lines and rises `ratio` m per metre back. */
export interface SkyPlane {
  readonly startHeight: number;
  readonly ratio: number;
}

/** Everything the massing rule needs for one parcel (units: metres). */
export interface MassingInput {
  readonly parcel: Parcel;
  readonly setbacks: Setbacks;
  /** Floor-to-floor height, > 0. */
  readonly floorHeight: number;
  /** Height limit, > 0. */
  readonly maxHeight: number;
  /** Floor area ratio cap, > 0; no cap when absent. */
  readonly maxFar?: number;
  /** Lot coverage cap in (0, 1]; 1 when absent. */
  readonly maxCoverage?: number;
  readonly skyPlane?: SkyPlane;
  /** Least width of a floor plate, ≥ 0. */
  readonly minPlateWidth?: number;
  /** Least area of a floor plate, ≥ 0. */
  readonly minPlateArea?: number;
}

/** Why the next floor was not built. */
export type LimitedBy = "height" | "plate" | "far" | "setbacks";

/** One storey of a plate profile: the plate the rule offers before the plate-size and FAR stops. */
export interface StoreyPlate {
  /** Top of the storey, k × floorHeight, metres. */
  readonly topHeight: number;
  /** Distance the sky exposure plane requires from the street lot lines at that height (0 below its start or without one). */
  readonly inset: number;
  /** Plate area after the lot-coverage cap and the sky-plane cut, m² (0: empty). */
  readonly area: number;
  /** Least width of that plate, m (0: empty). */
  readonly width: number;
}

/** The exact result of the massing rule for one input. */
export interface MassingResult {
  readonly lotArea: number;
  readonly buildableArea: number;
  readonly footprintArea: number;
  readonly floors: number;
  readonly height: number;
  readonly gfa: number;
  readonly far: number;
  readonly coverage: number;
  readonly openSpace: number;
  readonly facadeLength: number;
  readonly limitedBy: LimitedBy;
  readonly coverageCapped: boolean;
  /**
   * Floor plates, only when asked for: every piece of every storey built, storey by storey
   * (one piece per storey on a convex lot; a non-convex lot's plate may fall into several).
   */
  readonly plates?: readonly (readonly Point[])[];
  /** Plate profile, storey by storey up to the height limit, only when asked for. */
  readonly profile?: readonly StoreyPlate[];
  /** With `plates`: the storey (1 = ground) of each entry of `plates`. */
  readonly plateFloors?: readonly number[];
}
