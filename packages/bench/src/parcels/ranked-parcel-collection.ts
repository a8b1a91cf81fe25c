import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import type { EvaluatedParcel } from "./evaluate-parcel-file.js";
import type { ParcelRanking } from "./parcel-ranking.js";

/**
 * The evaluated parcel collection (evaluateParcelFile's output, input coordinates) with each ranked parcel's
 * ranking as properties: `fc_rank` and `fc_capacity` (the exact route's rank and best objective value, or the
 * surrogate route's when only it ran), `fc_bestDesign` (the design reaching it), `fc_rankSurrogate`,
 * `fc_capacitySurrogate` (the surrogate's choice re-evaluated exactly), `fc_capacityPredicted`, `fc_rankPredicted` (rank by
 * the surrogate's predictions alone) and
 * `fc_trainingParcel` (surrogate route), and `fc_rankObjective` (the objective ranked). Features that were
 * not evaluated keep their `fc_error`; plate features are left as they are. The collection carries
 * FLOORCAST_CAUTION in `fc_caution`.
 * @param collection - evaluateParcelFile's output collection.
 * @param evaluated - evaluateParcelFile's evaluated parcels, in the order given to rankParcels.
 * @param ranking - rankParcels' result on those parcels.
 * @returns a new collection (the input is not changed).
 * @throws RangeError when the ranking does not hold one entry per evaluated parcel.
 */
export function rankedParcelCollection(
  collection: Readonly<Record<string, unknown>>,
  evaluated: readonly EvaluatedParcel[],
  ranking: ParcelRanking,
): Record<string, unknown> {
  if (ranking.parcels.length !== evaluated.length) {
    throw new RangeError(`rankedParcelCollection: ranking.parcels holds ${ranking.parcels.length} parcels, evaluated ${evaluated.length}`);
  }
  const byFeature = new Map(evaluated.map((e, i) => [e.index, ranking.parcels[i]!]));
  const features = (collection.features as Record<string, unknown>[]).map((feature, k) => {
    const props = feature.properties as Record<string, unknown> | undefined;
    const p = props?.fc_kind === undefined ? byFeature.get(k) : undefined;
    if (p === undefined) return feature;
    const main = p.exact ?? p.surrogate!;
    const extra: Record<string, unknown> = {
      fc_rankObjective: `${ranking.objective.sense === "max" ? "maximise" : "minimise"} ${ranking.objective.output}`,
      fc_rank: main.rank,
      fc_capacity: main.value,
      fc_bestDesign: main.design,
    };
    if (p.surrogate) {
      extra.fc_rankSurrogate = p.surrogate.rank;
      extra.fc_capacitySurrogate = p.surrogate.value;
      extra.fc_capacityPredicted = p.surrogate.predicted;
      extra.fc_rankPredicted = p.surrogate.predictedRank;
      extra.fc_trainingParcel = p.surrogate.trained;
    }
    return { ...feature, properties: { ...props, ...extra } };
  });
  return { ...collection, fc_caution: FLOORCAST_CAUTION, features };
}
