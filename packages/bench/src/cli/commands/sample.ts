import type { Command } from "commander";
import {
  commandEvaluator,
  createProgressBar,
  manifestPathFor,
  massingEvaluator,
  parseShard,
  shardFromEnvironment,
  writeDataset,
  type Evaluator,
} from "@floorcast/sampler";
import type { CommandContext } from "../command-context.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { DESIGN_OPTION_HELP, resolveDesignOption } from "../resolve-design-option.js";
import { parseWhole } from "../parse-whole.js";
import { resolveSampleSource } from "../sample-source.js";
import { UsageError } from "../usage-error.js";

interface SampleOptions {
  scenario?: string;
  problem?: string;
  n: string;
  seed: string;
  design?: string;
  shard?: string;
  shardCount?: string;
  resume?: boolean;
  force?: boolean;
  evaluatorCommand?: string;
  processes?: string;
  evaluatorTimeout?: string;
  plateProfile?: boolean;
  evaluatorProtocol?: string;
  out: string;
}

const wholeNumber = (flag: string, text: string, min: number): number => parseWhole("sample", flag, text, min);

/** Parses `--evaluator-timeout SECONDS` (decimals allowed, 0 = no limit, else whole milliseconds ≥ 0.001 s) into milliseconds. */
function timeoutSeconds(text: string): number {
  const s = Number(text);
  const ms = Math.round(s * 1000);
  if (!/^\s*\d+(\.\d+)?\s*$/.test(text) || !(ms <= 2_147_483_647) || Math.abs(ms - s * 1000) > 1e-6 * Math.max(1, ms)) {
    throw new UsageError(
      `sample: --evaluator-timeout must be 0 (no limit) or whole milliseconds in [0.001, 2147483.647] seconds, got ${JSON.stringify(text)}`,
    );
  }
  return ms;
}

/**
 * `floorcast sample`: evaluates a space-filling design of a scenario and writes the dataset CSV and its manifest
 * (shards, resume, external evaluators; see README "Datasets").
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerSampleCommand(program: Command, ctx: CommandContext): void {
  program
    .command("sample")
    .description("Sample a scenario's (or a problem's) design space with the exact evaluator and write a dataset CSV with its manifest")
    .option("--scenario <file>", "scenario file (JSON, see README \"Scenario files\"); one of --scenario and --problem is required")
    .option(
      "--problem <file>",
      "problem file (JSON, see README \"Problem files\"): sample its own variables with its fixed values and its evaluator, " +
        "so the CSV fits a model optimize --surrogate accepts for it; one of --scenario and --problem is required",
    )
    .requiredOption("--n <n>", "design size (all shards together)")
    .requiredOption("--seed <s>", "seed of the design (whole number)")
    .option("--design <kind>", DESIGN_OPTION_HELP)
    .option(
      "--shard <k/N>",
      "write only the k-th of N contiguous slices of the same design (default: from a Slurm array task's SLURM_ARRAY_TASK_ID " +
        "and SLURM_ARRAY_TASK_COUNT, or a Kubernetes Indexed Job's JOB_COMPLETION_INDEX with --shard-count)",
    )
    .option("--shard-count <N>", "number of shards of a Kubernetes Indexed Job (its completions), used with JOB_COMPLETION_INDEX")
    .option("--resume", "continue an interrupted run from its last complete row")
    .option("--force", "replace an existing output file")
    .option("--evaluator-command <cmd>", "evaluate with an external program speaking JSON Lines on stdin/stdout")
    .option("--processes <n>", "with --evaluator-command: copies of the program run side by side", "1")
    .option(
      "--evaluator-timeout <seconds>",
      "with --evaluator-command: longest wait for an answer before the program is stopped and the run fails (0 = no limit)",
      "300",
    )
    .option(
      "--plate-profile",
      "also write the plate profile (rule_*, plateArea_k, plateWidth_k columns) that the plate-stack surrogate learns from",
    )
    .option(
      "--evaluator-protocol <ids|ordered>",
      "with --evaluator-command: ids (each line carries \"sample\", echoed by its answer) or ordered (compatibility: answers in order, no ids)",
      "ids",
    )
    .requiredOption("--out <file.csv>", "output CSV (manifest written beside it)")
    .action(async (opts: SampleOptions) => {
      const n = wholeNumber("--n", opts.n, 1);
      const seed = wholeNumber("--seed", opts.seed, 0);
      const shardCount = opts.shardCount === undefined ? undefined : wholeNumber("--shard-count", opts.shardCount, 1);
      const fromEnvironment = opts.shard === undefined ? shardFromEnvironment(process.env, shardCount) : undefined;
      if (opts.shard === undefined && fromEnvironment === undefined && shardCount !== undefined) {
        throw new UsageError("sample: --shard-count needs JOB_COMPLETION_INDEX (a Kubernetes Indexed Job); otherwise use --shard k/N");
      }
      const shard = opts.shard === undefined ? fromEnvironment?.shard : parseShard(opts.shard);
      const source = await resolveSampleSource(opts);
      const scenario = source.scenario;
      const { design, announce } = resolveDesignOption("sample", opts.design, n, scenario.parameters.length, ctx.stderr);
      const processes = wholeNumber("--processes", opts.processes ?? "1", 1);
      if (processes > 1 && opts.evaluatorCommand === undefined) {
        throw new UsageError("sample: --processes needs --evaluator-command");
      }
      const timeoutMs = timeoutSeconds(opts.evaluatorTimeout ?? "300");
      if (opts.plateProfile === true && opts.evaluatorCommand !== undefined) {
        throw new UsageError(
          "sample: --plate-profile is for the built-in massing rule; an external evaluator writes the plate-profile columns itself",
        );
      }
      const protocol = opts.evaluatorProtocol ?? "ids";
      if (protocol !== "ids" && protocol !== "ordered") {
        throw new UsageError(`sample: --evaluator-protocol must be ids or ordered, got ${JSON.stringify(protocol)}`);
      }
      const evaluator: Evaluator | undefined =
        source.evaluator !== undefined
          ? source.evaluator()
          : opts.evaluatorCommand !== undefined
            ? commandEvaluator(opts.evaluatorCommand, { processes, timeoutMs, protocol })
            : opts.plateProfile === true
              ? massingEvaluator(scenario, { plateProfile: true })
              : undefined;
      let started = false;
      /** Once the run has started (so a mistake found before still prints one line): which shard and which design. */
      const announceStart = (): void => {
        if (started) return;
        started = true;
        if (fromEnvironment !== undefined) {
          ctx.stderr.write(`sample: shard ${fromEnvironment.shard.index}/${fromEnvironment.shard.count} from ${fromEnvironment.source}\n`);
        }
        announce();
      };
      let bar: ReturnType<typeof createProgressBar> | undefined;
      let designBar: ReturnType<typeof createProgressBar> | undefined;
      try {
        const manifest = await writeDataset(scenario, {
          out: opts.out,
          n,
          seed,
          design,
          ...(shard === undefined ? {} : { shard }),
          resume: opts.resume === true,
          force: opts.force === true,
          inputs: source.inputs,
          ...(evaluator === undefined ? {} : { evaluator }),
          onDesignProgress: (done, total) => {
            announceStart();
            designBar ??= createProgressBar(ctx.stderr, total, `design ${design}`, "steps");
            designBar.update(done);
          },
          onProgress: (done, total) => {
            if (bar === undefined) {
              designBar?.stop();
              announceStart();
            }
            bar ??= createProgressBar(ctx.stderr, total, `sample ${scenario.name}`);
            bar.update(done);
          },
        });
        bar?.stop();
        const s = manifest.shard;
        ctx.stdout.write(
          `wrote ${opts.out}: ${manifest.rows} rows (samples ${s.start}–${s.end - 1} of ${manifest.n}, shard ${s.index}/${s.count}), ` +
            `sha256 ${manifest.csv.sha256}\nmanifest ${manifestPathFor(opts.out)}\n${FLOORCAST_CAUTION}\n`,
        );
      } finally {
        designBar?.stop();
        bar?.stop();
        await evaluator?.close();
        await source.close();
      }
    });
}
