import type { LotLine } from "@floorcast/sampler";

/** A street line in local metres: consecutive points of a polyline. */
export type StreetLine = readonly (readonly [number, number])[];

function segmentDistance(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const l2 = dx * dx + dy * dy;
  const t = l2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / l2)) : 0;
  return Math.hypot(ax + t * dx - px, ay + t * dy - py);
}

/** Cosine above which an edge faces away from the front: within 45° of directly opposite (common practice). */
const FACING_AWAY = Math.SQRT1_2;

/**
 * Infers the kind of each edge of a lot from nearby street lines: an edge whose midpoint lies within
 * `distance` of a street line faces a street; the longest such edge is the front and the others are
 * street lines (a corner lot's street-side lines); an edge whose outward normal points within 45° of
 * directly away from the front's is a rear line; every other edge is a side line.
 * @param ring - the lot's vertices in local metres (either orientation, not closed).
 * @param streets - street polylines in the same metres.
 * @param distance - the largest midpoint-to-street distance of a street-facing edge, metres.
 * @returns one kind per edge, or null when no edge is near a street (the lot has no front).
 */
export function inferLotLines(ring: readonly (readonly [number, number])[], streets: readonly StreetLine[], distance: number): LotLine[] | null {
  const n = ring.length;
  let twice = 0;
  for (let i = 0; i < n; i++) {
    const [x0, y0] = ring[i]!;
    const [x1, y1] = ring[(i + 1) % n]!;
    twice += x0 * y1 - x1 * y0;
  }
  const sign = twice > 0 ? 1 : -1;
  const near: boolean[] = [];
  const length: number[] = [];
  const normal: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    const [x0, y0] = ring[i]!;
    const [x1, y1] = ring[(i + 1) % n]!;
    const mx = (x0 + x1) / 2;
    const my = (y0 + y1) / 2;
    let best = Infinity;
    for (const line of streets) {
      for (let k = 0; k + 1 < line.length; k++) {
        const a = line[k]!;
        const b = line[k + 1]!;
        best = Math.min(best, segmentDistance(mx, my, a[0], a[1], b[0], b[1]));
      }
    }
    const len = Math.hypot(x1 - x0, y1 - y0);
    near.push(best <= distance);
    length.push(len);
    // Outward normal: to the right of the edge on a counter-clockwise ring.
    normal.push(len > 0 ? [(sign * (y1 - y0)) / len, (-sign * (x1 - x0)) / len] : [0, 0]);
  }
  let front = -1;
  for (let i = 0; i < n; i++) if (near[i] && (front < 0 || length[i]! > length[front]!)) front = i;
  if (front < 0) return null;
  const [fx, fy] = normal[front]!;
  return ring.map((_, i): LotLine => {
    if (i === front) return "front";
    if (near[i]) return "street";
    const [nx, ny] = normal[i]!;
    return nx * fx + ny * fy < -FACING_AWAY ? "rear" : "side";
  });
}
