import type { ParcelRanking, RankAgreement } from "../parcels/parcel-ranking.js";

/**
 * The header of {@link parcelAgreementRows}' table.
 * @param ranking - rankParcels' result (for its shortlist length).
 * @returns the column titles.
 */
export function parcelAgreementHeader(ranking: ParcelRanking): string[] {
  return ["ranking", "Spearman rho", "Kendall tau-b", `top-${ranking.shortlist} overlap`, "exact evaluations"];
}

const rho = (v: number): string => (Number.isFinite(v) ? v.toFixed(3) : "—");
const cells = (a: RankAgreement | null | undefined): string[] => (a ? [rho(a.spearman), rho(a.kendall), `${Math.round(a.topOverlap * 100)}%`] : ["—", "—", "—"]);

/**
 * The agreement table of a parcel ranking, one row per ranking compared with the exact route's: the no-search
 * baseline (the zone's own controls), the exact route itself, and the surrogate route by its re-evaluated choices
 * and by its predictions alone, each with the exact evaluations it spent ("—" where the exact route did not run).
 * @param ranking - rankParcels' result.
 * @returns rows of cells, as parcelAgreementHeader heads them.
 */
export function parcelAgreementRows(ranking: ParcelRanking): string[][] {
  const e = ranking.evaluations;
  const a = ranking.agreement;
  const rows: string[][] = [["the zone's own controls, no search", ...cells(a?.zone), String(e.zone)]];
  if (e.exact !== null) rows.push([`exact: ${ranking.optimizer} on the exact rule (reference)`, "1.000", "1.000", "100%", String(e.exact)]);
  if (e.surrogate !== null) {
    rows.push(["surrogate: its choices re-evaluated exactly", ...cells(a?.reevaluated), `${e.surrogate.total} (${e.surrogate.training} training + ${e.surrogate.reevaluation} re-evaluation)`]);
    rows.push(["surrogate: its predicted values alone", ...cells(a?.predicted), "the same"]);
  }
  return rows;
}
