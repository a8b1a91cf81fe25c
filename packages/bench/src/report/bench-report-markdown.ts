import type { BenchReport, ProblemReport } from "../harness/bench-report-types.js";
import { fitRatio } from "../harness/fit-ratio.js";
import { headlineTable } from "../harness/headline-table.js";
import { formatDesign } from "../harness/format-design.js";
import { formatPercent } from "../harness/format-percent.js";
import { markdownTable } from "./markdown-table.js";
import { parcelRankingMarkdown } from "./parcel-ranking-markdown.js";

const table = markdownTable;
const pct = formatPercent;
const fmt = (v: number | null | undefined): string => (v === null || v === undefined || !Number.isFinite(v) ? "—" : String(Number(v.toPrecision(4))));

function problemSection(p: ProblemReport): string {
  const out: string[] = [`## ${p.title}`, "", p.description, ""];
  const objective = p.objectives.map((o) => `${o.sense === "max" ? "maximise" : "minimise"} ${o.output}`).join(", ");
  const constraints = p.constraints.map((c) => `${c.output} ${c.op === "<=" ? "≤" : "≥"} ${c.value}`).join(", ") || "none";
  out.push(`- Problem \`${p.name}\` (${p.kind}): ${objective}; constraints: ${constraints}; variables: ${p.variables.join(", ")}.`);
  const e = p.exactOptimum;
  out.push(`- Exact optimum: ${fmt(e.value)} at ${formatDesign(e.design)} — ${e.evaluations} exact evaluations (grid of ${e.gridPoints} points per continuous variable: ${e.gridEvaluations}; refinement: ${e.refineEvaluations}), ${fmt(e.seconds)} s.`);
  if (p.exactFront) out.push(`- Exact front: ${p.exactFront.points.length} points, hypervolume ${fmt(p.exactFront.hypervolume)} from reference ${JSON.stringify(p.exactFront.reference.map((v) => fmt(v)))}.`);
  out.push("", "### Gap by surrogate and training size", "");
  out.push(
    table(
      ["surrogate", "sampler", "n", "trials", "median gap", "worst gap", "median refined", "worst refined", "fallbacks", "median R²", "exact evals", "fit time ÷ floorcast gp"],
      p.summary.map((s) => [s.surrogate, s.sampler, String(s.trainingSize), String(s.trials), pct(s.medianGap), pct(s.worstGap), pct(s.medianGapRefined), pct(s.worstGapRefined), String(s.fallbacks), fmt(s.medianR2), String(Math.round(s.medianEvaluations)), fmt(fitRatio(p, s))]),
    ),
  );
  const ranked = p.surrogateOptimum.filter((r) => r.ranking);
  if (ranked.length > 0) {
    out.push("", "### Site ranking", "");
    out.push(table(["surrogate", "n", "seed", "Spearman rho", "Kendall tau-b", `top-${ranked[0]!.ranking!.shortlist} overlap`], ranked.map((r) => [r.surrogate, String(r.trainingSize), String(r.seed), fmt(r.ranking!.spearman), fmt(r.ranking!.kendall), pct(r.ranking!.topOverlap)])));
  }
  if (p.evaluationsToTarget.length > 0) {
    out.push("", `### Exact evaluations to come within ${p.target * 100}% of the exact ${p.kind === "two-objective" ? "front's hypervolume" : "optimum"}`, "");
    out.push(table(["method", "median", "per seed", "budget", "seconds"], p.evaluationsToTarget.map((t) => [t.method, t.median === null ? "not reached" : String(t.median), t.evaluations.map((v) => (v === null ? "—" : String(v))).join(", "), String(t.budget), fmt(t.seconds)])));
  }
  if (p.notes.length > 0) out.push("", ...p.notes.map((n) => `> ${n}`));
  return out.join("\n");
}

/**
 * The bench report as Markdown: the caution, the headline table, then per problem the exact
 * optimum and its cost, the gap table, rankings and evaluations to target.
 * @param report - the bench report.
 */
export function renderBenchMarkdown(report: BenchReport): string {
  const h = headlineTable(report);
  return [
    `# floorcast benchmark: suite "${report.suite}"`,
    "",
    `> **Caution.** ${report.caution}`,
    "",
    "Gap = (exact optimum − exact value at the surrogate-driven optimum) / |exact optimum| (for a minimised objective the sign is flipped, so a positive gap is always a loss). Every reported design was re-evaluated exactly; an exactly infeasible design is never reported. For two objectives the gap is 1 − (hypervolume of the exactly re-evaluated surrogate front / hypervolume of the exact front).",
    "",
    "## Headline",
    "",
    h.caption,
    "",
    table(h.header, h.rows),
    "",
    ...h.notes.flatMap((n) => [n, ""]),
    ...report.problems.map(problemSection).flatMap((s) => [s, ""]),
    ...(report.parcels ? [parcelRankingMarkdown(report.parcels.ranking, `Parcels ranked by capacity: ${report.parcels.file}`, 2)] : []),
    `Run: ${report.environment.cpus} CPUs, Node ${report.environment.node}, peers ${report.environment.peers ? "present" : "absent"}, ${report.seconds.toFixed(1)} s in this process.`,
    "",
    `> ${report.caution}`,
    "",
  ].join("\n");
}
