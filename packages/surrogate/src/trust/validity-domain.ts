import { checkMatrix } from "../check-training-data.js";
import { percentile } from "./percentile.js";

/**
 * The domain of validity of a surrogate: the box of its training inputs, and a nearest-neighbour
 * distance threshold in scaled input space (each input mapped to [0, 1] by the training bounds).
 * A prediction is inside when it lies in the box and no farther from its nearest training row than
 * `nnThreshold`. The threshold is the `percentile` (default 0.99) of the training rows' leave-one-out
 * nearest-neighbour distances: a query farther than that from every training row sits in a gap wider
 * than 99% of the gaps between training rows themselves (common practice in applicability-domain checks).
 * Serialisable as JSON (kind + formatVersion), e.g. under a model file's `training.domain`.
 */
export interface ValidityDomain {
  readonly kind: "floorcast.validity-domain";
  readonly formatVersion: 1;
  /** Input names, in column order. */
  readonly inputs: readonly string[];
  /** Smallest training value of each input. */
  readonly lower: readonly number[];
  /** Largest training value of each input. */
  readonly upper: readonly number[];
  /** Percentile of training leave-one-out NN distances used for the threshold. */
  readonly percentile: number;
  /** Threshold on the scaled Euclidean distance to the nearest training row. */
  readonly nnThreshold: number;
  /** Training rows in scaled space [0, 1]^d. */
  readonly points: readonly (readonly number[])[];
}

/**
 * Maps a row to the domain's scaled space: (x − lower)/(upper − lower), constant inputs to 0.
 * @param domain - the domain.
 * @param row - raw inputs.
 */
export function scaleToDomain(domain: Pick<ValidityDomain, "lower" | "upper">, row: readonly number[]): number[] {
  return row.map((v, j) => {
    const w = domain.upper[j]! - domain.lower[j]!;
    return w > 0 ? (v - domain.lower[j]!) / w : v - domain.lower[j]!;
  });
}

/**
 * Builds the validity domain of a training set.
 * @param inputs - input names.
 * @param x - training inputs, rows × inputs, finite, at least two rows.
 * @param options.percentile - quantile of the LOO NN distances used as threshold, in (0, 1]; default 0.99.
 * @returns the domain.
 */
export function buildValidityDomain(
  inputs: readonly string[],
  x: readonly (readonly number[])[],
  options: { percentile?: number } = {},
): ValidityDomain {
  const fn = "buildValidityDomain";
  if (!Array.isArray(inputs)) throw new TypeError(`${fn}: inputs must be an array of names`);
  checkMatrix(fn, "x", x, inputs.length);
  if (x.length < 2) throw new RangeError(`${fn}: x must have at least two rows, got ${x.length}`);
  const q = options.percentile ?? 0.99;
  if (!(q > 0 && q <= 1)) throw new RangeError(`${fn}: options.percentile must be in (0, 1], got ${q}`);
  const d = inputs.length;
  const lower = Array.from({ length: d }, (_, j) => x.reduce((m, r) => Math.min(m, r[j]!), Infinity));
  const upper = Array.from({ length: d }, (_, j) => x.reduce((m, r) => Math.max(m, r[j]!), -Infinity));
  const points = x.map((r) => scaleToDomain({ lower, upper }, r));
  const nn = points.map((p, i) => nearestDistance(points, p, i));
  return {
    kind: "floorcast.validity-domain",
    formatVersion: 1,
    inputs: [...inputs],
    lower,
    upper,
    percentile: q,
    nnThreshold: percentile(nn, q),
    points,
  };
}

/**
 * Euclidean distance from `p` to the nearest of `points`, skipping index `skip`.
 * @param points - scaled rows.
 * @param p - scaled query.
 * @param skip - index to leave out (−1 for none).
 * @returns the distance; Infinity when there are no points (or the query has NaN coordinates).
 */
export function nearestDistance(points: readonly (readonly number[])[], p: readonly number[], skip = -1): number {
  let best = Infinity;
  for (let i = 0; i < points.length; i++) {
    if (i === skip) continue;
    const r = points[i]!;
    let s = 0;
    for (let j = 0; j < p.length && s < best; j++) s += (r[j]! - p[j]!) ** 2;
    if (s < best) best = s;
  }
  return Math.sqrt(best);
}
