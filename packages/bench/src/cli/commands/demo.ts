import type { Command } from "commander";
import type { CommandContext } from "../command-context.js";
import { runSuite } from "../../harness/run-suite.js";
import { headlineTable } from "../../harness/headline-table.js";
import { formatTextTable } from "../../harness/format-text-table.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";

/**
 * `floorcast demo`: the demo suite end to end (sample, fit GP and NN, assess, optimize, report) at
 * the quick sizes, plus the demo parcel file ranked by capacity (drawn as a plan in the report), with progress on the terminal; prints the headline table and where the report is.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerDemoCommand(program: Command, ctx: CommandContext): void {
  program
    .command("demo")
    .description("Run the Quillmere demo suite end to end (sample, fit GP and NN, assess, optimize, report) in a few minutes")
    .option("--out <dir>", "output directory", "floorcast-demo")
    .option("--no-peers", "skip scikit-learn's GP/MLP and scipy's LHS even when present")
    .option("--quick", "the quick sizes (training sizes 20, 40, 80; 2 seeds): the demo always uses them; accepted as in bench")
    .option("--force", "replace the report files of an earlier demo in --out")
    .action(async (opts: { out: string; peers: boolean; force?: boolean }) => {
      const t0 = performance.now();
      ctx.stderr.write(`floorcast demo: the Quillmere demo suite, quick sizes. ${FLOORCAST_CAUTION}\n`);
      const { report, paths } = await runSuite({ suite: "demo", quick: true, out: opts.out, force: opts.force === true, peers: opts.peers, parcels: { budget: 100 }, progress: ctx.stderr });
      const seconds = (performance.now() - t0) / 1000;
      ctx.stdout.write(`\n${formatTextTable(headlineTable(report))}\n\n`);
      ctx.stdout.write(`${FLOORCAST_CAUTION}\n\n`);
      ctx.stdout.write(`demo finished in ${seconds.toFixed(1)} s; report: ${paths.html}\n  (also ${paths.markdown} and ${paths.json})\n`);
    });
}
