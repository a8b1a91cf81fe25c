import type { Command } from "commander";
import { readFile } from "node:fs/promises";
import { basename } from "node:path";
import { createCsvWriter, readTable } from "@floorcast/sampler";
import { buildValidityDomain, domainOfModel, loadSurrogate } from "@floorcast/surrogate";
import type { CommandContext } from "../command-context.js";
import { UsageError } from "../usage-error.js";
import { refuseOutsideDomain } from "../refuse-outside-domain.js";
import { noteUnsealedModel } from "../note-unsealed-model.js";
import { predictRows } from "../predict-rows.js";

interface PredictOptions {
  model: string;
  data: string;
  out: string;
  train?: string;
  strict?: boolean;
  force?: boolean;
}

/**
 * `floorcast predict`: predictions of a saved surrogate for every row of a CSV, in the rows' order, as
 * `<target>_mean` and `<target>_sd` columns (sd empty for a model without uncertainty; conformal files add
 * `<target>_lower` and `<target>_upper`, the interval with the file's coverage), and `in_domain`
 * (1 inside the model's domain of validity, 0 outside, empty when no domain is known; see checkDomain).
 * `--strict` refuses rows outside the domain instead.
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
    .option("--force", "replace an existing output file")
    .option("--train <train.csv>", "the model's training data, for the in_domain flag of models that do not store their inputs")
    .option("--strict", "refuse (exit 2, nothing written) when rows lie outside the model's domain of validity")
    .action(async (opts: PredictOptions) => {
      await runPredict(opts, ctx);
    });
}

async function runPredict(opts: PredictOptions, ctx: CommandContext): Promise<void> {
  const claim = await ctx.claimOutput("predict", opts.out, { force: opts.force, inputs: [opts.model, opts.data, opts.train] });
  let text: string;
  try {
    text = await readFile(opts.model, "utf8");
  } catch {
    throw new UsageError(`predict: cannot read model file ${opts.model}`);
  }
  const model = loadSurrogate(text, basename(opts.model));
  noteUnsealedModel("predict", basename(opts.model), text, ctx);
  const table = await readTable(opts.data, { inputs: [...model.inputs], targets: [] });
  const trainX = opts.train ? (await readTable(opts.train, { inputs: [...model.inputs], targets: [] })).x : null;
  const domain = trainX ? buildValidityDomain(model.inputs, trainX) : domainOfModel(model);
  if (!domain) {
    if (opts.strict) throw new UsageError("predict: --strict needs a domain of validity: give --train (this model file stores no training inputs)");
    ctx.stderr.write("predict: the model stores no training inputs, so in_domain is left empty (give --train to fill it)\n");
  }
  const flags = domain ? refuseOutsideDomain("predict", domain, table.x, opts.data, opts.strict === true) : null;
  const rows = predictRows(model, table.x, domain);
  const iv = model.kind === "conformal" || rows.some((r) => r.lower !== undefined);
  const columns = [
    ...model.targets.flatMap((t) => [`${t}_mean`, `${t}_sd`, ...(iv ? [`${t}_lower`, `${t}_upper`] : [])]),
    "in_domain",
    "error",
  ];
  const writer = createCsvWriter(claim.temporary(opts.out), columns);
  let failed = 0;
  for (let i = 0; i < table.x.length; i++) {
    const r = rows[i]!;
    if (r.error) {
      failed += 1;
      if (failed === 1) ctx.stderr.write(`predict: data row ${i + 1} of ${basename(opts.data)}: ${r.error}\n`);
    }
    await writer.write([
      ...model.targets.flatMap((_, j) => [
        r.mean ? r.mean[j]! : "",
        r.sd ? r.sd[j]! : "",
        ...(iv ? [r.lower ? r.lower[j]! : "", r.upper ? r.upper[j]! : ""] : []),
      ]),
      flags ? (flags[i] ? 1 : 0) : "",
      r.error ?? "",
    ]);
  }
  await writer.close();
  await claim.commit();
  if (failed > 0) {
    ctx.stderr.write(`predict: ${failed} of ${table.x.length} rows could not be predicted (their error column says why)\n`);
    ctx.setExitCode(1);
  }
  ctx.stdout.write(
    `predict: ${table.x.length} rows of ${basename(opts.data)} → ${opts.out}` +
      (flags ? `; ${flags.filter((f) => !f).length} outside the domain of validity (in_domain = 0)\n` : "\n") +
      "Estimates for early feasibility studies only: not a zoning determination. Local codes and licensed professionals decide.\n",
  );
}
