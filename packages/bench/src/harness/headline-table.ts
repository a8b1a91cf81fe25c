import type { BenchReport, GapSummary, ProblemReport } from "./bench-report-types.js";
import { formatHeadlineNumber as num } from "./headline-number.js";
import { outputUnit } from "./output-units.js";

/** The headline rows of one problem: each surrogate at its largest training size. */
function largest(p: ProblemReport): GapSummary[] {
  const best = new Map<string, GapSummary>();
  for (const s of p.summary) {
    const k = `${s.surrogate}|${s.sampler}`;
    if (!best.has(k) || best.get(k)!.trainingSize < s.trainingSize) best.set(k, s);
  }
  return [...best.values()];
}

/** Marks a two-objective problem's row; explained in the notes. */
const TWO_OBJECTIVE_MARK = " (HV)";

/** A model's short name: the surrogate, and its sampler when it is not floorcast's maximin LHS. */
function modelName(s: GapSummary): string {
  return s.sampler === "lhs-maximin" ? s.surrogate : `${s.surrogate}+${s.sampler}`;
}

/** The exact optimum with its unit, or the exact front's hypervolume for two objectives. */
function exactCell(p: ProblemReport): string {
  if (p.kind === "two-objective") return p.exactFront ? `HV ${num(p.exactFront.hypervolume)}` : "—";
  const unit = outputUnit(p.objectives[0]?.output ?? "");
  return `${num(p.exactOptimum.value)}${unit ? ` ${unit}` : ""} (${p.exactOptimum.evaluations})`;
}

/**
 * The headline table of a bench run, at most 100 columns wide in a terminal: per problem and
 * surrogate at its largest training size, the median and worst gap, the median gap after exact
 * refinement, the median R² on the test set and the exact evaluations used, beside the exact
 * optimum with its unit and cost; site selection adds the median Spearman rho. Numbers follow one
 * rule ({@link formatHeadlineNumber}). A two-objective row's gap is a hypervolume gap, and its
 * exact column the exact front's hypervolume (marked "(HV)"). Used by the terminal, the Markdown
 * and the HTML page.
 * @param report - the bench report.
 * @returns a caption, the column headings, rows of text, and notes to print below.
 */
export function headlineTable(report: BenchReport): { caption: string; header: string[]; rows: string[][]; notes: string[] } {
  const header = ["problem", "model", "n", "gap", "worst", "refined", "R²", "evals", "exact (evals)", "rho"];
  const rows: string[][] = [];
  let twoObjective = false;
  let seeds = 0;
  for (const p of report.problems) {
    for (const s of largest(p)) {
      seeds = Math.max(seeds, s.trials);
      const rhos = p.surrogateOptimum
        .filter((r) => r.surrogate === s.surrogate && r.sampler === s.sampler && r.trainingSize === s.trainingSize && r.ranking)
        .map((r) => r.ranking!.spearman)
        .sort((a, b) => a - b);
      const two = p.kind === "two-objective";
      twoObjective ||= two;
      rows.push([
        `${p.name}${two ? TWO_OBJECTIVE_MARK : ""}`,
        modelName(s),
        String(s.trainingSize),
        num(s.medianGap, true),
        num(s.worstGap, true),
        two ? "—" : num(s.medianGapRefined, true),
        num(s.medianR2),
        String(Math.round(s.medianEvaluations)),
        exactCell(p),
        rhos.length > 0 ? num(rhos[Math.floor((rhos.length - 1) / 2)]!) : "—",
      ]);
    }
  }
  // One training size for every row (the usual case): say it once in the caption instead of a column.
  const sizes = [...new Set(rows.map((r) => r[2]!))];
  const size = sizes.length === 1 ? `n = ${sizes[0]}` : "n";
  if (sizes.length === 1) {
    header.splice(2, 1);
    for (const r of rows) r.splice(2, 1);
  }
  const caption =
    `Each model at its largest training size (${size}), median (gap, R², evals, rho) and worst over ${seeds} seed${seeds === 1 ? "" : "s"}; ` +
    "numbers to 3 significant digits.";
  const notes = [
    "gap: share of the exact optimum lost by optimizing on the model (its design re-evaluated exactly); " +
      `refined: after ${typeof report.options["refineBudget"] === "number" ? `${report.options["refineBudget"]} ` : ""}exact refinement evaluations; ` +
      "evals: exact evaluations a trial used.",
    ...(twoObjective
      ? ["(HV): two objectives; gap is the hypervolume gap, 1 − HV(model's front) / HV(exact front); exact: the exact front's HV."]
      : []),
  ];
  return { caption, header, rows, notes };
}
