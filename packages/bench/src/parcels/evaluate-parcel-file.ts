import { evaluateMassing, FLOORCAST_CAUTION } from "@floorcast/sampler";
import type { LotLine, MassingInput, MassingResult, Point } from "@floorcast/sampler";
import { inferLotLines } from "./infer-lot-lines.js";
import type { StreetLine } from "./infer-lot-lines.js";
import { METRES, localTransverseMercator } from "./local-projection.js";
import type { LocalProjection } from "./local-projection.js";
import { featureCollectionSchema, polygonSchema, zoningControlsSchema } from "./parcel-file-schema.js";
import type { ZoningControls, ZoningTable } from "./parcel-file-schema.js";

/** Options of {@link evaluateParcelFile}. */
export interface ParcelFileOptions {
  /** "lonlat": RFC 7946 longitude/latitude, projected to local metres; "metres": a projected CRS in metres. */
  readonly coordinates: "lonlat" | "metres";
  /** Zone id → controls, for features with a `zone` property. */
  readonly zoning?: ZoningTable;
  /** Street lines (file coordinates), to infer lot-line kinds of features without `lotLines`. */
  readonly streets?: readonly (readonly (readonly [number, number])[])[];
  /** Largest distance (metres) from an edge's midpoint to a street line for the edge to face it. */
  readonly streetDistance: number;
  /** Add each parcel's floor plates as Polygon features. */
  readonly plates: boolean;
}

/** One evaluated parcel, in local metres, for callers that go on with it (ranking). */
export interface EvaluatedParcel {
  readonly index: number;
  readonly input: MassingInput;
  readonly result: MassingResult;
}

/** What {@link evaluateParcelFile} returns. */
export interface ParcelFileResult {
  /** The output FeatureCollection (input coordinates). */
  readonly collection: Record<string, unknown>;
  readonly evaluated: EvaluatedParcel[];
  /** Features that could not be evaluated, with the reason written into their properties. */
  readonly failed: number;
}

const CONTROL_KEYS = Object.keys(zoningControlsSchema.shape) as (keyof ZoningControls)[];
const KINDS = new Set(["front", "side", "rear", "street"]);

/** A feature problem, reported in the feature's place. */
class FeatureProblem extends Error {}

function projectionFor(collection: { features: { geometry: unknown }[] }, coordinates: "lonlat" | "metres"): LocalProjection {
  if (coordinates === "metres") return METRES;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const f of collection.features) {
    const g = polygonSchema.safeParse(f.geometry);
    if (!g.success) continue;
    for (const [x, y] of g.data.coordinates[0]!) {
      if (!(Math.abs(x!) <= 180 && Math.abs(y!) <= 90)) continue;
      minX = Math.min(minX, x!);
      maxX = Math.max(maxX, x!);
      minY = Math.min(minY, y!);
      maxY = Math.max(maxY, y!);
    }
  }
  if (minX > maxX) return localTransverseMercator(0, 0);
  return localTransverseMercator((minX + maxX) / 2, (minY + maxY) / 2);
}

function controlsOf(props: Record<string, unknown>, zoning: ZoningTable | undefined): ZoningControls {
  let base: ZoningControls = {};
  if (props.zone !== undefined) {
    if (typeof props.zone !== "string") throw new FeatureProblem(`zone must be a string, got ${JSON.stringify(props.zone)}`);
    if (zoning === undefined) throw new FeatureProblem(`zone ${JSON.stringify(props.zone)} given but no --zoning table`);
    const zone = zoning.zones[props.zone];
    if (zone === undefined) throw new FeatureProblem(`zone ${JSON.stringify(props.zone)} is not in the zoning table`);
    base = zone;
  }
  const direct: Record<string, unknown> = {};
  for (const key of CONTROL_KEYS) if (props[key] !== undefined) direct[key] = props[key];
  const parsed = zoningControlsSchema.safeParse(direct);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new FeatureProblem(`${issue.path.join(".")}: ${issue.message}`);
  }
  const controls = { ...base, ...parsed.data };
  const missing = (["setbacks", "floorHeight", "maxHeight"] as const).filter((k) => controls[k] === undefined);
  if (missing.length > 0) throw new FeatureProblem(`missing controls: ${missing.join(", ")} (give them as properties or through a zone)`);
  return controls;
}

function lotLinesOf(props: Record<string, unknown>, ring: [number, number][], streets: StreetLine[] | undefined, distance: number): { lines: LotLine[]; inferred: boolean } {
  const n = ring.length;
  if (props.lotLines !== undefined) {
    const v = props.lotLines;
    if (!Array.isArray(v) || v.length !== n || !v.every((k) => typeof k === "string" && KINDS.has(k))) {
      throw new FeatureProblem(`lotLines must list one of "front", "side", "rear", "street" per edge of the outer ring (${n} edges)`);
    }
    return { lines: v as LotLine[], inferred: false };
  }
  if (streets === undefined) throw new FeatureProblem(`no lotLines property and no --streets file to infer them from`);
  const lines = inferLotLines(ring, streets, distance);
  if (lines === null) throw new FeatureProblem(`no front: no edge's midpoint lies within ${distance} m of a street line`);
  return { lines, inferred: true };
}

function ringOf(geometry: unknown, coordinates: "lonlat" | "metres"): [number, number][] {
  const kind = typeof geometry === "object" && geometry !== null ? (geometry as { type?: unknown }).type : undefined;
  if (kind !== "Polygon") throw new FeatureProblem(`geometry must be a Polygon, got ${kind === undefined ? String(geometry) : JSON.stringify(kind)}`);
  const g = polygonSchema.safeParse(geometry);
  if (!g.success) throw new FeatureProblem(`geometry: ${g.error.issues[0]!.message}`);
  if (g.data.coordinates.length > 1) throw new FeatureProblem(`the polygon has holes (interior rings); lots must be simple polygons without holes`);
  const ring = g.data.coordinates[0]!.map((p) => [p[0]!, p[1]!] as [number, number]);
  const first = ring[0]!;
  const last = ring[ring.length - 1]!;
  if (first[0] !== last[0] || first[1] !== last[1]) throw new FeatureProblem(`the outer ring is not closed (its first and last positions differ)`);
  ring.pop();
  if (coordinates === "lonlat") {
    for (const [x, y] of ring) {
      if (!(Math.abs(x) <= 180 && Math.abs(y) <= 90)) {
        throw new FeatureProblem(`position [${x}, ${y}] is not longitude/latitude; for projected coordinates in metres use --coordinates metres`);
      }
    }
  }
  return ring;
}

function resultProperties(r: MassingResult, lines: LotLine[], inferred: boolean): Record<string, unknown> {
  return {
    fc_lotArea: r.lotArea,
    fc_buildableArea: r.buildableArea,
    fc_footprintArea: r.footprintArea,
    fc_floors: r.floors,
    fc_height: r.height,
    fc_gfa: r.gfa,
    fc_far: r.far,
    fc_coverage: r.coverage,
    fc_openSpace: r.openSpace,
    fc_facadeLength: r.facadeLength,
    fc_limitedBy: r.limitedBy,
    fc_coverageCapped: r.coverageCapped,
    fc_lotLines: lines,
    fc_lotLinesInferred: inferred,
  };
}

/**
 * Evaluates the massing rule on every Polygon feature of a GeoJSON FeatureCollection (RFC 7946): each
 * feature's outer ring is the lot (projected to local metres from longitude/latitude, or taken as
 * metres), its properties give the zoning controls directly or through a `zone` looked up in the
 * zoning table, and its lot-line kinds explicitly (`lotLines`, one per edge) or inferred from street
 * lines (inferLotLines). Every feature comes back with the results as `fc_*` properties (the lot-line
 * kinds used in `fc_lotLines`); a feature that cannot be evaluated keeps its geometry and gets
 * `fc_error` instead. With `plates`, each parcel's floor plates follow as Polygon features in the
 * input's coordinates. Estimates for early feasibility studies, not a zoning determination.
 * @param collection - the parsed GeoJSON.
 * @param options - coordinates, zoning table, street lines, plates.
 * @returns the output collection, the evaluated parcels and the number of failed features.
 * @throws RangeError when the input is not a FeatureCollection.
 */
export function evaluateParcelFile(collection: unknown, options: ParcelFileOptions): ParcelFileResult {
  const parsed = featureCollectionSchema.safeParse(collection);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new RangeError(`evaluateParcelFile: not a GeoJSON FeatureCollection: ${issue.path.join(".") || "(top)"}: ${issue.message}`);
  }
  const fc = parsed.data;
  const projection = projectionFor(fc, options.coordinates);
  const streets = options.streets?.map((line) => line.map((p) => projection.forward(p)));
  const features: Record<string, unknown>[] = [];
  const plateFeatures: Record<string, unknown>[] = [];
  const evaluated: EvaluatedParcel[] = [];
  let failed = 0;
  fc.features.forEach((feature, index) => {
    const props: Record<string, unknown> = { ...(feature.properties ?? {}) };
    try {
      const ring = ringOf(feature.geometry, options.coordinates).map((p) => projection.forward(p));
      const { lines, inferred } = lotLinesOf(props, ring, streets, options.streetDistance);
      const controls = controlsOf(props, options.zoning);
      const input = { ...controls, parcel: { vertices: ring as Point[], lotLines: lines } } as MassingInput;
      let result: MassingResult;
      try {
        result = evaluateMassing(input, { plates: options.plates });
      } catch (error) {
        if (error instanceof TypeError || error instanceof RangeError) throw new FeatureProblem(error.message.replace(/^evaluateMassing: /, ""));
        throw error;
      }
      evaluated.push({ index, input, result });
      features.push({ ...feature, properties: { ...props, ...resultProperties(result, lines, inferred) } });
      if (options.plates && result.plates !== undefined) {
        result.plates.forEach((plate, k) => {
          const floor = result.plateFloors?.[k] ?? k + 1;
          const coords = plate.map((p) => projection.inverse(p));
          coords.push(coords[0]!);
          plateFeatures.push({
            type: "Feature",
            geometry: { type: "Polygon", coordinates: [coords] },
            properties: { fc_parcel: feature.id ?? index, fc_kind: floor === 1 ? "footprint" : "plate", fc_floor: floor },
          });
        });
      }
    } catch (error) {
      if (!(error instanceof FeatureProblem)) throw error;
      failed++;
      features.push({ ...feature, properties: { ...props, fc_error: error.message } });
    }
  });
  const { features: _drop, ...members } = fc;
  void _drop;
  return {
    collection: { ...members, fc_caution: FLOORCAST_CAUTION, features: [...features, ...plateFeatures] },
    evaluated,
    failed,
  };
}
