import { basename } from "node:path";
import type { Command } from "commander";
import type { CommandContext } from "../command-context.js";
import { EXIT_CODES } from "../exit-codes.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { UsageError } from "../usage-error.js";
import { readParcelInputs, withParcelFileOptions } from "../read-parcel-inputs.js";
import { evaluateParcelFile } from "../../parcels/evaluate-parcel-file.js";

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
  withParcelFileOptions(program.command("parcels"))
    .description(
      "Evaluate the massing rule on the parcels of a GeoJSON file; write GeoJSON with the results as properties.",
    )
    .requiredOption("--out <result.geojson>", "GeoJSON to write")
    .option("--plates", "add every parcel's floor plates as Polygon features")
    .option("--force", "replace an existing output file")
    .action(async (opts: ParcelsOptions) => {
      const { collection, zoning, streets, streetDistance, coordinates } = await readParcelInputs("parcels", opts);
      const claim = await ctx.claimOutput("parcels", opts.out, { force: opts.force, inputs: [opts.input, opts.zoning, opts.streets] });
      let result;
      try {
        result = evaluateParcelFile(collection, {
          coordinates,
          ...(zoning === undefined ? {} : { zoning }),
          ...(streets === undefined ? {} : { streets }),
          streetDistance,
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
        `parcels: ${result.evaluated.length} of ${total} parcels of ${basename(opts.input)} evaluated → ${opts.out}\n` +
          `${FLOORCAST_CAUTION}\n`,
      );
      if (result.failed > 0) {
        ctx.stderr.write(`parcels: ${result.failed} of ${total} features could not be evaluated (see their fc_error property)\n`);
        ctx.setExitCode(EXIT_CODES.someFailed);
      }
    });
}
