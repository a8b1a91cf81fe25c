import type { Command } from "commander";
import { mkdir, readFile } from "node:fs/promises";
import { basename, join } from "node:path";
import { centredL2Discrepancy, checkSchemaRows, minPairwiseDistance, readTable, schemaLevels } from "@floorcast/sampler";
import {
  buildTrustReport,
  buildValidityDomain,
  domainOfModel,
  hasLeaveOneOut,
  kFoldCrossValidation,
  learningCurve,
  leaveOneOutValidation,
  loadSurrogate,
  scaleToDomain,
  type CrossValidationResult,
  type LearningCurve,
  type Surrogate,
  type TrainingData,
  type ValidityDomain,
} from "@floorcast/surrogate";
import type { CommandContext } from "../command-context.js";
import { parseWhole } from "../parse-whole.js";
import { UsageError } from "../usage-error.js";
import { refitTrainer } from "../assess/refit-trainer.js";
import { refuseOutsideDomain } from "../refuse-outside-domain.js";
import { noteUnsealedModel } from "../note-unsealed-model.js";
import { modelInputSchema } from "../model-input-schema.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";

interface AssessOptions {
  model: string;
  data: string;
  target: string;
  by?: string;
  folds?: string;
  learningCurve?: boolean;
  train?: string;
  sizes?: string;
  seed: string;
  strict?: boolean;
  out: string;
  force?: boolean;
}

const int = (flag: string, v: string, min: number): number => parseWhole("assess", flag, v, min);

/**
 * `floorcast assess`: the trust report of a surrogate on an independent test CSV (report.json, report.md,
 * report.html in --out): accuracy, accuracy by regime, calibration, domain of validity, diagnostics, and
 * with --train the closed-form LOO (GP), k-fold cross-validation (--folds) and a learning curve.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerAssessCommand(program: Command, ctx: CommandContext): void {
  program
    .command("assess")
    .description("Trust report of a surrogate on an independent test set: accuracy (overall and by regime), calibration, cross-validation, learning curve, domain of validity")
    .requiredOption("--model <model.json>", "surrogate model file")
    .requiredOption("--data <test.csv>", "independent test data with the model's input columns and the target")
    .requiredOption("--target <column>", "target column to assess (one of the model's targets)")
    .option("--by <column>", "categorical column to break the metrics down by (e.g. limitedBy)")
    .option("--train <train.csv>", "the model's training data: domain of validity, design quality, LOO (GP), --folds, --learning-curve")
    .option("--folds <k>", "k-fold cross-validation on --train (refits the model family)")
    .option("--learning-curve", "test error against training size on subsets of --train, with a power-law fit")
    .option("--sizes <list>", "learning-curve training sizes, comma-separated", "50,100,200,500,1000,2000,5000")
    .option("--seed <n>", "seed of folds, subsets and refits", "0")
    .option("--strict", "refuse (exit 2) when test rows lie outside the model's domain of validity")
    .requiredOption("--out <dir>", "directory for report.json, report.md and report.html")
    .option("--force", "replace existing report files")
    .action(async (opts: AssessOptions) => {
      await runAssess(opts, ctx);
    });
}

async function runAssess(opts: AssessOptions, ctx: CommandContext): Promise<void> {
  const seed = int("--seed", opts.seed, 0);
  const folds = opts.folds === undefined ? undefined : int("--folds", opts.folds, 2);
  if ((folds !== undefined || opts.learningCurve) && !opts.train) {
    throw new UsageError("assess: --folds and --learning-curve need the training data (--train FILE.csv)");
  }
  await mkdir(opts.out, { recursive: true });
  const reports = ["report.json", "report.md", "report.html"].map((f) => join(opts.out, f));
  const claim = await ctx.claimOutput("assess", reports, { force: opts.force, inputs: [opts.model, opts.data, opts.train] });
  let text: string;
  try {
    text = await readFile(opts.model, "utf8");
  } catch {
    throw new UsageError(`assess: cannot read model file ${opts.model}`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new UsageError(`assess: ${basename(opts.model)} is not JSON (${(e as Error).message.replace(/\s+/g, " ")})`);
  }
  const model = loadSurrogate(json, basename(opts.model));
  noteUnsealedModel("assess", basename(opts.model), json, ctx);
  if (!model.targets.includes(opts.target)) {
    throw new UsageError(`assess: --target ${opts.target} is not a target of the model (${model.targets.join(", ")})`);
  }
  const inputs = [...model.inputs];
  const schema = modelInputSchema("assess", basename(opts.model), json);
  const levels = schemaLevels(schema); // string levels are read as their positions, as the model's rows code them
  const test = await readTable(opts.data, { inputs, targets: [opts.target], categorical: opts.by ? [opts.by] : [], levels });
  if (schema) checkSchemaRows(schema, test.x, "assess", basename(opts.data));
  const train = opts.train ? await readTable(opts.train, { inputs, targets: [...model.targets], levels }) : null;
  if (schema && train) checkSchemaRows(schema, train.x, "assess", basename(opts.train!));
  const trainData: TrainingData | null = train ? { inputs, targets: [...model.targets], x: train.x, y: train.y } : null;

  const domain: ValidityDomain | null = trainData ? buildValidityDomain(inputs, trainData.x) : domainOfModel(model);
  if (opts.strict) {
    if (!domain) throw new UsageError("assess: --strict needs a domain of validity: give --train (this model file stores no training inputs)");
    refuseOutsideDomain("assess", domain, test.x, opts.data, true);
  }
  const design = domain ? { minDistance: minPairwiseDistance(domain.points), centredDiscrepancy: centredL2Discrepancy(domain.points.map((p) => p.map(clamp01))) } : undefined;

  const notes: string[] = [];
  let crossValidation: CrossValidationResult | null = null;
  if (trainData && folds !== undefined) {
    crossValidation = await kFoldCrossValidation(refitTrainer(json, basename(opts.model), opts.train), trainData, { folds, seed });
  } else if (trainData && hasLeaveOneOut(model)) {
    if (sameTrainingRows(model, trainData, domain)) crossValidation = leaveOneOutValidation(model, trainData);
    else notes.push(`Leave-one-out skipped: ${basename(opts.train!)} is not the model's own training data in its order (use --folds for k-fold).`);
  } else if (!trainData) {
    notes.push("Cross-validation not run: give the training data (--train) for leave-one-out (GP) or --folds.");
  }
  let curve: LearningCurve | null = null;
  if (trainData && opts.learningCurve) {
    const sizes = opts.sizes!.split(",").map((s) => int("--sizes", s.trim(), 2));
    const testData: TrainingData = { inputs, targets: [opts.target], x: test.x, y: test.y };
    curve = await learningCurve(refitTrainer(json, basename(opts.model), opts.train), trainData, testData, { target: opts.target, sizes, seed });
  }
  const { report, figures } = buildTrustReport({
    model,
    target: opts.target,
    x: test.x,
    y: test.y.map((r) => r[0]!),
    ...(opts.by ? { groups: test.categorical[opts.by]!, groupColumn: opts.by } : {}),
    crossValidation,
    learningCurve: curve,
    domain,
    ...(design ? { design } : {}),
    sources: { model: basename(opts.model), data: basename(opts.data) },
    notes,
    caution: FLOORCAST_CAUTION,
  });
  await claim.put(join(opts.out, "report.json"), JSON.stringify(report, null, 2) + "\n");
  // the renderers (and the chart packages) load only when a report is written
  const [{ renderTrustMarkdown }, { renderTrustHtml }] = await Promise.all([import("../../report/trust-report-markdown.js"), import("../../report/trust-report-html.js")]);
  await claim.put(join(opts.out, "report.md"), renderTrustMarkdown(report));
  await claim.put(join(opts.out, "report.html"), await renderTrustHtml(report, figures));
  await claim.commit();
  const m = report.metrics;
  ctx.stdout.write(
    `assessed ${report.target} on ${m.n} test rows: RMSE ${m.rmse.toPrecision(4)}, MAE ${m.mae.toPrecision(4)}, max |error| ${m.maxAbsError.toPrecision(4)}, R² ${Number.isNaN(m.r2) ? "undefined" : m.r2.toFixed(4)}` +
      (report.domain ? `; ${report.domain.nOutside} rows outside the domain of validity` : "") +
      `\nwrote ${join(opts.out, "report.json")}, report.md, report.html\n${FLOORCAST_CAUTION}\n`,
  );
}

const clamp01 = (v: number) => Math.min(1, Math.max(0, v));

/**
 * Whether --train holds the model's own training rows in order (LOO predictions refer to those): the same
 * count and, when the model's file stores its training inputs, the same scaled inputs to 1e-9.
 */
function sameTrainingRows(model: Surrogate, data: TrainingData, domain: ValidityDomain | null): boolean {
  const own = domainOfModel(model);
  if (!own || !domain || own.points.length !== data.x.length) return false;
  return data.x.every((r, i) => scaleToDomain(own, r).every((v, j) => Math.abs(v - own.points[i]![j]!) <= 1e-9));
}
