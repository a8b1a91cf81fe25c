import { evaluateParcelFile, type ParcelFileOptions } from "./evaluate-parcel-file.js";
import type { ParcelRankingReport } from "./parcel-ranking.js";
import { rankParcels, type RankParcelsOptions } from "./rank-parcels.js";
import { rankedParcelCollection } from "./ranked-parcel-collection.js";

/** What {@link rankParcelCollection} returns. */
export interface RankedParcelFile {
  /** The output GeoJSON: every feature with its massing and ranking properties (input coordinates). */
  readonly collection: Record<string, unknown>;
  /** The ranking with the parcels' outlines, for reports. */
  readonly report: ParcelRankingReport;
  /** Features that could not be evaluated (reported in place with `fc_error`, not ranked). */
  readonly failed: number;
}

/**
 * Ranks the parcels of a GeoJSON FeatureCollection: evaluateParcelFile reads and checks every feature (zoning
 * table, lot-line inference, projection to local metres), rankParcels ranks the evaluated ones (id: the feature's
 * `id`, else its position), and rankedParcelCollection writes the ranking back as properties. Estimates for early
 * feasibility studies, not a zoning determination.
 * @param collection - the parsed GeoJSON.
 * @param file - the file's name (for reports).
 * @param fileOptions - as evaluateParcelFile takes them.
 * @param rankOptions - as rankParcels takes them.
 * @returns the ranked collection, the report and the number of failed features.
 * @throws RangeError when the input is not a FeatureCollection or fewer than 2 parcels could be evaluated.
 */
export async function rankParcelCollection(
  collection: unknown,
  file: string,
  fileOptions: ParcelFileOptions,
  rankOptions: RankParcelsOptions,
): Promise<RankedParcelFile> {
  const evaluated = evaluateParcelFile(collection, fileOptions);
  const features = (collection as { features: { id?: unknown }[] }).features;
  const parcels = evaluated.evaluated.map((e) => ({ id: String(features[e.index]!.id ?? e.index), input: e.input }));
  const ranking = await rankParcels(parcels, rankOptions);
  return {
    collection: rankedParcelCollection(evaluated.collection, evaluated.evaluated, ranking),
    report: { file, ranking, outlines: parcels.map((p) => p.input.parcel.vertices.map((q) => [q[0], q[1]] as [number, number])) },
    failed: evaluated.failed,
  };
}
