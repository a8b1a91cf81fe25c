import { z } from "zod";

const finite = z.number().refine(Number.isFinite, "must be a finite number");
const position = z.array(finite).min(2, "a position has at least 2 coordinates");

/** Zoning controls as they may appear in a zone of the zoning table or in a feature's properties. */
export const zoningControlsSchema = z
  .object({
    setbacks: z
      .object({ front: finite, side: finite, rear: finite, street: finite.optional() })
      .strict()
      .optional(),
    floorHeight: finite.optional(),
    maxHeight: finite.optional(),
    maxFar: finite.optional(),
    maxCoverage: finite.optional(),
    skyPlane: z.object({ startHeight: finite, ratio: finite }).strict().optional(),
    minPlateWidth: finite.optional(),
    minPlateArea: finite.optional(),
  })
  .strict();

/** A zoning table file: `{ "zones": { "<id>": controls, … } }`. */
export const zoningTableSchema = z
  .object({
    zones: z.record(z.string().min(1), zoningControlsSchema),
  })
  .strict();

/** A GeoJSON FeatureCollection (RFC 7946 §3.3) whose features are checked one by one later. */
export const featureCollectionSchema = z
  .object({
    type: z.literal("FeatureCollection"),
    features: z.array(
      z
        .object({
          type: z.literal("Feature"),
          geometry: z.unknown(),
          properties: z.record(z.string(), z.unknown()).nullable().optional(),
          id: z.union([z.string(), z.number()]).optional(),
        })
        .passthrough(),
    ),
  })
  .passthrough();

/** A Polygon geometry (RFC 7946 §3.1.6): linear rings of ≥ 4 positions, first = last. */
export const polygonSchema = z.object({
  type: z.literal("Polygon"),
  coordinates: z.array(z.array(position).min(4, "a linear ring has at least 4 positions")).min(1),
});

/** Street lines: LineString or MultiLineString features (RFC 7946 §3.1.4–3.1.5). */
export const streetGeometrySchema = z.union([
  z.object({ type: z.literal("LineString"), coordinates: z.array(position).min(2) }),
  z.object({ type: z.literal("MultiLineString"), coordinates: z.array(z.array(position).min(2)) }),
]);

export type ZoningControls = z.infer<typeof zoningControlsSchema>;
export type ZoningTable = z.infer<typeof zoningTableSchema>;
