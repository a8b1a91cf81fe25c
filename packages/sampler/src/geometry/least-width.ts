import { hullWidth } from "./hull-width.js";

/**
 * The least width of a point set or polygon: the least distance between two parallel lines enclosing it (the width
 * of its convex hull; Andrew 1979 for the hull, rotating calipers, Houle & Toussaint 1988). The same width the
 * massing rule compares with `minPlateWidth`.
 * @param points - the corners, `[x, y]` each (any order; a polygon's vertices).
 * @returns the width (0 for fewer than 3 points or collinear points).
 * @throws TypeError when points is not an array of `[x, y]` pairs; RangeError for a non-finite coordinate.
 */
export function leastWidth(points: readonly (readonly [number, number])[]): number {
  if (!Array.isArray(points)) throw new TypeError("leastWidth: points must be an array of [x, y] pairs");
  const xy = new Float64Array(2 * points.length);
  points.forEach((p, i) => {
    if (!Array.isArray(p) || p.length !== 2) throw new TypeError(`leastWidth: points[${i}] must be an [x, y] pair`);
    if (!Number.isFinite(p[0]) || !Number.isFinite(p[1])) throw new RangeError(`leastWidth: points[${i}] must be finite, got ${String(p)}`);
    xy[2 * i] = p[0];
    xy[2 * i + 1] = p[1];
  });
  return hullWidth(xy, points.length);
}
