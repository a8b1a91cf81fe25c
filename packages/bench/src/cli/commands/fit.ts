import type { Command } from "commander";
import { basename } from "node:path";
import { readTable } from "@floorcast/sampler";
import { KERNEL_NAMES, fitGaussianProcess, type KernelName, type Surrogate, type TrainingData } from "@floorcast/surrogate";
import type { CommandContext } from "../command-context.js";
import { UsageError } from "../usage-error.js";
import { addNnOptions, fitNn } from "./fit-nn-options.js";
import { addUncertaintyOptions, withUncertainty } from "./fit-uncertainty-options.js";
import { addPlateStackOptions, fitPlateStackCsv } from "./fit-plate-stack-options.js";

/** Options every model family shares, plus each family's own (added by that family's `add…Options`). */
type FitOptions = Record<string, string | boolean | undefined> & {
  data: string;
  inputs: string;
  target: string;
  model: string;
  seed: string;
  out: string;
  force?: boolean;
};

/** Fits one model family from the parsed options; `say` prints notes (warnings) to stderr. */
type FamilyFitter = (data: TrainingData, opts: FitOptions, seed: number, say: (line: string) => void) => Promise<Surrogate>;

const CAUTION = "Estimates for early feasibility studies only: not a zoning determination. Local codes and licensed professionals decide.";

const names = (flag: string, v: string): string[] => {
  const list = v.split(",").map((s) => s.trim());
  if (list.length === 0 || list.some((s) => s === "")) throw new UsageError(`fit: ${flag} must be a comma-separated list of column names, got "${v}"`);
  if (new Set(list).size !== list.length) throw new UsageError(`fit: ${flag} names a column twice: ${v}`);
  return list;
};

const integer = (flag: string, v: string, min: number): number => {
  const n = v.trim() === "" ? NaN : Number(v); // Number("") is 0: a blank value is not zero
  if (!Number.isInteger(n) || n < min) throw new UsageError(`fit: ${flag} must be an integer ≥ ${min}, got ${v}`);
  return n;
};

/** `--model gp` options. */
function addGpOptions(cmd: Command): void {
  cmd
    .option("--kernel <name>", `gp: kernel family (${KERNEL_NAMES.join(", ")})`, "matern52")
    .option("--shared-lengthscale", "gp: one lengthscale for every input instead of one per input (ARD)")
    .option("--noise <variance>", "gp: fix the noise variance (standardised target units) instead of learning it")
    .option("--restarts <n>", "gp: optimiser starts per target", "3")
    .option("--subset <m>", "gp: fit hyperparameters on a maximin subset of m rows, then condition on all (0 = all rows)", "600")
    .option("--polish <k>", "gp: after a subset fit, at most k optimiser iterations on all rows (default 10 up to 2,000 rows, else 0)");
}

/** Fits `--model gp`. */
const fitGp: FamilyFitter = async (data, opts, seed, say) => {
  const kernel = String(opts.kernel);
  if (!(KERNEL_NAMES as readonly string[]).includes(kernel)) throw new UsageError(`fit: --kernel must be one of ${KERNEL_NAMES.join(", ")}, got ${kernel}`);
  const noise = opts.noise === undefined ? undefined : String(opts.noise).trim() === "" ? NaN : Number(opts.noise);
  if (noise !== undefined && !(Number.isFinite(noise) && noise >= 0)) throw new UsageError(`fit: --noise must be a number ≥ 0, got ${String(opts.noise)}`);
  const subset = integer("--subset", String(opts.subset), 0);
  const gp = fitGaussianProcess(data, {
    kernel: kernel as KernelName,
    ard: opts.sharedLengthscale !== true,
    noiseVariance: noise,
    restarts: integer("--restarts", String(opts.restarts), 1),
    seed,
    hyperparameterSubset: subset === 0 ? false : subset,
    polishIterations: opts.polish === undefined ? undefined : integer("--polish", String(opts.polish), 0),
  });
  gp.diagnostics.targets.forEach((t, j) => {
    say(`fit: ${t.target}: log marginal likelihood ${gp.logMarginalLikelihood()[j]!.toFixed(3)} (standardised target)`);
    for (const w of t.warnings) say(`fit: ${t.target}: warning: ${w}`);
  });
  return gp;
};

/** One entry per model family: its fitter (its options are added in registerFitCommand). */
const FAMILIES: Record<string, FamilyFitter> = { gp: withUncertainty(fitGp), nn: withUncertainty(fitNn) };
/** Families that read more than the input and target columns (the plate profile). */
const PROFILE_FAMILIES = ["plate-stack"];
const familyNames = (): string => [...Object.keys(FAMILIES), ...PROFILE_FAMILIES].join(", ");

/**
 * `floorcast fit`: fits a surrogate to the numeric columns of a CSV and writes the versioned model file.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerFitCommand(program: Command, ctx: CommandContext): void {
  const cmd = program
    .command("fit")
    .description("Fit a surrogate (gp, nn, plate-stack) to a CSV's input and target columns and write the model file")
    .requiredOption("--data <file.csv>", "training data with a header row")
    .requiredOption("--inputs <a,b,...>", "input columns, comma-separated")
    .requiredOption("--target <col[,col2]>", "target column(s), comma-separated")
    .option("--model <family>", `model family (${familyNames()})`, "gp")
    .option("--seed <n>", "seed of every random choice", "0")
    .requiredOption("--out <model.json>", "model file to write")
    .option("--force", "replace an existing output file");
  addGpOptions(cmd);
  addNnOptions(cmd);
  addUncertaintyOptions(cmd);
  addPlateStackOptions(cmd);
  cmd.action(async (opts: FitOptions) => {
    await runFit(opts, ctx);
  });
}

async function runFit(opts: FitOptions, ctx: CommandContext): Promise<void> {
  const fitter = FAMILIES[opts.model];
  if (!fitter && !PROFILE_FAMILIES.includes(opts.model)) throw new UsageError(`fit: --model must be one of ${familyNames()}, got ${opts.model}`);
  const inputs = names("--inputs", opts.inputs);
  const targets = names("--target", opts.target);
  const clash = targets.find((t) => inputs.includes(t));
  if (clash) throw new UsageError(`fit: column ${clash} is both an input and a target`);
  const seed = integer("--seed", opts.seed, 0);
  const claim = await ctx.claimOutput("fit", opts.out, { force: opts.force, inputs: [opts.data] });
  const table = await readTable(opts.data, { inputs, targets });
  const data: TrainingData = { inputs, targets, x: table.x, y: table.y };
  const say = (line: string): void => void ctx.stderr.write(`${line}\n`);
  const model = fitter
    ? await fitter(data, opts, seed, say)
    : await fitPlateStackCsv(opts.data, inputs, targets, opts, seed, (d, s) => fitNn(d, { ...opts, epochs: opts.epochs }, s, say));
  await claim.put(opts.out, `${JSON.stringify(model.toJSON())}\n`);
  await claim.commit();
  ctx.stdout.write(`fit: ${opts.model} on ${data.x.length} rows of ${basename(opts.data)} → ${opts.out}\n${CAUTION}\n`);
}
