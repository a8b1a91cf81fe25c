import type { Command } from "commander";
import { readFile } from "node:fs/promises";
import { basename } from "node:path";
import { checkSchemaRows, createCsvWriter, openTableStream, readTable, schemaLevels, type CsvValue } from "@floorcast/sampler";
import { buildValidityDomain, domainOfModel, loadSurrogate } from "@floorcast/surrogate";
import type { CommandContext } from "../command-context.js";
import { UsageError } from "../usage-error.js";
import { refuseOutsideDomain } from "../refuse-outside-domain.js";
import { noteUnsealedModel } from "../note-unsealed-model.js";
import { modelInputSchema } from "../model-input-schema.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { STDIO_PATH, readTableArg, stdoutSink, withTableFile } from "../stdio-table.js";
import { predictRows } from "../predict-rows.js";

interface PredictOptions {
  model: string;
  data: string;
  out: string;
  train?: string;
  strict?: boolean;
  keep?: string;
  force?: boolean;
}

/**
 * `floorcast predict`: predictions of a saved surrogate for every row of a CSV, in the rows' order, as
 * `<target>_mean` and `<target>_sd` columns (sd empty for a model without uncertainty; conformal files add
 * `<target>_lower` and `<target>_upper`, the interval with the file's coverage), and `in_domain`
 * (1 inside the model's domain of validity, 0 outside, empty when no domain is known; see checkDomain),
 * after the data's own columns (all of them, or the `--keep` list). `--strict` refuses rows outside the
 * domain instead. `-` reads the data from stdin or writes the predictions to stdout.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerPredictCommand(program: Command, ctx: CommandContext): void {
  program
    .command("predict")
    .description("Predict with a saved surrogate: <target>_mean and <target>_sd for every row of a CSV, in order")
    .requiredOption("--model <model.json>", "model file written by `floorcast fit`")
    .requiredOption("--data <file.csv>", "rows to predict, with the model's input columns (- reads stdin)")
    .requiredOption("--out <predictions.csv>", "CSV to write (- writes stdout)")
    .option("--keep <columns>", "data columns to copy before the predictions, comma-separated (default all; \"\" for none)")
    .option("--force", "replace an existing output file")
    .option("--train <train.csv>", "the model's training data, for the in_domain flag of models that do not store their inputs")
    .option("--strict", "refuse (exit 2, nothing written) when rows lie outside the model's domain of validity")
    .action(async (opts: PredictOptions) => {
      await runPredict(opts, ctx);
    });
}

async function runPredict(opts: PredictOptions, ctx: CommandContext): Promise<void> {
  const claim = opts.out === STDIO_PATH ? null : await ctx.claimOutput("predict", opts.out, { force: opts.force, inputs: [opts.model, opts.data, opts.train] });
  let text: string;
  try {
    text = await readFile(opts.model, "utf8");
  } catch {
    throw new UsageError(`predict: cannot read model file ${opts.model}`);
  }
  const model = loadSurrogate(text, basename(opts.model));
  noteUnsealedModel("predict", basename(opts.model), text, ctx);
  if (opts.data === STDIO_PATH && opts.train === STDIO_PATH) throw new UsageError("predict: only one of --data and --train can read stdin (-)");
  const inputs = [...model.inputs];
  const keepList = opts.keep?.split(",").map((c) => c.trim()).filter((c) => c !== "");
  const schema = modelInputSchema("predict", basename(opts.model), text);
  const levels = schemaLevels(schema);
  // Kept columns other than the inputs are read as text and copied verbatim; string levels are read as positions.
  const table = await withTableFile(ctx, opts.data, async (file) => {
    const head = await openTableStream(file, { columns: [] });
    head.close();
    const keep = keepList ?? head.header;
    return readTable(file, { inputs, targets: [], categorical: keep.filter((c) => !inputs.includes(c)), levels });
  });
  const keep = keepList ?? table.header;
  if (schema) checkSchemaRows(schema, table.x, "predict", opts.data === STDIO_PATH ? "stdin" : basename(opts.data));
  const trainX = opts.train ? (await readTableArg(ctx, opts.train, { inputs, targets: [] })).x : null;
  const domain = trainX ? buildValidityDomain(model.inputs, trainX) : domainOfModel(model);
  if (!domain) {
    if (opts.strict) throw new UsageError("predict: --strict needs a domain of validity: give --train (this model file stores no training inputs)");
    ctx.stderr.write("predict: the model stores no training inputs, so in_domain is left empty (give --train to fill it)\n");
  }
  const flags = domain ? refuseOutsideDomain("predict", domain, table.x, opts.data, opts.strict === true) : null;
  const rows = predictRows(model, table.x, domain);
  const iv = model.kind === "conformal" || rows.some((r) => r.lower !== undefined);
  const predicted = [
    ...model.targets.flatMap((t) => [`${t}_mean`, `${t}_sd`, ...(iv ? [`${t}_lower`, `${t}_upper`] : [])]),
    "in_domain",
    "error",
  ];
  const clash = keep.filter((c) => predicted.includes(c));
  if (clash.length > 0) throw new UsageError(`predict: kept column ${clash.join(", ")} has the name of a prediction column; choose others with --keep`);
  const kept: ((i: number) => CsvValue)[] = keep.map((c) => {
    const j = inputs.indexOf(c);
    const named = levels[c];
    // a kept categorical input is written as its level, as the input CSV has it (a string level, not its position)
    if (j >= 0 && named?.some((l) => typeof l === "string")) return (i) => (typeof named[table.x[i]![j]!] === "string" ? named[table.x[i]![j]!]! : table.x[i]![j]!);
    if (j >= 0) return (i) => table.x[i]![j]!;
    const text = table.categorical[c]!;
    return (i) => text[i]!;
  });
  const columns = [...keep, ...predicted];
  const toStdout = opts.out === STDIO_PATH;
  const writer = createCsvWriter(toStdout ? stdoutSink(ctx.stdout) : claim!.temporary(opts.out), columns);
  let failed = 0;
  for (let i = 0; i < table.x.length; i++) {
    const r = rows[i]!;
    if (r.error) {
      failed += 1;
      if (failed === 1) ctx.stderr.write(`predict: data row ${i + 1} of ${opts.data === STDIO_PATH ? "stdin" : basename(opts.data)}: ${r.error}\n`);
    }
    await writer.write([
      ...kept.map((value) => value(i)),
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
  if (claim) await claim.commit();
  if (failed > 0) {
    ctx.stderr.write(`predict: ${failed} of ${table.x.length} rows could not be predicted (their error column says why)\n`);
    ctx.setExitCode(1);
  }
  (toStdout ? ctx.stderr : ctx.stdout).write(
    `predict: ${table.x.length} rows of ${opts.data === STDIO_PATH ? "stdin" : basename(opts.data)} → ${toStdout ? "stdout" : opts.out}` +
      (flags ? `; ${flags.filter((f) => !f).length} outside the domain of validity (in_domain = 0)\n` : "\n") +
      `${FLOORCAST_CAUTION}\n`,
  );
}
