import type { MassingInput } from "@floorcast/sampler";
import { escapeHtml } from "./escape-html.js";
import { formatNumber } from "./format-number.js";
import { htmlTable } from "./html-table.js";
import { renderFigure } from "./render-figure.js";
import { renderPage, type PageSection } from "./render-page.js";
import { benchFigureSpecs } from "./bench-figure-specs.js";
import type { BenchReport, ProblemReport, SurrogateOptimumRecord } from "../harness/bench-report-types.js";
import { fitRatio } from "../harness/fit-ratio.js";
import { headlineTable } from "../harness/headline-table.js";
import { massingDrawingSpec, massingSectionTop } from "./massing-drawing-spec.js";
import { formatDesign } from "../harness/format-design.js";
import { formatPercent } from "../harness/format-percent.js";
import { parcelRankingSection } from "./parcel-ranking-html.js";

const pct = formatPercent;
const isMassing = (input: unknown): input is MassingInput => typeof input === "object" && input !== null && "parcel" in input;

/** The surrogate-driven optimum drawn beside the exact one: floorcast's GP at its largest size, first seed. */
function drawnTrial(p: ProblemReport): SurrogateOptimumRecord | undefined {
  const gp = p.surrogateOptimum.filter((r) => r.surrogate === "gp" && r.sampler === "lhs-maximin" && r.input);
  const n = Math.max(...gp.map((r) => r.trainingSize));
  return gp.find((r) => r.trainingSize === n) ?? p.surrogateOptimum.find((r) => r.input);
}

async function problemSection(p: ProblemReport): Promise<PageSection> {
  const parts: string[] = [`<p>${escapeHtml(p.description)}</p>`];
  const e = p.exactOptimum;
  parts.push(`<p>Exact optimum <strong>${escapeHtml(formatNumber(e.value, 6))}</strong> at <code>${escapeHtml(formatDesign(e.design))}</code>, found with ${e.evaluations} exact evaluations (grid of ${e.gridPoints} points per continuous variable, ${e.gridEvaluations} evaluations, then ${e.refineEvaluations} of refinement).</p>`);
  parts.push(
    htmlTable(
      ["surrogate", "sampler", "n", "trials", "median gap", "worst gap", "median refined", "worst refined", "fallbacks", "median R²", "exact evals", "fit time ÷ floorcast gp"],
      p.summary.map((s) => [s.surrogate, s.sampler, s.trainingSize, s.trials, pct(s.medianGap), pct(s.worstGap), pct(s.medianGapRefined), pct(s.worstGapRefined), s.fallbacks, formatNumber(s.medianR2), Math.round(s.medianEvaluations), formatNumber(fitRatio(p, s), 3)]),
    ),
  );
  if (p.evaluationsToTarget.length > 0) {
    const of = p.kind === "two-objective" ? "the exact front's hypervolume" : "the exact optimum";
    parts.push(`<p>Exact evaluations each optimizer needed to come within ${p.target * 100}% of ${of} (median over seeds; “not reached” within the budget):</p>`);
    parts.push(htmlTable(["method", "median", "per seed", "budget"], p.evaluationsToTarget.map((t) => [t.method, t.median === null ? "not reached" : t.median, t.evaluations.map((v) => (v === null ? "—" : v)).join(", "), t.budget])));
  }
  for (const f of benchFigureSpecs(p)) parts.push(`<h3>${escapeHtml(f.title)}</h3>`, await renderFigure(f.spec, f.caption));
  const trial = drawnTrial(p);
  if (isMassing(e.input)) {
    parts.push("<h3>Plan and section of the optimal massing</h3>");
    const drawn = trial && isMassing(trial.input) ? trial.input : null;
    const top = massingSectionTop(drawn ? [e.input, drawn] : [e.input]);
    parts.push(await renderFigure(massingDrawingSpec(e.input, "exact optimum", top), "The exact optimum: the parcel (solid), its yard lines (dashed: each lot line moved in by its setback), the top floor plate (wide, orange) and the ground-floor plate over it (blue) in plan, and every floor in section across the lot depth with the height limit (dashed red); this section and the surrogate-driven one below share their height scale."));
    if (trial && drawn) {
      parts.push(await renderFigure(massingDrawingSpec(drawn, `${trial.surrogate}-driven optimum (n = ${trial.trainingSize}, seed ${trial.seed})`, top), `The design the ${trial.surrogate} surrogate led to, re-evaluated exactly (gap ${pct(trial.gap)}; source: ${trial.source}). Compare with the exact optimum above.`));
    }
  }
  if (p.notes.length > 0) parts.push(...p.notes.map((n) => `<p class="note">${escapeHtml(n)}</p>`));
  return { title: p.title, html: parts.join("\n") };
}

/**
 * The bench report as a self-contained HTML page (the trust report's page layout and figure
 * helpers): the caution, how to read the gap, the headline table, then per problem its tables,
 * figures (gap against training size, evaluations to target, fronts, ranking) and the plan and
 * section of the exact and surrogate-driven optimal massing, and, when the report has one, the parcel ranking
 * with its plan of parcels coloured by capacity.
 * @param report - the bench report.
 */
export async function renderBenchHtml(report: BenchReport): Promise<string> {
  const h = headlineTable(report);
  const intro: PageSection = {
    title: "Headline",
    html: [
      "<p>Gap = (exact optimum − exact value at the surrogate-driven optimum) / |exact optimum|, signed so that a positive gap is a loss. Every design shown as an optimum was re-evaluated with the exact evaluator, and an exactly infeasible design is never reported: the harness falls back to the surrogate's next candidates, then to the best exactly feasible training design (counted as fallbacks). For two objectives the gap is 1 − the hypervolume ratio of the exactly re-evaluated surrogate front to the exact front (a hypervolume gap).</p>",
      `<p>${escapeHtml(h.caption)}</p>`,
      htmlTable(h.header, h.rows),
      ...h.notes.map((n) => `<p class="note">${escapeHtml(n)}</p>`),
    ].join("\n"),
  };
  const sections = [intro];
  for (const p of report.problems) sections.push(await problemSection(p));
  if (report.parcels) sections.push(parcelRankingSection(report.parcels));
  return renderPage({
    title: `floorcast benchmark: suite “${report.suite}”`,
    subtitle: `${report.problems.length} problems · ${report.environment.cpus} CPUs · peers ${report.environment.peers ? "present" : "absent"}`,
    caution: report.caution,
    sections,
  });
}
