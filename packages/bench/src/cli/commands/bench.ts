import type { Command } from "commander";
import type { CommandContext } from "../command-context.js";
import { parseWhole } from "../parse-whole.js";
import { UsageError } from "../usage-error.js";
import { runSuite } from "../../harness/run-suite.js";
import { headlineTable } from "../../harness/headline-table.js";
import { formatTextTable } from "../../harness/format-text-table.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";

interface BenchOptions {
  suite: string;
  problem?: string;
  seeds?: string;
  quick?: boolean;
  peers: boolean;
  problems?: string;
  out: string;
  force?: boolean;
}

/**
 * `floorcast bench`: the optimum-gap benchmark of a suite of problems (README "Benchmark").
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerBenchCommand(program: Command, ctx: CommandContext): void {
  program
    .command("bench")
    .description("Measure how much an optimum found on a GP or NN surrogate loses against the exact optimum, and at how many exact evaluations")
    .option("--suite <name>", "problem suite: demo, quads or standard", "demo")
    .option("--problem <name>", "run only this problem of the suite")
    .option("--seeds <k>", "seeds per training size (default 2 with --quick, else 3)")
    .option("--quick", "the demo's smaller training sizes and budgets")
    .option("--no-peers", "skip scikit-learn's GP/MLP and scipy's LHS even when present")
    .option("--problems <dir>", "problems directory (default: the demo and standard problems shipped with floorcast)")
    .requiredOption("--out <dir>", "output directory: report.json, report.md, report.html; finished problems under problems/ (re-run to resume)")
    .option("--force", "replace the report files of an earlier run in --out (an interrupted run resumes without it)")
    .action(async (opts: BenchOptions) => {
      let seeds: number | undefined;
      if (opts.seeds !== undefined) {
        seeds = parseWhole("bench", "--seeds", opts.seeds, 1, 100);
      }
      const { report, paths } = await runSuite({
        suite: opts.suite,
        ...(opts.problem === undefined ? {} : { problem: opts.problem }),
        ...(seeds === undefined ? {} : { seeds }),
        quick: opts.quick === true,
        out: opts.out,
        force: opts.force === true,
        peers: opts.peers,
        ...(opts.problems === undefined ? {} : { problemsDir: opts.problems }),
        progress: ctx.stderr,
      });
      ctx.stdout.write(`${formatTextTable(headlineTable(report))}\n\n${FLOORCAST_CAUTION}\n`);
      ctx.stdout.write(`report: ${paths.html}\n        ${paths.markdown}\n        ${paths.json}\n`);
    });
}
