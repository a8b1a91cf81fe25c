import { polygonWidth } from "./polygon-width.js";

let hull = new Float64Array(64);
let order = new Int32Array(32);
let stack = new Int32Array(64);

/** Vertex a comes strictly before vertex b in (x, y) order. */
function before(a: number, b: number, xy: Float64Array): boolean {
  const dx = xy[2 * a]! - xy[2 * b]!;
  return dx < 0 || (dx === 0 && xy[2 * a + 1]! < xy[2 * b + 1]!);
}

function cross(o: number, a: number, b: number, xy: Float64Array): number {
  return (
    (xy[2 * a]! - xy[2 * o]!) * (xy[2 * b + 1]! - xy[2 * o + 1]!) -
    (xy[2 * a + 1]! - xy[2 * o + 1]!) * (xy[2 * b]! - xy[2 * o]!)
  );
}

/**
 * Width of any polygon: the least distance between two parallel lines enclosing it, which is the
 * width of its convex hull (two parallel lines enclose a set exactly when they enclose its hull).
 * The hull comes from Andrew's monotone chain (Andrew 1979), its width from {@link polygonWidth}.
 * @param xy - interleaved coordinates.
 * @param n - number of vertices.
 * @returns the width (0 for fewer than 3 vertices or a degenerate hull).
 */
export function hullWidth(xy: Float64Array, n: number): number {
  if (n < 3) return 0;
  if (order.length < n) order = new Int32Array(2 * n);
  if (hull.length < 4 * n + 4) hull = new Float64Array(8 * n + 8);
  if (stack.length < 2 * n + 2) stack = new Int32Array(4 * n + 4);
  // Vertex indices sorted by x, then y: insertion sort for the handful of vertices of most pieces.
  if (n <= 32) {
    for (let i = 0; i < n; i++) {
      let j = i;
      while (j > 0 && before(i, order[j - 1]!, xy)) {
        order[j] = order[j - 1]!;
        j--;
      }
      order[j] = i;
    }
  } else {
    const idx = order.subarray(0, n);
    for (let i = 0; i < n; i++) idx[i] = i;
    idx.sort((a, b) => xy[2 * a]! - xy[2 * b]! || xy[2 * a + 1]! - xy[2 * b + 1]!);
  }
  let top = 0;
  for (let s = 0; s < 2; s++) {
    const start = top;
    for (let t = 0; t < n; t++) {
      const p = order[s === 0 ? t : n - 1 - t]!;
      while (top >= start + 2 && cross(stack[top - 2]!, stack[top - 1]!, p, xy) <= 0) top--;
      stack[top++] = p;
    }
    top--;
  }
  const m = top;
  for (let i = 0; i < m; i++) {
    hull[2 * i] = xy[2 * stack[i]!]!;
    hull[2 * i + 1] = xy[2 * stack[i]! + 1]!;
  }
  return m < 3 ? 0 : polygonWidth(hull, m);
}
