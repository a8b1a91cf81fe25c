import { mkdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import type { Command } from "commander";
import cliProgress from "cli-progress";
import { loadSurrogate, type Surrogate } from "@floorcast/surrogate";
import { checkSchemaMatch } from "@floorcast/sampler";
import type { CommandContext } from "../command-context.js";
import { parseWhole } from "../parse-whole.js";
import { UsageError } from "../usage-error.js";
import { loadProblem } from "../../problem/load-problem.js";
import { exactEvaluator } from "../../harness/exact-evaluator.js";
import { surrogateEvaluator } from "../../harness/surrogate-evaluator.js";
import { reevaluateSurrogateOptimum } from "../../harness/reevaluate-surrogate-optimum.js";
import { reportDesign } from "../../harness/report-design.js";
import { formatDesign } from "../../harness/format-design.js";
import { surrogateAtOptimum, type SurrogateAtOptimum } from "../../harness/surrogate-at-optimum.js";
import type { ReportedDesign } from "../../harness/bench-report-types.js";
import { OPTIMIZER_NAMES, runOptimizer, type OptimizerName } from "../../harness/run-optimizer.js";
import { optimizerNamed } from "../../optimize/optimizers.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { noteUnsealedModel } from "../note-unsealed-model.js";
import { modelInputSchema } from "../model-input-schema.js";

interface OptimizeOptions {
  problem: string;
  surrogate?: string;
  exact?: boolean;
  optimizer?: string;
  seed: string;
  budget: string;
  out: string;
  force?: boolean;
}

/**
 * Most evaluations one `optimize` run may ask for: the optimizers keep every evaluation (a few hundred bytes
 * each), so this bounds the run's memory to a few hundred MB, checked before anything is allocated.
 */
const MAX_OPTIMIZE_BUDGET = 1_000_000;

const whole = (flag: string, v: string, min: number): number => parseWhole("optimize", flag, v, min);

/**
 * `floorcast optimize`: optimizes one problem on the exact evaluator or on a surrogate model file;
 * a surrogate's optimum is re-evaluated exactly and never reported when exactly infeasible.
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerOptimizeCommand(program: Command, ctx: CommandContext): void {
  program
    .command("optimize")
    .description("Optimize one problem file on the exact evaluator or on a surrogate (its optimum re-evaluated exactly)")
    .requiredOption("--problem <file>", "problem file (JSON, see README \"Benchmark\")")
    .option("--surrogate <model.json>", "optimize on this surrogate model file")
    .option("--exact", "optimize on the exact evaluator")
    .option("--optimizer <name>", `${OPTIMIZER_NAMES.join(", ")} (default ga, nsga2 for two objectives)`)
    .option("--seed <s>", "seed of every random draw", "1")
    .option("--budget <n>", "evaluations allowed (grid: its own count)", "2000")
    .requiredOption("--out <dir>", "output directory (optimum.json)")
    .option("--force", "replace an existing optimum.json")
    .action(async (opts: OptimizeOptions) => {
      if ((opts.surrogate === undefined) === (opts.exact !== true)) throw new UsageError("optimize: give exactly one of --surrogate FILE or --exact");
      const seed = whole("--seed", opts.seed, 0);
      const budget = whole("--budget", opts.budget, 1);
      if (budget > MAX_OPTIMIZE_BUDGET) {
        throw new UsageError(`optimize: --budget must be at most ${MAX_OPTIMIZE_BUDGET} evaluations (every evaluation is kept for the report), got ${opts.budget}`);
      }
      await mkdir(opts.out, { recursive: true });
      const file = join(opts.out, "optimum.json");
      const claim = await ctx.claimOutput("optimize", file, { force: opts.force, inputs: [opts.problem, opts.surrogate] });
      const problem = await loadProblem(opts.problem);
      try {
        if (problem.kind === "site-selection") throw new UsageError(`optimize: ${problem.name} is a site-selection problem; rank its sites with floorcast bench`);
        const name = (opts.optimizer ?? (problem.kind === "two-objective" ? "nsga2" : "ga")) as OptimizerName;
        if (!OPTIMIZER_NAMES.includes(name)) throw new UsageError(`optimize: --optimizer must be one of ${OPTIMIZER_NAMES.join(", ")}, got ${JSON.stringify(opts.optimizer)}`);
        if ((optimizerNamed(name).objectives === "two") !== (problem.kind === "two-objective")) {
          throw new UsageError(`optimize: --optimizer ${name} does not fit ${problem.name}: nsga2 is for two objectives, the others for one`);
        }
        const exact = exactEvaluator(problem);
        let evaluator = exact as Parameters<typeof runOptimizer>[2];
        let surrogate: { readonly model: Surrogate; readonly variables: typeof problem.trainingVariables } | null = null;
        if (opts.surrogate !== undefined) {
          let text: string;
          try {
            text = await readFile(opts.surrogate, "utf8");
          } catch (error) {
            throw new UsageError(`optimize: cannot read ${opts.surrogate} (${(error as NodeJS.ErrnoException).code ?? String(error)})`);
          }
          const model = loadSurrogate(text, opts.surrogate);
          noteUnsealedModel("optimize", opts.surrogate, text, ctx);
          const schema = modelInputSchema("optimize", opts.surrogate, text, ctx);
          const want = problem.trainingVariables.map((v) => v.name);
          if (schema) checkSchemaMatch(schema, problem.trainingVariables, "optimize", opts.surrogate);
          else if ([...model.inputs].sort().join(",") !== [...want].sort().join(",")) {
            throw new UsageError(`optimize: ${opts.surrogate} has inputs ${model.inputs.join(", ")}; ${problem.name} needs ${want.join(", ")}`);
          }
          const missing = problem.outputs.filter((o) => !model.targets.includes(o));
          if (missing.length > 0) throw new UsageError(`optimize: ${opts.surrogate} does not predict ${missing.join(", ")}, which ${problem.name} needs`);
          // rows in the model's input order (names match; another order is fine), categoricals in the model-row coding
          const variables = model.inputs.map((n) => problem.trainingVariables.find((v) => v.name === n)!);
          evaluator = surrogateEvaluator(model, variables);
          surrogate = { model, variables };
        }
        const t0 = performance.now();
        const tty = (ctx.stderr as { isTTY?: boolean }).isTTY === true;
        const bar = tty ? new cliProgress.SingleBar({ stream: ctx.stderr as NodeJS.WriteStream, format: `${name} [{bar}] {value}/{total} evaluations`, fps: 5 }, cliProgress.Presets.shades_classic) : null;
        let started = false;
        const result = await runOptimizer(name, problem.optimization, evaluator, {
          seed,
          budget,
          gridPoints: problem.exact.gridPoints,
          onProgress: (done, total) => {
            if (bar && !started) bar.start(Number.isFinite(total) ? total : budget, 0);
            started = true;
            bar?.update(done);
          },
        });
        bar?.stop();
        const seconds = (performance.now() - t0) / 1000;
        const op = problem.optimization;
        let designs: (ReportedDesign & { readonly surrogate?: SurrogateAtOptimum })[];
        let source = "exact";
        let exactEvaluations = opts.exact ? result.evaluations : 0;
        if (problem.kind === "two-objective") {
          const front = result.front.map((e) => e.design);
          const outs = opts.exact ? result.front.map((e) => e.outputs) : await exact.evaluate(front);
          if (!opts.exact) exactEvaluations += front.length;
          designs = front
            .map((d, i) => ({ d, o: outs[i]! }))
            .filter(({ o }) => (op.constraints ?? []).every((c) => (c.op === "<=" ? o[c.output]! <= c.value : o[c.output]! >= c.value)))
            .map(({ d, o }) => reportDesign(problem, { design: d, outputs: o, objectives: op.objectives.map((k) => o[k.output]!), violation: 0, feasible: true, valid: true }));
        } else if (opts.exact) {
          designs = result.best ? [reportDesign(problem, result.best)] : [];
        } else {
          const chosen = await reevaluateSurrogateOptimum(op, result.history ?? [], exact);
          exactEvaluations += chosen.evaluations;
          source = chosen.source;
          designs = chosen.exact ? [reportDesign(problem, chosen.exact)] : [];
        }
        if (surrogate !== null) {
          const { model, variables } = surrogate;
          designs = designs.map((d) => ({
            ...d,
            surrogate: surrogateAtOptimum(model, variables, d.design, d.result as Record<string, number>, problem.outputs),
          }));
        }
        const summary = {
          kind: "floorcast.optimum",
          formatVersion: 1,
          caution: FLOORCAST_CAUTION,
          problem: problem.name,
          optimizer: result.method,
          evaluator: opts.exact ? "exact" : opts.surrogate,
          seed,
          evaluations: result.evaluations,
          exactEvaluations,
          source,
          seconds,
          optima: designs,
        };
        await claim.put(file, `${JSON.stringify(summary, null, 1)}\n`);
        await claim.commit();
        if (designs.length === 0) {
          ctx.stderr.write(`optimize: no exactly feasible design found for ${problem.name}\n`);
          ctx.setExitCode(1);
        }
        const g6 = (v: number | undefined): number => Number((v ?? NaN).toPrecision(6));
        for (const d of designs.slice(0, 10)) {
          ctx.stdout.write(`${op.objectives.map((o) => `${o.output}=${g6((d.result as Record<string, number>)[o.output])}`).join(" ")}  ${formatDesign(d.design)}\n`);
          const at = d.surrogate;
          if (at && designs.length === 1) {
            for (const k of Object.keys(at.mean)) {
              const sd = at.sd ? ` ± ${g6(at.sd[k])}` : "";
              ctx.stdout.write(`  surrogate ${k}=${g6(at.mean[k])}${sd} (exact ${g6(at.exact[k])}, exact − surrogate ${g6(at.difference[k])})\n`);
            }
          }
        }
        if (designs.length > 10) ctx.stdout.write(`… ${designs.length - 10} more front points in ${file}\n`);
        ctx.stdout.write(`${result.method}: ${result.evaluations} evaluations (${exactEvaluations} exact), ${seconds.toFixed(2)} s; written ${file}\n${FLOORCAST_CAUTION}\n`);
      } finally {
        await problem.close?.(); // an external evaluator command's processes
      }
    });
}
