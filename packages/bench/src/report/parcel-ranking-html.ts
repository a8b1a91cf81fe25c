import type { ParcelRankingReport } from "../parcels/parcel-ranking.js";
import { escapeHtml } from "./escape-html.js";
import { formatNumber } from "./format-number.js";
import { htmlTable } from "./html-table.js";
import { parcelAgreementHeader, parcelAgreementRows } from "./parcel-agreement-rows.js";
import { parcelCapacityPlan } from "./parcel-capacity-plan.js";
import type { PageSection } from "./render-page.js";


/**
 * The HTML section of a parcel ranking: what was ranked, the plan of the parcels coloured by their capacity
 * (parcelCapacityPlan: the exact route's best value, or the surrogate route's re-evaluated choice when only it
 * ran), the agreement of the surrogate route with the exact ranking beside the exact evaluations each spent, and
 * the parcels in rank order.
 * @param report - the parcel file's name, the ranking and the parcels' outlines.
 * @returns the page section.
 */
export function parcelRankingSection(report: ParcelRankingReport): PageSection {
  const r = report.ranking;
  const o = r.objective;
  const main = (p: (typeof r.parcels)[number]) => (p.exact ?? p.surrogate)!;
  const route = r.evaluations.exact !== null ? "the exact route (an optimizer per parcel on the exact rule)" : "the surrogate route (its choice re-evaluated exactly)";
  const parts: string[] = [
    `<p>The parcels of <code>${escapeHtml(report.file)}</code> ranked by their best ${escapeHtml(o.output)} over the yards beyond the zone's minimums, the height and coverage up to the zone's caps and the floor-to-floor height (optimizer ${escapeHtml(r.optimizer)}, ${r.budget} evaluations per parcel, seed ${r.seed}).</p>`,
    parcelCapacityPlan(
      r.parcels.map((p, i) => ({ id: p.id, vertices: report.outlines[i]!, capacity: main(p).value, rank: main(p).rank })),
      `Each parcel coloured by its best ${o.output} from ${route}, labelled with its id and rank (1 = most). ${r.caution}`,
      `best ${o.output}`,
    ),
  ];
  const e = r.evaluations;
  if (e.surrogate !== null && r.surrogate) {
    parts.push(`<p>Surrogate: ${escapeHtml(r.surrogate.model)} trained across parcels on parcel descriptors and the design variables, from ${r.surrogate.rows} exact evaluations on ${r.surrogate.trainingParcels.length} parcels (${escapeHtml(r.surrogate.trainingParcels.join(", "))}).</p>`);
  }
  parts.push(htmlTable(parcelAgreementHeader(r), parcelAgreementRows(r)));
  const header = ["rank", "parcel", `${o.output} at the zone's controls`, ...(e.exact !== null ? [`exact best ${o.output}`] : []), ...(e.surrogate !== null ? ["surrogate rank", `surrogate choice, exact ${o.output}`, `predicted ${o.output}`] : [])];
  const order = [...r.parcels].sort((a, b) => main(a).rank - main(b).rank);
  parts.push(
    htmlTable(
      header,
      order.map((p) => [
        main(p).rank,
        p.id,
        formatNumber(p.zoneValue, 5),
        ...(p.exact ? [formatNumber(p.exact.value, 5)] : []),
        ...(p.surrogate ? [p.surrogate.rank, formatNumber(p.surrogate.value, 5), formatNumber(p.surrogate.predicted, 5)] : []),
      ]),
    ),
  );
  return { title: `Parcels ranked by capacity: ${report.file}`, html: parts.join("\n") };
}
