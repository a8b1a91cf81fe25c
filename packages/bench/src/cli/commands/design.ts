import type { Command } from "commander";
import { createCsvWriter, createProgressBar, designRows } from "@floorcast/sampler";
import type { CommandContext } from "../command-context.js";
import { DESIGN_OPTION_HELP, resolveDesignOption } from "../resolve-design-option.js";
import { parseWhole } from "../parse-whole.js";
import { UsageError } from "../usage-error.js";

interface DesignOptions {
  n: string;
  dims: string;
  design?: string;
  seed: string;
  out: string;
  force?: boolean;
}

/** Parses a whole-number option (the CLI's one parser), naming it in the error. */
const wholeNumber = (name: string, text: string): number => parseWhole("design", `--${name}`, text, 0);

/**
 * `floorcast design`: writes a space-filling design in the unit cube to a CSV file (columns x1 … xD, one row
 * per point), for users who run their own evaluator. Written under a temporary name and renamed when
 * complete; an existing file is kept unless `--force`.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerDesignCommand(program: Command, ctx: CommandContext): void {
  program
    .command("design")
    .description("Write a space-filling design in the unit cube [0, 1]^D to CSV (columns x1..xD), for your own evaluator.")
    .requiredOption("--n <count>", "number of points")
    .requiredOption("--dims <count>", "number of dimensions")
    .option("--design <kind>", DESIGN_OPTION_HELP)
    .requiredOption("--seed <seed>", "seed of every random draw (the same seed gives the same file)")
    .requiredOption("--out <file>", "CSV file to write")
    .option("--force", "replace an existing output file")
    .action(async (opts: DesignOptions) => {
      const n = wholeNumber("n", opts.n);
      const dims = wholeNumber("dims", opts.dims);
      wholeNumber("seed", opts.seed); // a seed is a whole number, as for sample and optimize
      const { design, announce } = resolveDesignOption("design", opts.design, n, dims, ctx.stderr);
      const claim = await ctx.claimOutput("design", opts.out, { force: opts.force });
      let bar: ReturnType<typeof createProgressBar> | undefined;
      const rows = designRows({
        n,
        dims,
        design,
        seed: opts.seed,
        onProgress: (done, total) => {
          announce();
          bar ??= createProgressBar(ctx.stderr, total, `design ${design}`, "steps");
          bar.update(done);
        },
      });
      const columns = Array.from({ length: dims }, (_, k) => `x${k + 1}`);
      const writer = createCsvWriter(claim.temporary(opts.out), columns);
      try {
        let first = true;
        for (const row of rows) {
          if (first) {
            bar?.stop();
            announce();
          }
          first = false;
          await writer.write(row);
        }
      } finally {
        await writer.close();
      }
      await claim.commit();
      ctx.stderr.write(`design: wrote ${n} ${design} points in ${dims} dimensions to ${opts.out}\n`);
    });
}
