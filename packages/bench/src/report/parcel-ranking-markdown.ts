import type { ParcelRanking } from "../parcels/parcel-ranking.js";
import { formatNumber } from "./format-number.js";
import { markdownTable } from "./markdown-table.js";
import { parcelAgreementHeader, parcelAgreementRows } from "./parcel-agreement-rows.js";


/**
 * A parcel ranking as Markdown: what was ranked and how (objective, optimizer, budget, seed, the surrogate's
 * training parcels and rows), the agreement of the surrogate route with the exact ranking (Spearman's rho,
 * Kendall's tau-b, top-k overlap) beside the exact evaluations each route spent, and one row per parcel in rank
 * order. Starts and ends with the caution.
 * @param ranking - rankParcels' result.
 * @param title - the heading (e.g. the parcel file's name).
 * @param level - heading level of the title (1 for a document, 2 inside a report).
 * @returns the Markdown text, ending with a newline.
 */
export function parcelRankingMarkdown(ranking: ParcelRanking, title: string, level: 1 | 2 = 1): string {
  const h = "#".repeat(level);
  const o = ranking.objective;
  const out: string[] = [`${h} ${title}`, "", `> **Caution.** ${ranking.caution}`, ""];
  out.push(
    `Each parcel's best ${o.output} (${o.sense === "max" ? "maximised" : "minimised"}) over the yards beyond the zone's minimums, the height and coverage up to the zone's caps and the floor-to-floor height; optimizer ${ranking.optimizer}, ${ranking.budget} evaluations per parcel, seed ${ranking.seed}.`,
    "",
  );
  const e = ranking.evaluations;
  if (e.surrogate !== null) {
    const s = ranking.surrogate!;
    out.push(`Surrogate: ${s.model}, trained on ${s.rows} exact evaluations of ${s.trainingParcels.length} parcels (${s.trainingParcels.join(", ")}), then re-evaluated exactly at its choice on every parcel.`, "");
  }
  out.push(markdownTable(parcelAgreementHeader(ranking), parcelAgreementRows(ranking)), "");
  const order = [...ranking.parcels].sort((a, b) => (a.exact ?? a.surrogate)!.rank - (b.exact ?? b.surrogate)!.rank);
  const header = ["rank", "parcel", `${o.output} at the zone's controls`];
  if (e.exact !== null) header.push(`exact best ${o.output}`);
  if (e.surrogate !== null) header.push("surrogate rank", `surrogate choice, exact ${o.output}`, `predicted ${o.output}`, "training parcel");
  out.push(
    markdownTable(
      header,
      order.map((p) => {
        const r = [String((p.exact ?? p.surrogate)!.rank), p.id, formatNumber(p.zoneValue, 5)];
        if (p.exact) r.push(formatNumber(p.exact.value, 5));
        if (p.surrogate) r.push(String(p.surrogate.rank), formatNumber(p.surrogate.value, 5), formatNumber(p.surrogate.predicted, 5), p.surrogate.trained ? "yes" : "no");
        return r;
      }),
    ),
    "",
    `> ${ranking.caution}`,
    "",
  );
  return out.join("\n");
}
