import { clipHalfPlanes } from "../geometry/clip-half-planes.js";
import { convexPolygonProblem } from "../geometry/convex-polygon-problem.js";
import { simplePolygonProblem } from "../geometry/simple-polygon-problem.js";
import { makeCounterClockwise } from "../geometry/make-counter-clockwise.js";
import { signedArea } from "../geometry/polygon-area.js";
import { polygonPerimeter } from "../geometry/polygon-perimeter.js";
import { polygonWidth } from "../geometry/polygon-width.js";
import { evaluateSimpleLot } from "./evaluate-simple-lot.js";
import type { MassingInput, MassingResult, Point, StoreyPlate } from "./massing-types.js";
import { MassingWorkspace } from "./massing-workspace.js";
import { massingTotals } from "./massing-totals.js";
import { skyPlaneCut } from "./sky-plane-cut.js";
import { solveCoverageInset } from "./solve-coverage-inset.js";
import { stackStoreys } from "./stack-storeys.js";
import type { StoreyStack } from "./stack-storeys.js";
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
 * The storeys of a convex lot for stackStoreys: the base plate (its plate test done once), or below the
 * sky exposure plane's cut of it in the workspace. One instance, reused like the workspace, so the convex
 * path allocates no closures per evaluation.
 */
class ConvexStoreys implements StoreyStack {
  floorHeight = 0;
  maxHeight = 0;
  buildableArea = 0;
  areaTol = 0;
  farCap = 0;
  record: ((k: number) => void) | undefined = undefined;
  private limits: PlateLimits = { emptyArea: 0, minArea: 0, minWidth: 0, widthTol: 0 };
  private base: Float64Array = new Float64Array(0);
  private mBase = 0;
  private baseArea = 0;
  private skyPlane: MassingInput["skyPlane"] = undefined;
  private streets = 0;
  private baseFails: boolean | undefined = undefined;
  private plateXy: Float64Array = new Float64Array(0);
  private m = 0;

  /** Sets up one evaluation (the instance is reused, as the workspace is). */
  set(
    input: MassingInput,
    buildableArea: number,
    farCap: number,
    limits: PlateLimits,
    base: Float64Array,
    mBase: number,
    baseArea: number,
    streets: number,
    plates: { readonly xy: Point[][]; readonly floors: number[]; readonly ox: number; readonly oy: number } | undefined,
  ): this {
    this.floorHeight = input.floorHeight;
    this.maxHeight = input.maxHeight;
    this.buildableArea = buildableArea;
    this.areaTol = limits.emptyArea;
    this.farCap = farCap;
    this.limits = limits;
    this.base = base;
    this.mBase = mBase;
    this.baseArea = baseArea;
    this.skyPlane = input.skyPlane;
    this.streets = streets;
    this.baseFails = undefined;
    this.plateXy = base;
    this.m = mBase;
    this.record =
      plates === undefined
        ? undefined
        : (k) => {
            plates.xy.push(toPoints(this.plateXy, this.m, plates.ox, plates.oy));
            plates.floors.push(k);
          };
    return this;
  }

  plate(z: number): number {
    const sky = this.skyPlane;
    if (sky !== undefined && z > sky.startHeight) {
      const d = (z - sky.startHeight) / sky.ratio;
      const m = skyPlaneCut(ws, this.base, this.mBase, this.streets, d);
      const area = m > 0 ? signedArea(ws.plate, m) : 0;
      this.plateXy = ws.plate;
      this.m = m;
      return plateFails(ws.plate, m, area, this.limits) ? -1 : area;
    }
    this.plateXy = this.base;
    this.m = this.mBase;
    this.baseFails ??= plateFails(this.base, this.mBase, this.baseArea, this.limits);
    return this.baseFails ? -1 : this.baseArea;
  }

  facade(): number {
    return polygonPerimeter(this.plateXy, this.m);
  }
}

const storeys = new ConvexStoreys();

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

  // Step 3: floors.
  const limits: PlateLimits = {
    emptyArea: areaTol,
    minArea: (input.minPlateArea ?? 0) - areaTol,
    minWidth: input.minPlateWidth ?? 0,
    widthTol,
  };
  const farCap = input.maxFar === undefined ? Infinity : input.maxFar * lotArea + areaTol;
  const plates: Point[][] | undefined = wantPlates ? [] : undefined;
  const plateFloors: number[] | undefined = wantPlates ? [] : undefined;
  const stack = stackStoreys(
    storeys.set(input, buildableArea, farCap, limits, base, mBase, baseArea, streets, plates && plateFloors && { xy: plates, floors: plateFloors, ox, oy }),
  );
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
