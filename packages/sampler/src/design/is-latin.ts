import { checkPoints } from "./check-design-args.js";
import { stratumIndex } from "./stratum-index.js";

/**
 * The Latin property: in every dimension, each of the `strata` equal intervals [k/s, (k+1)/s) of [0, 1]
 * (x = 1 counted in the last) holds exactly n/s of the n points — with the default s = n, exactly one.
 * @param points - rows of coordinates in [0, 1].
 * @param strata - number of strata s (default: the number of points); false when s does not divide n.
 * @returns true when the property holds (vacuously for no points).
 * @throws TypeError/RangeError for bad points or a strata count that is not a positive integer.
 */
export function isLatin(points: readonly (readonly number[])[], strata?: number): boolean {
  const fn = "isLatin";
  const d = checkPoints(fn, points, true);
  const n = points.length;
  const s = strata ?? n;
  if (typeof s !== "number") throw new TypeError(`${fn}: strata must be a number`);
  if (n === 0 && strata === undefined) return true;
  if (!Number.isInteger(s) || s < 1) throw new RangeError(`${fn}: strata must be an integer ≥ 1, got ${s}`);
  if (n % s !== 0) return false;
  const per = n / s;
  const counts = new Int32Array(s);
  for (let k = 0; k < d; k++) {
    counts.fill(0);
    for (const row of points) {
      const c = stratumIndex(row[k] as number, s);
      counts[c] = (counts[c] as number) + 1;
      if ((counts[c] as number) > per) return false;
    }
  }
  return true;
}
