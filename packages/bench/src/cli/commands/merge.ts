import type { Command } from "commander";
import { manifestPathFor, mergeShards } from "@floorcast/sampler";
import type { CommandContext } from "../command-context.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";

/**
 * `floorcast merge`: checks the shards' manifests and joins them into one dataset CSV, byte-identical to an
 * unsharded run, with its manifest.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerMergeCommand(program: Command, ctx: CommandContext): void {
  program
    .command("merge")
    .description("Check the manifests of dataset shards and join them into one CSV identical to an unsharded run")
    .argument("<shards...>", "shard CSVs written by `floorcast sample --shard k/N` (manifests beside them)")
    .requiredOption("--out <file.csv>", "merged CSV (manifest written beside it)")
    .option("--force", "replace an existing output file")
    .action(async (shards: string[], opts: { out: string; force?: boolean }) => {
      const manifest = await mergeShards(shards, opts.out, { force: opts.force === true });
      ctx.stdout.write(
        `merged ${shards.length} shards into ${opts.out}: ${manifest.rows} rows, sha256 ${manifest.csv.sha256}\n` +
          `manifest ${manifestPathFor(opts.out)}\n${FLOORCAST_CAUTION}\n`,
      );
    });
}
