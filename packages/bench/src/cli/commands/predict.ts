import type { Command } from "commander";
import { readFile } from "node:fs/promises";
import { basename } from "node:path";
import { createCsvWriter, readTable } from "@floorcast/sampler";
import { loadSurrogate } from "@floorcast/surrogate";
import type { CommandContext } from "../command-context.js";
import { UsageError } from "../usage-error.js";

interface PredictOptions {
  model: string;
  data: string;
  out: string;
}

/**
 * `floorcast predict`: predictions of a saved surrogate for every row of a CSV, in the rows' order, as
 * `<target>_mean` and `<target>_sd` columns (sd empty for a model without uncertainty).
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerPredictCommand(program: Command, ctx: CommandContext): void {
  program
    .command("predict")
    .description("Predict with a saved surrogate: <target>_mean and <target>_sd for every row of a CSV, in order")
    .requiredOption("--model <model.json>", "model file written by `floorcast fit`")
    .requiredOption("--data <file.csv>", "rows to predict, with the model's input columns")
    .requiredOption("--out <predictions.csv>", "CSV to write")
    .action(async (opts: PredictOptions) => {
      await runPredict(opts, ctx);
    });
}

async function runPredict(opts: PredictOptions, ctx: CommandContext): Promise<void> {
  let text: string;
  try {
    text = await readFile(opts.model, "utf8");
  } catch {
    throw new UsageError(`predict: cannot read model file ${opts.model}`);
  }
  const model = loadSurrogate(text, basename(opts.model));
  const table = await readTable(opts.data, { inputs: [...model.inputs], targets: [] });
  const p = model.predict(table.x);
  const columns = model.targets.flatMap((t) => [`${t}_mean`, `${t}_sd`]);
  const writer = createCsvWriter(opts.out, columns);
  for (let i = 0; i < table.x.length; i++) {
    await writer.write(model.targets.flatMap((_, j) => [p.mean[i]![j]!, p.sd ? p.sd[i]![j]! : ""]));
  }
  await writer.close();
  ctx.stdout.write(
    `predict: ${table.x.length} rows of ${basename(opts.data)} → ${opts.out}\n` +
      "Estimates for early feasibility studies only: not a zoning determination. Local codes and licensed professionals decide.\n",
  );
}
