/** Relative tolerance under which a turn counts as straight (as in convexPolygonProblem). */
const STRAIGHT = 1e-12;

function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

function onSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by);
}

/** Closed segments ab and cd share a point (orientation tests with exact zero for touching; O'Rourke 1998, §7.2). */
function segmentsMeet(xy: Float64Array, a: number, b: number, c: number, d: number): boolean {
  const ax = xy[2 * a]!;
  const ay = xy[2 * a + 1]!;
  const bx = xy[2 * b]!;
  const by = xy[2 * b + 1]!;
  const cx = xy[2 * c]!;
  const cy = xy[2 * c + 1]!;
  const dx = xy[2 * d]!;
  const dy = xy[2 * d + 1]!;
  // Bounding boxes strictly apart: no common point (exact comparisons, no rounding).
  if (Math.max(ax, bx) < Math.min(cx, dx) || Math.max(cx, dx) < Math.min(ax, bx)) return false;
  if (Math.max(ay, by) < Math.min(cy, dy) || Math.max(cy, dy) < Math.min(ay, by)) return false;
  const o1 = orient(ax, ay, bx, by, cx, cy);
  const o2 = orient(ax, ay, bx, by, dx, dy);
  const o3 = orient(cx, cy, dx, dy, ax, ay);
  const o4 = orient(cx, cy, dx, dy, bx, by);
  if (((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0))) return true;
  if (o1 === 0 && onSegment(ax, ay, bx, by, cx, cy)) return true;
  if (o2 === 0 && onSegment(ax, ay, bx, by, dx, dy)) return true;
  if (o3 === 0 && onSegment(cx, cy, dx, dy, ax, ay)) return true;
  if (o4 === 0 && onSegment(cx, cy, dx, dy, bx, by)) return true;
  return false;
}

/**
 * Checks that a ring is a simple polygon (no self-intersection, no touching, hence no holes):
 * no zero-length edge, no edge doubling back on the previous one, no two non-adjacent edges sharing
 * a point, and a non-zero area.
 * @param xy - interleaved vertex coordinates (finite numbers).
 * @param n - number of vertices (≥ 3).
 * @returns null for a simple polygon, otherwise a short description of the problem that reads after
 *   a field name ("is not simple: edge 1 crosses or touches edge 4").
 */
export function simplePolygonProblem(xy: Float64Array, n: number): string | null {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  let twiceArea = 0;
  for (let i = 0; i < n; i++) {
    const x = xy[2 * i]!;
    const y = xy[2 * i + 1]!;
    minX = Math.min(minX, x);
    maxX = Math.max(maxX, x);
    minY = Math.min(minY, y);
    maxY = Math.max(maxY, y);
    const j = i + 1 === n ? 0 : i + 1;
    twiceArea += x * xy[2 * j + 1]! - xy[2 * j]! * y;
  }
  const scale = Math.hypot(maxX - minX, maxY - minY);
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const k = j + 1 === n ? 0 : j + 1;
    const ex = xy[2 * j]! - xy[2 * i]!;
    const ey = xy[2 * j + 1]! - xy[2 * i + 1]!;
    const len = Math.hypot(ex, ey);
    if (!(len > STRAIGHT * scale)) return `has a zero-length edge ${i} (vertex ${i} to vertex ${j})`;
    const fx = xy[2 * k]! - xy[2 * j]!;
    const fy = xy[2 * k + 1]! - xy[2 * j + 1]!;
    const cross = ex * fy - ey * fx;
    if (Math.abs(cross) <= STRAIGHT * len * Math.hypot(fx, fy) && ex * fx + ey * fy < 0) {
      return `is not simple: it doubles back at vertex ${j}`;
    }
  }
  for (let i = 0; i < n; i++) {
    const i2 = i + 1 === n ? 0 : i + 1;
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue; // adjacent through the closing vertex
      const j2 = j + 1 === n ? 0 : j + 1;
      if (segmentsMeet(xy, i, i2, j, j2)) return `is not simple: edge ${i} crosses or touches edge ${j}`;
    }
  }
  if (!(Math.abs(twiceArea) / 2 > STRAIGHT * scale * scale)) return `has zero area`;
  return null;
}
