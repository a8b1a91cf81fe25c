import type { BenchReport, GapSummary, ProblemReport } from "./bench-report-types.js";
import { formatPercent } from "./format-percent.js";

const pct = formatPercent;
const num = (v: number | null | undefined, d = 3): string => (v === null || v === undefined || !Number.isFinite(v) ? "—" : Number(v.toPrecision(d)).toString());

/** The headline rows of one problem: each surrogate at its largest training size. */
function largest(p: ProblemReport): GapSummary[] {
  const best = new Map<string, GapSummary>();
  for (const s of p.summary) {
    const k = `${s.surrogate}|${s.sampler}`;
    if (!best.has(k) || best.get(k)!.trainingSize < s.trainingSize) best.set(k, s);
  }
  return [...best.values()];
}

/**
 * The headline table of a bench run: per problem and surrogate (at its largest training size) the
 * median and worst gap, the median gap after exact refinement, the median R² on the test set and
 * the exact evaluations used, beside the exact optimum's cost; site selection adds the median
 * Spearman rho. Used by the terminal, the Markdown and the HTML page.
 * @param report - the bench report.
 * @returns column headings and rows of text.
 */
export function headlineTable(report: BenchReport): { header: string[]; rows: string[][] } {
  const header = ["problem", "surrogate", "n", "median gap", "worst gap", "refined median", "R²", "exact evals", "exact optimum (evals)", "rank rho"];
  const rows: string[][] = [];
  for (const p of report.problems) {
    for (const s of largest(p)) {
      const rhos = p.surrogateOptimum
        .filter((r) => r.surrogate === s.surrogate && r.sampler === s.sampler && r.trainingSize === s.trainingSize && r.ranking)
        .map((r) => r.ranking!.spearman)
        .sort((a, b) => a - b);
      rows.push([
        p.name,
        s.sampler === "lhs-maximin" ? s.surrogate : `${s.surrogate} (${s.sampler})`,
        String(s.trainingSize),
        pct(s.medianGap),
        pct(s.worstGap),
        p.kind === "two-objective" ? "—" : pct(s.medianGapRefined),
        num(s.medianR2),
        String(Math.round(s.medianEvaluations)),
        `${num(p.exactOptimum.value, 6)} (${p.exactOptimum.evaluations})`,
        rhos.length > 0 ? num(rhos[Math.floor((rhos.length - 1) / 2)]!) : "—",
      ]);
    }
  }
  return { header, rows };
}
