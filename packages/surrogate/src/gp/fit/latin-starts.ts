import seedrandom from "seedrandom";

/**
 * A seeded Latin hypercube of starting points in a box (McKay, Beckman & Conover 1979): each coordinate's
 * range is cut into `count` equal strata, one point per stratum, strata permuted independently per coordinate.
 * The first point is the box centre when `centreFirst` is set (a deterministic default start).
 * @param count - number of points.
 * @param lower - lower corner.
 * @param upper - upper corner.
 * @param seed - seedrandom seed.
 * @param centreFirst - replace the first point by the centre.
 * @returns `count` points.
 */
export function latinStarts(
  count: number,
  lower: ArrayLike<number>,
  upper: ArrayLike<number>,
  seed: number,
  centreFirst: boolean,
): Float64Array[] {
  const rng = seedrandom(`floorcast-gp-starts:${seed}`);
  const d = lower.length;
  const points = Array.from({ length: count }, () => new Float64Array(d));
  for (let k = 0; k < d; k++) {
    const perm = Array.from({ length: count }, (_, i) => i);
    for (let i = count - 1; i > 0; i--) {
      const j = Math.floor(rng() * (i + 1));
      [perm[i], perm[j]] = [perm[j]!, perm[i]!];
    }
    for (let i = 0; i < count; i++) {
      const u = (perm[i]! + rng()) / count;
      points[i]![k] = lower[k]! + u * (upper[k]! - lower[k]!);
    }
  }
  if (centreFirst && count > 0) {
    for (let k = 0; k < d; k++) points[0]![k] = 0.5 * (lower[k]! + upper[k]!);
  }
  return points;
}
