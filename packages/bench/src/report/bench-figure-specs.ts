import type { TopLevelSpec } from "vega-lite";
import type { ProblemReport } from "../harness/bench-report-types.js";

/** One figure of a problem's section: the Vega-Lite spec and what it means. */
export interface BenchFigure {
  readonly id: "gap-vs-size" | "evaluations-to-target" | "fronts" | "ranking";
  readonly title: string;
  readonly spec: TopLevelSpec;
  readonly caption: string;
}

const SCHEMA = "https://vega.github.io/schema/vega-lite/v6.json";
const label = (s: string, sampler: string): string => (sampler === "lhs-maximin" ? s : `${s} (${sampler})`);

/**
 * The Vega-Lite specs of one problem's figures: gap against training size (every trial and the
 * median), evaluations-to-target curves of the optimizers on the exact evaluator, the exact and
 * surrogate-driven fronts (two objectives), and the ranking scatter (site selection).
 * @param p - the problem's report.
 * @returns the figures, in page order.
 */
export function benchFigureSpecs(p: ProblemReport): BenchFigure[] {
  const figs: BenchFigure[] = [];
  const trials = p.surrogateOptimum.map((r) => ({ surrogate: label(r.surrogate, r.sampler), n: r.trainingSize, gap: r.gap ?? 1, refined: r.refined?.gap ?? null }));
  const medians = p.summary.map((s) => ({ surrogate: label(s.surrogate, s.sampler), n: s.trainingSize, gap: s.medianGap }));
  const color = { field: "surrogate", type: "nominal", title: "surrogate" } as const;
  const gapTitle = p.kind === "two-objective" ? "hypervolume gap (1 − hypervolume ratio)" : "gap (share of the exact optimum)";
  // At least a 1% span, so an all-zero figure still has a readable axis; sizes as categories and
  // each surrogate dodged beside the others, so series with equal values stay visible.
  const gaps = trials.map((t) => t.gap);
  const domain: [number, number] = [Math.min(0, ...gaps), Math.max(0.01, ...gaps)];
  const y = { field: "gap", type: "quantitative", title: gapTitle, axis: { format: ".1%" }, scale: { domain, nice: true } } as const;
  const x = { field: "n", type: "ordinal", title: "training size (exact evaluations)", sort: "ascending" } as const;
  const dodge = { field: "surrogate", type: "nominal" } as const;
  figs.push({
    id: "gap-vs-size",
    title: "Gap against training size",
    spec: {
      $schema: SCHEMA,
      width: 460,
      height: 260,
      layer: [
        { data: { values: trials }, mark: { type: "circle", size: 40, opacity: 0.5 }, encoding: { x, xOffset: dodge, y, color } },
        { data: { values: medians }, mark: { type: "point", filled: true, size: 90, shape: "diamond", opacity: 1 }, encoding: { x, xOffset: dodge, y, color } },
      ],
    },
    caption: `Each dot is one trial (a surrogate, a training size, a seed): how much of the exact optimum the surrogate-driven design, re-evaluated exactly, lost; diamonds mark the medians, and the surrogates stand side by side at each size. Lower is better; 0 means the surrogate led to the exact optimum.`,
  });
  if (p.evaluationsToTarget.length > 0) {
    const pts = p.evaluationsToTarget.flatMap((e) => e.curve.map(([n, g]) => ({ method: e.method, n, shortfall: Math.max(g, 1e-5) })));
    figs.push({
      id: "evaluations-to-target",
      title: "Exact evaluations to reach the optimum",
      spec: {
        $schema: SCHEMA,
        width: 460,
        height: 260,
        layer: [
          { data: { values: pts }, mark: { type: "line", interpolate: "step-after", point: { size: 12 } }, encoding: { x: { field: "n", type: "quantitative", scale: { type: "log" }, title: "exact evaluations" }, y: { field: "shortfall", type: "quantitative", scale: { type: "log" }, title: "best so far: shortfall from the exact optimum" }, color: { field: "method", type: "nominal" } } },
          { data: { values: [{ t: p.target }] }, mark: { type: "rule", strokeDash: [4, 4], color: "#a33" }, encoding: { y: { field: "t", type: "quantitative" } } },
        ],
      },
      caption:
        p.kind === "two-objective"
          ? `NSGA-II and random search run directly on the exact evaluator (first seed): 1 − the hypervolume of their feasible designs so far / the exact front's, after each exact evaluation. The dashed line is the ${p.target * 100}% target; shortfalls below 1e-5 are drawn at 1e-5.`
          : `Each optimizer run directly on the exact evaluator (first seed): the best design's relative shortfall from the exact optimum after each exact evaluation; the grid's points are its full grids at 2, 3, … points per variable. The dashed line is the ${p.target * 100}% target; shortfalls below 1e-5 are drawn at 1e-5.`,
    });
  }
  if (p.exactFront) {
    const [o1, o2] = p.objectives.map((o) => o.output);
    const largest = Math.max(...p.surrogateOptimum.map((r) => r.trainingSize));
    const fronts = p.surrogateOptimum
      .filter((r) => r.trainingSize === largest && r.seed === p.surrogateOptimum[0]!.seed)
      .flatMap((r) => (r.front ?? []).map((f) => ({ source: `${label(r.surrogate, r.sampler)} n=${r.trainingSize}`, a: f[0], b: f[1] })));
    const exact = p.exactFront.points.map((f) => ({ source: "exact", a: f[0], b: f[1] }));
    figs.push({
      id: "fronts",
      title: "Exact front and surrogate-driven fronts",
      spec: {
        $schema: SCHEMA,
        width: 460,
        height: 300,
        data: { values: [...exact, ...fronts] },
        mark: { type: "point", filled: true, size: 30, opacity: 0.7 },
        encoding: { x: { field: "a", type: "quantitative", title: o1, scale: { zero: false } }, y: { field: "b", type: "quantitative", title: o2, scale: { zero: false } }, color: { field: "source", type: "nominal" }, shape: { field: "source", type: "nominal" } },
      },
      caption: `The exact front (grid plus NSGA-II on the exact evaluator) and, for the largest training size and first seed, each surrogate's NSGA-II front after exact re-evaluation (exactly infeasible designs removed). Both objectives are maximised: up and to the right is better.`,
    });
  }
  if (p.sites) {
    const largest = Math.max(...p.surrogateOptimum.map((r) => r.trainingSize));
    const pts = p.surrogateOptimum
      .filter((r) => r.trainingSize === largest && r.seed === p.surrogateOptimum[0]!.seed && r.ranking)
      .flatMap((r) => r.ranking!.estimates.map((e, i) => ({ surrogate: label(r.surrogate, r.sampler), exact: p.sites!.exactBest[i], estimate: e })));
    figs.push({
      id: "ranking",
      title: "Site ranking: surrogate estimate against exact best",
      spec: {
        $schema: SCHEMA,
        width: 420,
        height: 320,
        data: { values: pts },
        mark: { type: "circle", size: 18, opacity: 0.55 },
        encoding: { x: { field: "exact", type: "quantitative", title: `exact best ${p.objectives[0]!.output} per site` }, y: { field: "estimate", type: "quantitative", title: "surrogate's estimate" }, color: { field: "surrogate", type: "nominal" } },
      },
      caption: `Each dot is one of the ${p.sites.count} sites: its exact best ${p.objectives[0]!.output} across and the surrogate's estimate up (largest training size, first seed). A monotone cloud means the surrogate ranks the sites as the exact search does.`,
    });
  }
  return figs;
}
