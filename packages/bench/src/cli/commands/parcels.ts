import { readFile } from "node:fs/promises";
import { basename } from "node:path";
import type { Command } from "commander";
import type { CommandContext } from "../command-context.js";
import { EXIT_CODES } from "../exit-codes.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { UsageError } from "../usage-error.js";
import { evaluateParcelFile } from "../../parcels/evaluate-parcel-file.js";
import { streetGeometrySchema, zoningTableSchema } from "../../parcels/parcel-file-schema.js";
import type { ZoningTable } from "../../parcels/parcel-file-schema.js";

interface ParcelsOptions {
  input: string;
  out: string;
  zoning?: string;
  streets?: string;
  streetDistance: string;
  coordinates: string;
  plates?: boolean;
  force?: boolean;
}

async function readJson(file: string, what: string): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(file, "utf8");
  } catch {
    throw new UsageError(`parcels: cannot read ${what} ${JSON.stringify(file)}`);
  }
  try {
    return JSON.parse(text) as unknown;
  } catch (e) {
    throw new UsageError(`parcels: ${basename(file)} is not valid JSON: ${(e as Error).message}`);
  }
}

async function readZoning(file: string): Promise<ZoningTable> {
  const parsed = zoningTableSchema.safeParse(await readJson(file, "--zoning"));
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new UsageError(`parcels: ${basename(file)}: ${issue.path.join(".") || "(top)"}: ${issue.message}`);
  }
  return parsed.data;
}

async function readStreets(file: string): Promise<[number, number][][]> {
  const data = (await readJson(file, "--streets")) as { type?: unknown; features?: unknown };
  if (data?.type !== "FeatureCollection" || !Array.isArray(data.features)) {
    throw new UsageError(`parcels: ${basename(file)} is not a GeoJSON FeatureCollection`);
  }
  const lines: [number, number][][] = [];
  data.features.forEach((f: unknown, i: number) => {
    const g = streetGeometrySchema.safeParse((f as { geometry?: unknown })?.geometry);
    if (!g.success) throw new UsageError(`parcels: ${basename(file)}: features.${i}.geometry must be a LineString or MultiLineString`);
    const parts = g.data.type === "LineString" ? [g.data.coordinates] : g.data.coordinates;
    for (const part of parts) lines.push(part.map((p) => [p[0]!, p[1]!]));
  });
  return lines;
}

/**
 * `floorcast parcels`: evaluates the exact massing rule on every parcel of a GeoJSON FeatureCollection
 * and writes the collection back with the results as `fc_*` properties (and, with `--plates`, the
 * floor plates as Polygon features), in the input's coordinates. Features that cannot be evaluated
 * get `fc_error` in place and the exit status becomes 1. Estimates for early feasibility studies, not
 * a zoning determination.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerParcelsCommand(program: Command, ctx: CommandContext): void {
  program
    .command("parcels")
    .description(
      "Evaluate the massing rule on the parcels of a GeoJSON file; write GeoJSON with the results as properties. " +
        "Estimates for early feasibility studies, not a zoning determination.",
    )
    .requiredOption("--input <parcels.geojson>", "FeatureCollection of Polygon features")
    .requiredOption("--out <result.geojson>", "GeoJSON to write")
    .option("--zoning <zones.json>", "zoning table: { \"zones\": { id: controls } } for features with a `zone` property")
    .option("--streets <streets.geojson>", "street lines (LineString features) to infer lot-line kinds where `lotLines` is absent")
    .option("--street-distance <metres>", "an edge whose midpoint lies within this distance of a street line faces it", "6")
    .option("--coordinates <lonlat|metres>", "lonlat (RFC 7946, projected to local metres) or metres (a projected CRS)", "lonlat")
    .option("--plates", "add every parcel's floor plates as Polygon features")
    .option("--force", "replace an existing output file")
    .action(async (opts: ParcelsOptions) => {
      if (opts.coordinates !== "lonlat" && opts.coordinates !== "metres") {
        throw new UsageError(`parcels: --coordinates must be lonlat or metres, got ${JSON.stringify(opts.coordinates)}`);
      }
      const distance = Number(opts.streetDistance);
      if (!(distance >= 0) || !Number.isFinite(distance)) {
        throw new UsageError(`parcels: --street-distance must be a number ≥ 0, got ${JSON.stringify(opts.streetDistance)}`);
      }
      const claim = await ctx.claimOutput("parcels", opts.out, { force: opts.force, inputs: [opts.input, opts.zoning, opts.streets] });
      const collection = await readJson(opts.input, "--input");
      const zoning = opts.zoning === undefined ? undefined : await readZoning(opts.zoning);
      const streets = opts.streets === undefined ? undefined : await readStreets(opts.streets);
      let result;
      try {
        result = evaluateParcelFile(collection, {
          coordinates: opts.coordinates,
          ...(zoning === undefined ? {} : { zoning }),
          ...(streets === undefined ? {} : { streets }),
          streetDistance: distance,
          plates: opts.plates === true,
        });
      } catch (e) {
        if (e instanceof RangeError) throw new UsageError(`parcels: ${basename(opts.input)}: ${e.message.replace(/^evaluateParcelFile: /, "")}`);
        throw e;
      }
      await claim.put(opts.out, `${JSON.stringify(result.collection)}\n`);
      await claim.commit();
      const total = result.evaluated.length + result.failed;
      ctx.stdout.write(
        `parcels: ${result.evaluated.length} of ${total} parcels of ${basename(opts.input)} evaluated → ${opts.out}\n${FLOORCAST_CAUTION}\n`,
      );
      if (result.failed > 0) {
        ctx.stderr.write(`parcels: ${result.failed} of ${total} features could not be evaluated (see their fc_error property)\n`);
        ctx.setExitCode(EXIT_CODES.someFailed);
      }
    });
}
