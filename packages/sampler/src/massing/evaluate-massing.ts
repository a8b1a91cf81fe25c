import { clipHalfPlanes } from "../geometry/clip-half-planes.js";
import { convexPolygonProblem } from "../geometry/convex-polygon-problem.js";
import { simplePolygonProblem } from "../geometry/simple-polygon-problem.js";
import { makeCounterClockwise } from "../geometry/make-counter-clockwise.js";
import { signedArea } from "../geometry/polygon-area.js";
import { polygonPerimeter } from "../geometry/polygon-perimeter.js";
import { polygonWidth } from "../geometry/polygon-width.js";
import { evaluateSimpleLot } from "./evaluate-simple-lot.js";
import type { LimitedBy, MassingInput, MassingResult, Point, StoreyPlate } from "./massing-types.js";
import { MassingWorkspace } from "./massing-workspace.js";
import { massingTotals } from "./massing-totals.js";
import { skyPlaneCut } from "./sky-plane-cut.js";
import { solveCoverageInset } from "./solve-coverage-inset.js";
import { validateMassingInput } from "./validate-massing-input.js";

/** Options of {@link evaluateMassing}. */
export interface EvaluateMassingOptions {
  /** Include the floor plates, floor by floor (default false). */
  readonly plates?: boolean;
  /** Include the plate profile: every storey the height limit allows, before the plate and FAR stops (default false). */
  readonly profile?: boolean;
}

/** Relative tolerance of the rule: areas to 1e-9 × lot area, widths to 1e-9 × √(lot area). */
const REL = 1e-9;
/** Absolute tolerance of the height test, metres. */
const HEIGHT_TOL = 1e-9;

const ws = new MassingWorkspace();

interface PlateLimits {
  /** Areas at or below this count as empty. */
  readonly emptyArea: number;
  /** Least plate area, less the tolerance. */
  readonly minArea: number;
  /** Least plate width (0: no test). */
  readonly minWidth: number;
  readonly widthTol: number;
}

/** The plate test of step 3: empty, smaller than minPlateArea or narrower than minPlateWidth. */
function plateFails(plate: Float64Array, m: number, area: number, limits: PlateLimits): boolean {
  if (area <= limits.emptyArea || area < limits.minArea) return true;
  return limits.minWidth > 0 && polygonWidth(plate, m) < limits.minWidth - limits.widthTol;
}

function toPoints(xy: Float64Array, m: number, ox: number, oy: number): Point[] {
  const pts: Point[] = new Array<Point>(m);
  for (let i = 0; i < m; i++) pts[i] = [xy[2 * i]! + ox, xy[2 * i + 1]! + oy];
  return pts;
}

/**
 * Evaluates the massing rule (version 1) exactly. On a convex lot: yards as half-planes at each lot line's setback,
 * the lot-coverage cap as an inner parallel polygon of the buildable area, then floors stacked
 * under the height limit, the sky exposure plane (a cut at (z − startHeight) / ratio from every
 * street lot line), the plate limits and the FAR cap. The rule is written out in the README
 * ("The massing rule (version 1)"). A simple non-convex lot goes through the yard rule for simple lots
 * (evaluateSimpleLot), which gives the same results on a convex lot; yard depths are measured at right angles to the lot line, as
 * zoning ordinances define yards. Estimates for early feasibility studies, not a zoning determination.
 * @param input - parcel, setbacks, heights and caps in metres (validated).
 * @param options - `plates: true` adds the floor plates to the result.
 * @returns areas, floors, height, GFA, FAR, coverage, open space, facade length, the reason the
 *   next floor was not built (`limitedBy`) and whether the coverage cap shrank the footprint.
 * @throws TypeError for a wrong type, RangeError for a bad value; messages start
 *   `evaluateMassing: <field path>`.
 */
export function evaluateMassing(input: MassingInput, options?: EvaluateMassingOptions): MassingResult {
  validateMassingInput(input);
  let wantPlates = false;
  let wantProfile = false;
  if (options !== undefined) {
    if (typeof options !== "object" || options === null) {
      throw new TypeError(`evaluateMassing: options must be an object, got ${String(options)}`);
    }
    if (options.plates !== undefined && typeof options.plates !== "boolean") {
      throw new TypeError(`evaluateMassing: options.plates must be a boolean, got ${typeof options.plates}`);
    }
    if (options.profile !== undefined && typeof options.profile !== "boolean") {
      throw new TypeError(`evaluateMassing: options.profile must be a boolean, got ${typeof options.profile}`);
    }
    wantPlates = options.plates === true;
    wantProfile = options.profile === true;
  }
  const { parcel, setbacks, floorHeight, maxHeight, skyPlane } = input;
  const vertices = parcel.vertices;
  const lotLines = parcel.lotLines;
  const n = vertices.length;
  ws.ensure(n);
  const xy = ws.parcel;
  // Work relative to the first vertex: parcels in map coordinates (e.g. 5e6 m northings) keep
  // their precision through the clipping and the coverage solve.
  const ox = vertices[0]![0];
  const oy = vertices[0]![1];
  for (let i = 0; i < n; i++) {
    const v = vertices[i]!;
    xy[2 * i] = v[0] - ox;
    xy[2 * i + 1] = v[1] - oy;
  }
  const problem = convexPolygonProblem(xy, n);
  if (problem !== null) {
    // Not convex: a simple lot goes through the yard rule for simple lots; anything else is refused.
    const simple = simplePolygonProblem(xy, n);
    if (simple !== null) {
      throw new RangeError(`evaluateMassing: parcel.vertices ${problem.startsWith("is not convex") ? simple : problem}`);
    }
    return evaluateSimpleLot(xy.slice(0, 2 * n), n, input, signedArea(xy, n) > 0, { plates: wantPlates, profile: wantProfile }, ox, oy);
  }
  const orient = signedArea(xy, n) > 0 ? 1 : -1;
  const streetSetback = setbacks.street ?? setbacks.front;

  // Yards: for edge i, the half-plane of points at distance ≥ setback from its line, parcel side.
  let yards = 0;
  let streets = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const px = xy[2 * i]!;
    const py = xy[2 * i + 1]!;
    const dx = xy[2 * j]! - px;
    const dy = xy[2 * j + 1]! - py;
    const len = Math.sqrt(dx * dx + dy * dy);
    const a = (-orient * dy) / len;
    const b = (orient * dx) / len;
    const c = a * px + b * py;
    const kind = lotLines[i]!;
    const s =
      kind === "front" ? setbacks.front : kind === "side" ? setbacks.side : kind === "rear" ? setbacks.rear : streetSetback;
    if (s > 0) {
      ws.yardPlanes[3 * yards] = a;
      ws.yardPlanes[3 * yards + 1] = b;
      ws.yardPlanes[3 * yards + 2] = c + s;
      yards++;
    }
    if (skyPlane !== undefined && (kind === "front" || kind === "street")) {
      ws.streetPlanes[3 * streets] = a;
      ws.streetPlanes[3 * streets + 1] = b;
      ws.streetPlanes[3 * streets + 2] = c;
      streets++;
    }
  }
  makeCounterClockwise(xy, n);
  const lotArea = Math.abs(signedArea(xy, n));
  const areaTol = REL * lotArea;
  const widthTol = REL * Math.sqrt(lotArea);

  // Step 1: the buildable area B.
  const mB = clipHalfPlanes(xy, n, ws.yardPlanes, yards, ws.buildable, ws.scratch);
  const buildableArea = mB > 0 ? Math.max(0, signedArea(ws.buildable, mB)) : 0;

  // Step 2: lot coverage.
  const coverageTarget = (input.maxCoverage ?? 1) * lotArea;
  let base = ws.buildable;
  let mBase = mB;
  let baseArea = buildableArea;
  let coverageCapped = false;
  if (buildableArea > areaTol && buildableArea > coverageTarget + areaTol) {
    mBase = solveCoverageInset(ws, mB, coverageTarget, areaTol, widthTol * 1e-3);
    base = ws.base;
    baseArea = mBase > 0 ? signedArea(base, mBase) : 0;
    coverageCapped = true;
  }

  // Step 3: floors. The same loop as stackStoreys (the simple-lot path's), kept inline here: calling it
  // measured 6–13 % slower on convex lots.
  const limits: PlateLimits = {
    emptyArea: areaTol,
    minArea: (input.minPlateArea ?? 0) - areaTol,
    minWidth: input.minPlateWidth ?? 0,
    widthTol,
  };
  const farCap = input.maxFar === undefined ? Infinity : input.maxFar * lotArea + areaTol;
  const plates: Point[][] | undefined = wantPlates ? [] : undefined;
  const plateFloors: number[] | undefined = wantPlates ? [] : undefined;
  let baseFails: boolean | undefined;
  let floors = 0;
  let gfa = 0;
  let footprintArea = 0;
  let facadeLength = 0;
  let limitedBy: LimitedBy;
  for (let k = 1; ; k++) {
    const z = k * floorHeight;
    if (z > maxHeight + HEIGHT_TOL) {
      limitedBy = "height";
      break;
    }
    if (buildableArea <= areaTol) {
      limitedBy = "setbacks";
      break;
    }
    let plate = base;
    let m = mBase;
    let area = baseArea;
    let fails: boolean;
    if (skyPlane !== undefined && z > skyPlane.startHeight) {
      const d = (z - skyPlane.startHeight) / skyPlane.ratio;
      m = skyPlaneCut(ws, base, mBase, streets, d);
      plate = ws.plate;
      area = m > 0 ? signedArea(plate, m) : 0;
      fails = plateFails(plate, m, area, limits);
    } else {
      baseFails ??= plateFails(plate, m, area, limits);
      fails = baseFails;
    }
    if (fails) {
      limitedBy = "plate";
      break;
    }
    if (gfa + area > farCap) {
      limitedBy = "far";
      break;
    }
    gfa += area;
    floors = k;
    if (k === 1) {
      footprintArea = area;
      facadeLength = polygonPerimeter(plate, m);
    }
    if (plates !== undefined) plates.push(toPoints(plate, m, ox, oy));
    if (plateFloors !== undefined) plateFloors.push(k);
  }
  const result = massingTotals({ lotArea, buildableArea, footprintArea, floors, floorHeight, gfa, facadeLength, limitedBy, coverageCapped });
  const withPlates = plates === undefined ? result : { ...result, plates, plateFloors };
  if (!wantProfile) return withPlates;
  // The profile: storey k (top at z = k × floorHeight ≤ maxHeight) has the base plate, cut by the sky exposure
  // plane above its start; no plate or FAR test is applied, so every storey the height limit allows is listed.
  const profile: StoreyPlate[] = [];
  for (let k = 1; k * floorHeight <= maxHeight + HEIGHT_TOL; k++) {
    const z = k * floorHeight;
    const inset = skyPlane !== undefined && z > skyPlane.startHeight ? (z - skyPlane.startHeight) / skyPlane.ratio : 0;
    let m = buildableArea <= areaTol ? 0 : mBase;
    let plate = base;
    if (m > 0 && inset > 0) {
      m = skyPlaneCut(ws, base, mBase, streets, inset);
      plate = ws.plate;
    }
    const area = m > 0 ? Math.max(0, signedArea(plate, m)) : 0;
    const width = area > areaTol ? polygonWidth(plate, m) : 0;
    profile.push({ topHeight: z, inset, area, width });
  }
  return { ...withPlates, profile };
}
