import { signedArea } from "./polygon-area.js";

/**
 * Normalises a polygon's orientation in place: reverses the vertex order when it is clockwise.
 * After reversal, vertex i is old vertex n − 1 − i and edge i is old edge (n − 2 − i) mod n.
 * @param xy - interleaved vertex coordinates, modified in place.
 * @param n - number of vertices.
 * @returns true when the order was reversed.
 */
export function makeCounterClockwise(xy: Float64Array, n: number): boolean {
  if (signedArea(xy, n) >= 0) return false;
  for (let i = 0, j = n - 1; i < j; i++, j--) {
    const x = xy[2 * i]!;
    const y = xy[2 * i + 1]!;
    xy[2 * i] = xy[2 * j]!;
    xy[2 * i + 1] = xy[2 * j + 1]!;
    xy[2 * j] = x;
    xy[2 * j + 1] = y;
  }
  return true;
}
