import { leastWidth, type MassingInput, type Point } from "@floorcast/sampler";
import { PARCEL_DESIGN_VARIABLES } from "./parcel-design-variables.js";

/** The descriptor columns a cross-parcel surrogate sees, in column order. */
export const PARCEL_DESCRIPTOR_NAMES = [
  "parcelArea",
  "perimeter",
  "leastWidth",
  "frontDepth",
  "corners",
  "convexity",
  "frontage",
  "minFrontYard",
  "minSideYard",
  "minRearYard",
  "heightCap",
  "farCap",
  "coverageCap",
  "skyPlaneStart",
  "minPlateArea",
  "minPlateWidth",
] as const;

/** One parcel's descriptors, by name (see {@link PARCEL_DESCRIPTOR_NAMES}). */
export type ParcelDescriptors = Readonly<Record<(typeof PARCEL_DESCRIPTOR_NAMES)[number], number>>;

/** The smallest floor-to-floor height a parcel design may take. */
const LEAST_FLOOR_HEIGHT = (PARCEL_DESIGN_VARIABLES.find((v) => v.name === "floorHeight") as { readonly min: number }).min;

function shoelace(v: readonly Point[]): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) {
    const a = v[i]!;
    const b = v[(i + 1) % v.length]!;
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s / 2;
}

/** Convex hull, counter-clockwise (Andrew's monotone chain, 1979). */
function convexHull(points: readonly Point[]): Point[] {
  const p = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const cross = (o: Point, a: Point, b: Point): number => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: Point[] = [];
  for (const q of p) {
    while (lower.length >= 2 && cross(lower[lower.length - 2]!, lower[lower.length - 1]!, q) <= 0) lower.pop();
    lower.push(q);
  }
  const upper: Point[] = [];
  for (const q of [...p].reverse()) {
    while (upper.length >= 2 && cross(upper[upper.length - 2]!, upper[upper.length - 1]!, q) <= 0) upper.pop();
    upper.push(q);
  }
  return [...lower.slice(0, -1), ...upper.slice(0, -1)];
}

/** Largest distance of any vertex from the line through a–b. */
function farthestFrom(a: Point, b: Point, points: readonly Point[]): number {
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
  let far = 0;
  for (const q of points) far = Math.max(far, Math.abs((b[0] - a[0]) * (q[1] - a[1]) - (b[1] - a[1]) * (q[0] - a[0])) / len);
  return far;
}

/**
 * Descriptors of a parcel and its zoning controls, the inputs (with the design variables) of a surrogate
 * trained across parcels (named apart from the massing outputs): lot area, perimeter, least width (the least distance between two parallel lines
 * enclosing the lot: the sampler's leastWidth, the width the massing rule compares with minPlateWidth), depth from the
 * front (largest distance of a vertex from the longest front lot line), number of corners, convexity ratio
 * (lot area ÷ convex hull area), frontage (total length of the front lot lines), the minimum yards (street
 * yards count as front), the height, FAR and coverage caps, the sky plane's start, and the least plate area and
 * width. Absent controls take the value with the same effect (derived): no FAR cap → heightCap ÷ the least floor height of PARCEL_DESIGN_VARIABLES (no
 * design can exceed it: at most heightCap ÷ floor height storeys, each at most the lot), no coverage cap → 1,
 * no sky plane → a start at the height cap, no plate minimums → 0.
 * @param input - the parcel's massing input in metres (as evaluateParcelFile builds it).
 * @returns the descriptors, all finite.
 */
export function parcelDescriptors(input: MassingInput): ParcelDescriptors {
  const v = input.parcel.vertices;
  const n = v.length;
  const hull = convexHull(v);
  const hullArea = Math.abs(shoelace(hull));
  const lotArea = Math.abs(shoelace(v));
  let perimeter = 0;
  let frontage = 0;
  let longestFront = -1;
  let longestLength = 0;
  for (let i = 0; i < n; i++) {
    const a = v[i]!;
    const b = v[(i + 1) % n]!;
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    perimeter += len;
    if (input.parcel.lotLines[i] === "front") {
      frontage += len;
      if (len > longestLength) [longestFront, longestLength] = [i, len];
    }
  }
  const frontDepth = longestFront < 0 ? 0 : farthestFrom(v[longestFront]!, v[(longestFront + 1) % n]!, v);
  const s = input.setbacks;
  return {
    parcelArea: lotArea,
    perimeter,
    leastWidth: leastWidth(v),
    frontDepth,
    corners: n,
    convexity: hullArea > 0 ? lotArea / hullArea : 0,
    frontage,
    minFrontYard: Math.max(s.front, s.street ?? s.front),
    minSideYard: s.side,
    minRearYard: s.rear,
    heightCap: input.maxHeight,
    farCap: input.maxFar ?? input.maxHeight / LEAST_FLOOR_HEIGHT,
    coverageCap: input.maxCoverage ?? 1,
    skyPlaneStart: input.skyPlane === undefined ? input.maxHeight : Math.min(input.skyPlane.startHeight, input.maxHeight),
    minPlateArea: input.minPlateArea ?? 0,
    minPlateWidth: input.minPlateWidth ?? 0,
  };
}
