import type { Command } from "commander";
import { basename } from "node:path";
import type { CommandContext } from "../command-context.js";
import { STDIO_PATH, withTableFile } from "../stdio-table.js";
import { UsageError } from "../usage-error.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { MODEL_FAMILIES } from "../../families/model-families.js";
import { UNCERTAINTY_OPTIONS } from "../../families/with-uncertainty.js";
import { fitModelFile } from "../../families/fit-model-file.js";
import { parseWhole } from "../parse-whole.js";

/** Options every model family shares, plus each family's own (see families/). */
type FitCommandOptions = Record<string, string | boolean | undefined> & {
  data: string;
  inputs: string;
  target: string;
  model: string;
  seed: string;
  out: string;
  force?: boolean;
};

const names = (flag: string, v: string): string[] => {
  const list = v.split(",").map((s) => s.trim());
  if (list.length === 0 || list.some((s) => s === "")) throw new UsageError(`fit: ${flag} must be a comma-separated list of column names, got "${v}"`);
  if (new Set(list).size !== list.length) throw new UsageError(`fit: ${flag} names a column twice: ${v}`);
  return list;
};

/**
 * `floorcast fit`: fits a surrogate to the numeric columns of a CSV and writes the versioned model file, through
 * the one fit entry (fitModelFile) the benchmark uses too. Each family's options come from its registration.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerFitCommand(program: Command, ctx: CommandContext): void {
  const families = MODEL_FAMILIES.map((f) => f.name).join(", ");
  const cmd = program
    .command("fit")
    .description(`Fit a surrogate (${families}) to a CSV's input and target columns and write the model file`)
    .requiredOption("--data <file.csv>", "training data with a header row (- reads stdin)")
    .requiredOption("--inputs <a,b,...>", "input columns, comma-separated")
    .requiredOption("--target <col[,col2]>", "target column(s), comma-separated")
    .option("--model <family>", `model family (${families})`, "gp")
    .option("--seed <n>", "seed of every random choice", "0")
    .requiredOption("--out <model.json>", "model file to write")
    .option("--force", "replace an existing output file");
  for (const o of [...MODEL_FAMILIES.flatMap((f) => f.options), ...UNCERTAINTY_OPTIONS]) {
    if (o.default === undefined) cmd.option(o.flags, o.description);
    else cmd.option(o.flags, o.description, o.default);
  }
  cmd.action(async (opts: FitCommandOptions) => {
    await runFit(opts, ctx);
  });
}

async function runFit(opts: FitCommandOptions, ctx: CommandContext): Promise<void> {
  if (!MODEL_FAMILIES.some((f) => f.name === opts.model)) throw new UsageError(`fit: --model must be one of ${MODEL_FAMILIES.map((f) => f.name).join(", ")}, got ${opts.model}`);
  const inputs = names("--inputs", opts.inputs);
  const targets = names("--target", opts.target);
  const clash = targets.find((t) => inputs.includes(t));
  if (clash) throw new UsageError(`fit: column ${clash} is both an input and a target`);
  const seed = parseWhole("fit", "--seed", opts.seed, 0);
  const claim = await ctx.claimOutput("fit", opts.out, { force: opts.force, inputs: opts.data === STDIO_PATH ? [] : [opts.data] });
  // `-` is stdin, kept in a temporary file while the family reads it (plate-stack reads it twice).
  const { text, rows } = await withTableFile(ctx, opts.data, (file) =>
    fitModelFile({ data: file, inputs, targets, model: opts.model, seed, options: opts, say: (line) => ctx.stderr.write(`${line}\n`) }),
  );
  await claim.put(opts.out, text);
  await claim.commit();
  ctx.stdout.write(`fit: ${opts.model} on ${rows} rows of ${opts.data === STDIO_PATH ? "stdin" : basename(opts.data)} → ${opts.out}\n${FLOORCAST_CAUTION}\n`);
}
