import { exactClip } from "../geometry/exact-clip.js";
import { ringArena } from "../geometry/ring-arena.js";
import { splitByHalfPlane } from "../geometry/split-by-half-plane.js";
import { hullWidth } from "../geometry/hull-width.js";
import { polygonWidth } from "../geometry/polygon-width.js";
import { ringArea, ringIsConvex, ringPerimeter } from "../geometry/ring-metrics.js";
import { lotFrame } from "./lot-frame.js";
import type { LotFrame } from "./lot-frame.js";
import { massingTotals } from "./massing-totals.js";
import type { MassingInput, MassingResult, Point, StoreyPlate } from "./massing-types.js";
import { skyCutPieces } from "./sky-cut-pieces.js";
import { solveCoveragePieces } from "./solve-coverage-pieces.js";
import { stackStoreys } from "./stack-storeys.js";
import { subtractStrip } from "./subtract-strip.js";
import { yardPieces } from "./yard-pieces.js";

/** Relative tolerance of the rule (as the convex path): areas 1e-9 × lot area, widths 1e-9 × √(lot area). */
const REL = 1e-9;
const HEIGHT_TOL = 1e-9;

interface Plate {
  /** Pieces that pass the plate tests. */
  readonly pieces: Float64Array[];
  readonly area: number;
}

interface PieceLimits {
  readonly empty: number;
  readonly minArea: number;
  readonly minWidth: number;
  readonly widthTol: number;
}

/** The pieces of a storey that pass: not empty, at least minPlateArea, at least minPlateWidth wide. */
function keptPieces(pieces: readonly Float64Array[], limits: PieceLimits): Plate {
  const kept: Float64Array[] = [];
  let area = 0;
  for (const ring of pieces) {
    const a = ringArea(ring);
    if (a <= limits.empty || a < limits.minArea) continue;
    if (limits.minWidth > 0) {
      const m = ring.length >> 1;
      const w = ringIsConvex(ring) ? polygonWidth(ring, m) : hullWidth(ring, m);
      if (w < limits.minWidth - limits.widthTol) continue;
    }
    kept.push(ring);
    area += a;
  }
  return { pieces: kept, area };
}

/** B's pieces less the half-plane within s of edge i, or null when the crossings do not pair up cleanly. */
function halfPlaneCut(f: LotFrame, i: number, s: number, pieces: readonly Float64Array[]): Float64Array[] | null {
  const cut: Float64Array[] = [];
  for (const ring of pieces) if (!splitByHalfPlane(ring, f.nx[i]!, f.ny[i]!, f.c[i]! + s, f.eps, cut)) return null;
  return cut;
}

function toPoints(ring: Float64Array, ox: number, oy: number): Point[] {
  const m = ring.length >> 1;
  const pts: Point[] = new Array<Point>(m);
  for (let i = 0; i < m; i++) pts[i] = [ring[2 * i]! + ox, ring[2 * i + 1]! + oy];
  return pts;
}

/**
 * The massing rule on a simple (possibly non-convex) lot: yards by the yard rule for simple lots
 * (yardPieces), B = lot − every yard (Clipper2 through exactClip), the coverage cap as one mitred
 * inward offset of all of B's pieces (solveCoveragePieces), then storeys whose plates lose the street
 * lines' yards at depth (z − startHeight) / ratio above the sky plane's start (skyCutPieces). A piece
 * smaller than minPlateArea or narrower than minPlateWidth is not built on that storey; stacking stops
 * at the first storey with no piece left, at the height limit and at the FAR cap. On a convex lot it
 * gives the convex rule's results (to round-off); evaluateMassing sends convex lots to its own path.
 * @param xy - the lot's vertices relative to (ox, oy), checked simple, in the input's order.
 * @param n - number of vertices.
 * @param input - the validated massing input.
 * @param ccw - whether `xy` is counter-clockwise.
 * @param want - `plates`: return the plates; `profile`: return the plate profile (for each storey the
 *   height limit allows: the plate's total area over its pieces, before the plate and FAR stops, and
 *   the width of its widest piece).
 * @param ox - x of the origin of `xy` in the input's coordinates.
 * @param oy - y of the origin.
 * @returns the massing result.
 */
export function evaluateSimpleLot(
  xy: Float64Array,
  n: number,
  input: MassingInput,
  ccw: boolean,
  want: { readonly plates: boolean; readonly profile: boolean },
  ox: number,
  oy: number,
): MassingResult {
  const { setbacks, floorHeight, maxHeight, skyPlane } = input;
  // Every ring of this evaluation comes from the arena; the plates are copied out (toPoints).
  ringArena.reset();
  const f = lotFrame(xy, n, input.parcel.lotLines, ccw);
  const lotArea = ringArea(f.xy);
  const areaTol = REL * lotArea;
  const widthTol = REL * Math.sqrt(lotArea);
  const streetSetback = setbacks.street ?? setbacks.front;
  const yards: Float64Array[] = [];
  const streets: number[] = [];
  // Step 1: the buildable area B. A yard that is the whole common part of the lot and an unbounded
  // strip, on a lot wholly on its line's inner side, is removed by the half-plane at depth s (exact in
  // floating point). The other yards are subtracted in floating point too, each strip a convex region
  // bounded by the perpendiculars at its re-entrant ends (subtractStrip); when some crossings do not
  // pair up cleanly, all of them are subtracted with Clipper2 instead, as one difference.
  let q: Float64Array[] = [f.xy];
  let exact: Float64Array[] | null = q;
  for (let i = 0; i < n; i++) {
    const kind = f.kinds[i]!;
    const s =
      kind === "front" ? setbacks.front : kind === "side" ? setbacks.side : kind === "rear" ? setbacks.rear : streetSetback;
    if (kind === "front" || kind === "street") streets.push(i);
    if (!(s > 0)) continue;
    const before = yards.length;
    const common = yardPieces(f, i, s, yards);
    const whole = common === yards.length - before;
    const reflex = f.reflexStart[i] === 1 || f.reflexEnd[i] === 1;
    if (!whole || reflex || !f.inner[i]) {
      if (common === 0) continue;
      if (exact !== null) exact = subtractStrip(f, i, s, exact, whole ? undefined : yards.slice(before));
      continue;
    }
    const cut = halfPlaneCut(f, i, s, q);
    if (cut === null) {
      exact = null;
      continue;
    }
    exact = exact === q ? cut : exact === null ? null : halfPlaneCut(f, i, s, exact);
    q = cut;
    yards.length = before;
  }
  const bRings = yards.length === 0 ? q : exact !== null ? exact : exactClip("difference", q, yards, f.extent);
  let buildableArea = 0;
  for (const r of bRings) buildableArea += ringArea(r);
  buildableArea = Math.max(0, buildableArea);
  // Slivers at or below the area tolerance are rounding, not pieces.
  const bPieces = bRings.filter((r) => ringArea(r) > areaTol);

  // Step 2: lot coverage.
  const coverageTarget = (input.maxCoverage ?? 1) * lotArea;
  let base = bPieces;
  let coverageCapped = false;
  if (buildableArea > areaTol && buildableArea > coverageTarget + areaTol) {
    base = solveCoveragePieces(bPieces, coverageTarget, areaTol, f.extent).filter((r) => ringArea(r) > areaTol);
    coverageCapped = true;
  }

  // Step 3: storeys.
  const limits: PieceLimits = {
    empty: areaTol,
    minArea: (input.minPlateArea ?? 0) - areaTol,
    minWidth: input.minPlateWidth ?? 0,
    widthTol,
  };
  const farCap = input.maxFar === undefined ? Infinity : input.maxFar * lotArea + areaTol;
  const plates: Point[][] | undefined = want.plates ? [] : undefined;
  const plateFloors: number[] | undefined = want.plates ? [] : undefined;
  let basePlate: Plate | undefined;
  /** The pieces of the storey whose top is at z that pass `limits` (the base plate's, cached, below the sky plane). */
  const storeyPlate = (z: number, limits: PieceLimits): Plate => {
    if (skyPlane !== undefined && z > skyPlane.startHeight && streets.length > 0) {
      return keptPieces(skyCutPieces(f, base, streets, (z - skyPlane.startHeight) / skyPlane.ratio), limits);
    }
    if (limits.minArea > -Infinity) {
      basePlate ??= keptPieces(base, limits);
      return basePlate;
    }
    return keptPieces(base, limits);
  };
  let last: Plate = { pieces: [], area: 0 };
  const stack = stackStoreys({
    floorHeight,
    maxHeight,
    buildableArea,
    areaTol,
    farCap,
    plate(z) {
      last = storeyPlate(z, limits);
      return last.pieces.length === 0 ? -1 : last.area;
    },
    facade() {
      let length = 0;
      for (const r of last.pieces) length += ringPerimeter(r);
      return length;
    },
    record:
      plates === undefined || plateFloors === undefined
        ? undefined
        : (k) => {
            for (const r of last.pieces) {
              plates.push(toPoints(r, ox, oy));
              plateFloors.push(k);
            }
          },
  });
  const result = massingTotals({
    lotArea,
    buildableArea,
    footprintArea: stack.footprintArea,
    floors: stack.floors,
    floorHeight,
    gfa: stack.gfa,
    facadeLength: stack.facadeLength,
    limitedBy: stack.limitedBy,
    coverageCapped,
  });
  const withPlates = plates === undefined ? result : { ...result, plates, plateFloors };
  if (!want.profile) return withPlates;
  // The profile: every storey the height limit allows, no plate or FAR test (every non-empty piece kept).
  const everything: PieceLimits = { empty: areaTol, minArea: -Infinity, minWidth: 0, widthTol };
  const profile: StoreyPlate[] = [];
  for (let k = 1; k * floorHeight <= maxHeight + HEIGHT_TOL; k++) {
    const z = k * floorHeight;
    const inset = skyPlane !== undefined && z > skyPlane.startHeight ? (z - skyPlane.startHeight) / skyPlane.ratio : 0;
    const plate = buildableArea <= areaTol ? { pieces: [], area: 0 } : storeyPlate(z, everything);
    let width = 0;
    for (const r of plate.pieces) width = Math.max(width, ringIsConvex(r) ? polygonWidth(r, r.length >> 1) : hullWidth(r, r.length >> 1));
    profile.push({ topHeight: z, inset, area: plate.area, width });
  }
  return { ...withPlates, profile };
}
