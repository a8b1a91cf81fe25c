import { readFile } from "node:fs/promises";
import type { Command } from "commander";
import { basename } from "node:path";
import { UsageError } from "./usage-error.js";
import { streetGeometrySchema, zoningTableSchema } from "../parcels/parcel-file-schema.js";
import type { ZoningTable } from "../parcels/parcel-file-schema.js";

/** The parcel-file options `floorcast parcels` and `floorcast rank-parcels` share. */
export interface ParcelInputOptions {
  readonly input: string;
  readonly zoning?: string;
  readonly streets?: string;
  readonly streetDistance: string;
  readonly coordinates: string;
}

/** The parsed parcel inputs, ready for evaluateParcelFile. */
export interface ParcelInputs {
  readonly collection: unknown;
  readonly zoning: ZoningTable | undefined;
  readonly streets: [number, number][][] | undefined;
  readonly streetDistance: number;
  readonly coordinates: "lonlat" | "metres";
}

async function readJson(command: string, file: string, what: string): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(file, "utf8");
  } catch {
    throw new UsageError(`${command}: cannot read ${what} ${JSON.stringify(file)}`);
  }
  try {
    return JSON.parse(text) as unknown;
  } catch (e) {
    throw new UsageError(`${command}: ${basename(file)} is not valid JSON: ${(e as Error).message}`);
  }
}

async function readZoning(command: string, file: string): Promise<ZoningTable> {
  const parsed = zoningTableSchema.safeParse(await readJson(command, file, "--zoning"));
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new UsageError(`${command}: ${basename(file)}: ${issue.path.join(".") || "(top)"}: ${issue.message}`);
  }
  return parsed.data;
}

async function readStreets(command: string, file: string): Promise<[number, number][][]> {
  const data = (await readJson(command, file, "--streets")) as { type?: unknown; features?: unknown };
  if (data?.type !== "FeatureCollection" || !Array.isArray(data.features)) {
    throw new UsageError(`${command}: ${basename(file)} is not a GeoJSON FeatureCollection`);
  }
  const lines: [number, number][][] = [];
  data.features.forEach((f: unknown, i: number) => {
    const g = streetGeometrySchema.safeParse((f as { geometry?: unknown })?.geometry);
    if (!g.success) throw new UsageError(`${command}: ${basename(file)}: features.${i}.geometry must be a LineString or MultiLineString`);
    const parts = g.data.type === "LineString" ? [g.data.coordinates] : g.data.coordinates;
    for (const part of parts) lines.push(part.map((p) => [p[0]!, p[1]!]));
  });
  return lines;
}

/**
 * Checks the shared parcel-file options and reads the files they name: the parcel GeoJSON (parsed, checked by
 * evaluateParcelFile), the zoning table (zod-validated) and the street lines.
 * @param command - the command's name, for messages.
 * @param opts - --input, --zoning, --streets, --street-distance, --coordinates as commander gives them.
 * @returns the parsed inputs.
 * @throws UsageError naming the option or file for a bad value or an unreadable file.
 */
export async function readParcelInputs(command: string, opts: ParcelInputOptions): Promise<ParcelInputs> {
  if (opts.coordinates !== "lonlat" && opts.coordinates !== "metres") {
    throw new UsageError(`${command}: --coordinates must be lonlat or metres, got ${JSON.stringify(opts.coordinates)}`);
  }
  const distance = Number(opts.streetDistance);
  if (!(distance >= 0) || !Number.isFinite(distance)) {
    throw new UsageError(`${command}: --street-distance must be a number ≥ 0, got ${JSON.stringify(opts.streetDistance)}`);
  }
  return {
    collection: await readJson(command, opts.input, "--input"),
    zoning: opts.zoning === undefined ? undefined : await readZoning(command, opts.zoning),
    streets: opts.streets === undefined ? undefined : await readStreets(command, opts.streets),
    streetDistance: distance,
    coordinates: opts.coordinates,
  };
}

/**
 * Adds the options that name a parcel file and how to read it (--input, --zoning, --streets, --street-distance,
 * --coordinates), the same on every command that reads one.
 * @param command - the command being declared.
 * @returns the same command, for chaining.
 */
export function withParcelFileOptions(command: Command): Command {
  return command
    .requiredOption("--input <parcels.geojson>", "FeatureCollection of Polygon features")
    .option("--zoning <zones.json>", "zoning table: { \"zones\": { id: controls } } for features with a `zone` property")
    .option("--streets <streets.geojson>", "street lines (LineString features) to infer lot-line kinds where `lotLines` is absent")
    .option("--street-distance <metres>", "an edge whose midpoint lies within this distance of a street line faces it", "6")
    .option("--coordinates <lonlat|metres>", "lonlat (RFC 7946, projected to local metres) or metres (a projected CRS)", "lonlat");
}
