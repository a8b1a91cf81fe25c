import { mkdir, mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { basename, join } from "node:path";
import type { Command } from "commander";
import { createProgressBar, MASSING_OUTPUT_COLUMNS } from "@floorcast/sampler";
import type { CommandContext } from "../command-context.js";
import { EXIT_CODES } from "../exit-codes.js";
import { UsageError } from "../usage-error.js";
import { readParcelInputs, withParcelFileOptions, type ParcelInputOptions } from "../read-parcel-inputs.js";
import { FLOORCAST_CAUTION } from "../../floorcast-caution.js";
import { MODEL_FAMILIES } from "../../families/model-families.js";
import { parseWhole } from "../parse-whole.js";
import { OPTIMIZERS } from "../../optimize/optimizers.js";
import { rankParcelCollection } from "../../parcels/rank-parcel-collection.js";
import { parcelRankingMarkdown } from "../../report/parcel-ranking-markdown.js";
import type { RankAgreement } from "../../parcels/parcel-ranking.js";

interface RankParcelsCommandOptions extends ParcelInputOptions {
  out: string;
  summary: string;
  route: string;
  objective: string;
  minimise?: boolean;
  optimizer: string;
  budget: string;
  seed: string;
  shortlist?: string;
  trainingParcels?: string;
  trainingRows?: string;
  model: string;
  work?: string;
  force?: boolean;
}

const SINGLE = OPTIMIZERS.filter((o) => o.objectives === "single").map((o) => o.name);
const NUMERIC_OUTPUTS = MASSING_OUTPUT_COLUMNS.filter((c) => c !== "limitedBy");

/**
 * `floorcast rank-parcels`: ranks the parcels of a GeoJSON file by their best achievable objective over the
 * design variables (yards beyond the minimums, height and coverage up to the caps, floor-to-floor height),
 * exactly and/or with a surrogate trained across parcels, and writes the GeoJSON with rank and capacity
 * properties plus a JSON and a Markdown summary (agreement with the exact ranking, exact evaluations spent).
 * @param program - the root command.
 * @param ctx - the streams and exit status.
 */
export function registerRankParcelsCommand(program: Command, ctx: CommandContext): void {
  withParcelFileOptions(program.command("rank-parcels"))
    .description(
      "Rank the parcels of a GeoJSON file by their best achievable objective, exactly and with a surrogate trained across parcels; " +
        "write GeoJSON with rank and capacity properties and a JSON/Markdown summary.",
    )
    .requiredOption("--out <ranked.geojson>", "GeoJSON to write: every feature with its massing, rank and capacity properties")
    .requiredOption("--summary <name>", "writes <name>.json and <name>.md")
    .option("--route <exact|surrogate|both>", "exact: an optimizer per parcel on the exact rule; surrogate: on a surrogate trained across parcels; both: compared", "both")
    .option("--objective <output>", `massing output to rank by (${NUMERIC_OUTPUTS.join(", ")})`, "gfa")
    .option("--minimise", "rank by the least value instead of the most")
    .option("--optimizer <name>", `optimizer per parcel (${SINGLE.join(", ")})`, "pso")
    .option("--budget <n>", "evaluations per parcel (exact ones on the exact route, surrogate ones on the surrogate route)", "150")
    .option("--seed <n>", "seed of the optimizers, the training design and the fit", "1")
    .option("--shortlist <k>", "length of the shortlists compared (top-k overlap); default min(3, parcels)")
    .option("--training-parcels <m>", "parcels the surrogate's training designs are drawn on; default two thirds")
    .option("--training-rows <n>", "exact evaluations in the surrogate's training set; default 8 per training parcel")
    .option("--model <family>", `surrogate family (${MODEL_FAMILIES.filter((f) => f.name !== "plate-stack").map((f) => f.name).join(", ")})`, "gp")
    .option("--work <dir>", "keep the training CSV, its manifest and the model file in this folder, created when missing (default: a temporary one, removed)")
    .option("--force", "overwrite outputs that exist")
    .action(async (opts: RankParcelsCommandOptions) => {
      const cmd = "rank-parcels";
      if (!["exact", "surrogate", "both"].includes(opts.route)) throw new UsageError(`${cmd}: --route must be exact, surrogate or both, got ${JSON.stringify(opts.route)}`);
      if (!(NUMERIC_OUTPUTS as readonly string[]).includes(opts.objective)) throw new UsageError(`${cmd}: --objective must be one of ${NUMERIC_OUTPUTS.join(", ")}, got ${JSON.stringify(opts.objective)}`);
      if (!SINGLE.includes(opts.optimizer)) throw new UsageError(`${cmd}: --optimizer must be one of ${SINGLE.join(", ")}, got ${JSON.stringify(opts.optimizer)}`);
      if (opts.model === "plate-stack" || !MODEL_FAMILIES.some((f) => f.name === opts.model)) throw new UsageError(`${cmd}: --model must be gp or nn, got ${JSON.stringify(opts.model)}`);
      const budget = parseWhole(cmd, "--budget", opts.budget, 1);
      const seed = parseWhole(cmd, "--seed", opts.seed, 0);
      const whole = (flag: string, v: string | undefined, min: number): number | undefined => (v === undefined ? undefined : parseWhole(cmd, flag, v, min));
      const shortlist = whole("--shortlist", opts.shortlist, 1);
      const trainingParcels = whole("--training-parcels", opts.trainingParcels, 1);
      const rows = whole("--training-rows", opts.trainingRows, 2);
      const inputs = await readParcelInputs(cmd, opts);
      const summary = { json: `${opts.summary}.json`, md: `${opts.summary}.md` };
      const claim = await ctx.claimOutput(cmd, [opts.out, summary.json, summary.md], { force: opts.force, inputs: [opts.input, opts.zoning, opts.streets] });
      if (opts.work !== undefined) await mkdir(opts.work, { recursive: true });
      const work = opts.work ?? (await mkdtemp(join(tmpdir(), "floorcast-rank-")));
      let bar: ReturnType<typeof createProgressBar> | undefined;
      let stage = "";
      try {
        const ranked = await rankParcelCollection(
          inputs.collection,
          basename(opts.input),
          { coordinates: inputs.coordinates, streetDistance: inputs.streetDistance, plates: false, ...(inputs.zoning ? { zoning: inputs.zoning } : {}), ...(inputs.streets ? { streets: inputs.streets } : {}) },
          {
            route: opts.route as "exact" | "surrogate" | "both",
            objective: { output: opts.objective, sense: opts.minimise === true ? "min" : "max" },
            optimizer: opts.optimizer,
            budget,
            seed,
            ...(shortlist === undefined ? {} : { shortlist }),
            surrogate: { dir: work, model: opts.model, ...(trainingParcels === undefined ? {} : { trainingParcels }), ...(rows === undefined ? {} : { rows }) },
            onProgress: (s, done, total) => {
              if (s !== stage) {
                bar?.stop();
                stage = s;
                bar = createProgressBar(ctx.stderr, total, `${cmd} ${s}`, s === "training" ? "rows" : "parcels");
              }
              bar!.update(done);
            },
          },
        ).catch((e: unknown) => {
          if (e instanceof RangeError && /^(evaluateParcelFile|rankParcels): /.test(e.message)) throw new UsageError(`${cmd}: ${basename(opts.input)}: ${e.message.replace(/^\w+: /, "")}`);
          throw e;
        });
        bar?.stop();
        const r = ranked.report.ranking;
        await claim.put(opts.out, `${JSON.stringify(ranked.collection)}\n`);
        await claim.put(summary.json, `${JSON.stringify({ ...r, file: ranked.report.file, failed: ranked.failed }, null, 1)}\n`);
        await claim.put(summary.md, parcelRankingMarkdown(r, `Parcels of ${ranked.report.file} ranked by ${r.objective.output}`));
        await claim.commit();
        const n = r.parcels.length;
        const lines = [`${cmd}: ${n} parcels of ${basename(opts.input)} ranked by ${r.objective.sense === "max" ? "most" : "least"} ${r.objective.output} → ${opts.out}, ${summary.json}, ${summary.md}`];
        if (r.evaluations.exact !== null) lines.push(`  exact route: ${r.evaluations.exact} exact evaluations`);
        if (r.evaluations.surrogate !== null) lines.push(`  surrogate route: ${r.evaluations.surrogate.total} exact evaluations (${r.evaluations.surrogate.training} training + ${r.evaluations.surrogate.reevaluation} re-evaluation)`);
        const say = (what: string, a: RankAgreement | null | undefined): void => {
          if (a) lines.push(`  ${what} against the exact ranking: Spearman rho ${a.spearman.toFixed(3)}, Kendall tau-b ${a.kendall.toFixed(3)}, top-${r.shortlist} overlap ${Math.round(a.topOverlap * 100)}%`);
        };
        say("surrogate (choices re-evaluated)", r.agreement?.reevaluated);
        say("surrogate (predictions alone)", r.agreement?.predicted);
        say(`zone's own controls (${r.evaluations.zone} evaluations, no search)`, r.agreement?.zone);
        ctx.stdout.write(`${lines.join("\n")}\n${FLOORCAST_CAUTION}\n`);
        if (ranked.failed > 0) {
          ctx.stderr.write(`${cmd}: ${ranked.failed} of ${n + ranked.failed} features could not be evaluated and are not ranked (see their fc_error property)\n`);
          ctx.setExitCode(EXIT_CODES.someFailed);
        }
      } finally {
        bar?.stop();
        if (opts.work === undefined) await rm(work, { recursive: true, force: true });
      }
    });
}
