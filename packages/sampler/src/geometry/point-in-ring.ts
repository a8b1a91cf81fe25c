/**
 * Whether a point lies inside a ring, by the crossing number (even–odd rule; O'Rourke 1998, §7.4):
 * a horizontal ray from the point crosses the ring's edges an odd number of times. Points on the
 * boundary may go either way.
 * @param ring - interleaved ring, either orientation.
 * @param x - the point's x.
 * @param y - the point's y.
 * @returns true when inside.
 */
export function pointInRing(ring: Float64Array, x: number, y: number): boolean {
  const m = ring.length >> 1;
  let inside = false;
  for (let a = 0, b = m - 1; a < m; b = a++) {
    const ay = ring[2 * b + 1]!;
    const by = ring[2 * a + 1]!;
    if (ay > y !== by > y && x < ring[2 * b]! + ((y - ay) * (ring[2 * a]! - ring[2 * b]!)) / (by - ay)) inside = !inside;
  }
  return inside;
}
