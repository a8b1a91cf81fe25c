import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { signedArea } from "../../packages/sampler/src/geometry/polygon-area.js";
import { polygonPerimeter } from "../../packages/sampler/src/geometry/polygon-perimeter.js";
import { polygonWidth } from "../../packages/sampler/src/geometry/polygon-width.js";
import { clipHalfPlane } from "../../packages/sampler/src/geometry/clip-half-plane.js";
import { makeCounterClockwise } from "../../packages/sampler/src/geometry/make-counter-clockwise.js";
import { innerParallelPolygon } from "../../packages/sampler/src/geometry/inner-parallel-polygon.js";
import { convexPolygonProblem } from "../../packages/sampler/src/geometry/convex-polygon-problem.js";

const flat = (pts: number[][]): Float64Array => Float64Array.from(pts.flat());
const big = (): Float64Array => new Float64Array(256);
const square = flat([[0, 0], [1, 0], [1, 1], [0, 1]]);

/** Inner parallel polygon area, moving edges by d: A(d) = A(0) of the result. */
function inset(pts: Float64Array, n: number, d: number): { area: number; count: number } {
  const out = big();
  const m = innerParallelPolygon(pts, n, d, out, big(), big());
  return { area: signedArea(out, m), count: m };
}

/**
 * Random convex polygon: points on an ellipse at increasing angles (points on an ellipse are always in
 * convex position), counter-clockwise; integer angle gaps keep every edge comfortably long.
 */
const convexPolygon = fc
  .record({
    gaps: fc.array(fc.integer({ min: 5, max: 100 }), { minLength: 3, maxLength: 9 }),
    start: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
    a: fc.double({ min: 2, max: 50, noNaN: true }),
    b: fc.double({ min: 2, max: 50, noNaN: true }),
  })
  .map(({ gaps, start, a, b }) => {
    const total = gaps.reduce((s, g) => s + g, 0);
    let t = start;
    return gaps.map((g) => {
      const p = [a * Math.cos(t), b * Math.sin(t)];
      t += (2 * Math.PI * g) / total;
      return p;
    });
  });

describe("signedArea, polygonPerimeter, makeCounterClockwise", () => {
  it("shoelace: +1 counter-clockwise, −1 clockwise, 0 below 3 vertices", () => {
    expect(signedArea(square, 4)).toBe(1);
    const cw = flat([[0, 0], [0, 1], [1, 1], [1, 0]]);
    expect(signedArea(cw, 4)).toBe(-1);
    expect(signedArea(square, 2)).toBe(0);
    expect(signedArea(new Float64Array(0), 0)).toBe(0);
    expect(polygonPerimeter(square, 4)).toBe(4);
    expect(polygonPerimeter(square, 0)).toBe(0);
    expect(makeCounterClockwise(cw, 4)).toBe(true);
    expect(signedArea(cw, 4)).toBe(1);
    expect(makeCounterClockwise(cw, 4)).toBe(false);
  });
  it("stays accurate far from the origin (relative to the first vertex)", () => {
    const far = flat([[1e7, 1e7], [1e7 + 3, 1e7], [1e7 + 3, 1e7 + 4]]);
    expect(signedArea(far, 3)).toBe(6);
  });
  it("a NaN coordinate gives NaN, not an area that looks valid (inputs are validated upstream)", () => {
    expect(signedArea(flat([[0, 0], [NaN, 0], [1, 1]]), 3)).toBeNaN();
  });
});

describe("clipHalfPlane", () => {
  it("keeps, halves or empties the unit square", () => {
    const out = big();
    expect(clipHalfPlane(square, 4, 1, 0, -1, out)).toBe(4); // x ≥ −1: all inside
    expect(signedArea(out, 4)).toBe(1);
    const m = clipHalfPlane(square, 4, 1, 0, 0.5, out); // x ≥ 0.5
    expect(signedArea(out, m)).toBeCloseTo(0.5, 15);
    expect(clipHalfPlane(square, 4, 1, 0, 2, out)).toBeLessThan(3); // x ≥ 2: empty
    expect(clipHalfPlane(square, 0, 1, 0, 0, out)).toBe(0);
    const diag = clipHalfPlane(square, 4, 1, 1, 1, out); // x + y ≥ 1
    expect(signedArea(out, diag)).toBeCloseTo(0.5, 15);
  });
  it("area of the two sides adds up to the whole (property)", () => {
    fc.assert(
      fc.property(convexPolygon, fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: -60, max: 60, noNaN: true }), (pts, t, c) => {
        const xy = flat(pts);
        const a = Math.cos(t);
        const b = Math.sin(t);
        const o1 = big();
        const o2 = big();
        const m1 = clipHalfPlane(xy, pts.length, a, b, c, o1);
        const m2 = clipHalfPlane(xy, pts.length, -a, -b, -c, o2);
        const total = signedArea(xy, pts.length);
        expect(signedArea(o1, m1) + signedArea(o2, m2)).toBeCloseTo(total, 8);
      }),
      { numRuns: 200, seed: 11 },
    );
  });
});

describe("polygonWidth", () => {
  it("rectangle: the shorter side; equilateral triangle: its altitude s√3/2 (derived)", () => {
    expect(polygonWidth(flat([[0, 0], [5, 0], [5, 3], [0, 3]]), 4)).toBeCloseTo(3, 14);
    expect(polygonWidth(flat([[0, 0], [10, 0], [5, 5 * Math.sqrt(3)]]), 3)).toBeCloseTo(5 * Math.sqrt(3), 12);
    expect(polygonWidth(square, 2)).toBe(0);
  });
  it("is invariant under rotation and never exceeds the extent in any direction (property)", () => {
    fc.assert(
      fc.property(convexPolygon, fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (pts, t) => {
        const w = polygonWidth(flat(pts), pts.length);
        const rot = pts.map(([x, y]) => [x! * Math.cos(t) - y! * Math.sin(t), x! * Math.sin(t) + y! * Math.cos(t)]);
        expect(polygonWidth(flat(rot), pts.length)).toBeCloseTo(w, 8);
        // The extent along direction t is at least the width.
        const proj = pts.map(([x, y]) => x! * Math.cos(t) + y! * Math.sin(t));
        expect(Math.max(...proj) - Math.min(...proj)).toBeGreaterThanOrEqual(w - 1e-9);
      }),
      { numRuns: 200, seed: 12 },
    );
  });
});

describe("innerParallelPolygon", () => {
  // Inner parallel polygon of a convex polygon (derived from the polygon's edge strips and corner kites):
  // A(d) = A − P·d + d²·Σ cot(θᵢ/2), while no edge has vanished.
  it("30 × 40 rectangle at d = 5 → 600", () => {
    expect(inset(flat([[0, 0], [30, 0], [30, 40], [0, 40]]), 4, 5).area).toBeCloseTo(600, 10);
  });
  it("equilateral triangle of side 10 at d = 1 → 18.4974226", () => {
    const tri = flat([[0, 0], [10, 0], [5, 5 * Math.sqrt(3)]]);
    expect(inset(tri, 3, 1).area).toBeCloseTo(18.4974226, 7);
  });
  it("regular hexagon (incircle r): A(d) = A(1 − d/r)²", () => {
    const s = 6;
    const hex = flat(Array.from({ length: 6 }, (_, i) => [s * Math.cos((i * Math.PI) / 3), s * Math.sin((i * Math.PI) / 3)]));
    const r = (s * Math.sqrt(3)) / 2;
    const a = signedArea(hex, 6);
    for (const d of [0.5, 2, 4.9]) expect(inset(hex, 6, d).area).toBeCloseTo(a * (1 - d / r) ** 2, 9);
    expect(inset(hex, 6, r + 1e-9).count).toBe(0);
  });
  it("d = 0 is the polygon; d beyond the inradius is empty; fewer than 3 vertices empty", () => {
    expect(inset(square, 4, 0).area).toBeCloseTo(1, 15);
    expect(inset(square, 4, 0.6).count).toBe(0);
    expect(inset(square, 2, 0.1).count).toBe(0);
  });
  it("matches A − P·d + d²·Σ cot(θᵢ/2) on random convex polygons before any edge vanishes (property)", () => {
    fc.assert(
      fc.property(convexPolygon, fc.double({ min: 0.05, max: 0.95, noNaN: true }), (pts, frac) => {
        const n = pts.length;
        const xy = flat(pts);
        const lens = pts.map((p, i) => Math.hypot(pts[(i + 1) % n]![0]! - p[0]!, pts[(i + 1) % n]![1]! - p[1]!));
        const cots = pts.map((p, i) => {
          const a = pts[(i + n - 1) % n]!;
          const b = pts[(i + 1) % n]!;
          const ux = a[0]! - p[0]!, uy = a[1]! - p[1]!, vx = b[0]! - p[0]!, vy = b[1]! - p[1]!;
          const theta = Math.acos((ux * vx + uy * vy) / Math.hypot(ux, uy) / Math.hypot(vx, vy));
          return 1 / Math.tan(theta / 2);
        });
        // Edge i (vertex i → i+1) vanishes at d = len_i / (cot(θᵢ/2) + cot(θᵢ₊₁/2)).
        const dMax = Math.min(...lens.map((l, i) => l / (cots[i]! + cots[(i + 1) % n]!)));
        const d = frac * dMax;
        const formula = signedArea(xy, n) - polygonPerimeter(xy, n) * d + d * d * cots.reduce((s, c) => s + c, 0);
        expect(inset(xy, n, d).area).toBeCloseTo(formula, 7);
      }),
      { numRuns: 200, seed: 13 },
    );
  });
});

describe("convexPolygonProblem", () => {
  it.each([
    ["a valid square", [[0, 0], [1, 0], [1, 1], [0, 1]], null],
    ["clockwise", [[0, 0], [0, 1], [1, 1], [1, 0]], null],
    ["collinear extra vertex", [[0, 0], [0.5, 0], [1, 0], [1, 1], [0, 1]], null],
    ["two vertices", [[0, 0], [1, 0]], /at least 3 vertices/],
    ["repeated vertex", [[0, 0], [1, 0], [1, 0], [0, 1]], /zero-length edge 1/],
    ["only two distinct", [[0, 0], [1, 0], [0, 0], [1, 0]], /3 distinct/],
    ["all on a line", [[0, 0], [1, 0], [2, 0], [3, 0]], /doubles back|zero area/],
    ["concave", [[0, 0], [2, 0], [1, 0.5], [2, 2], [0, 2]], /not convex/],
    ["bow tie", [[0, 0], [1, 1], [1, 0], [0, 1]], /not convex/],
    ["pentagram", [0, 2, 4, 1, 3].map((k) => [Math.cos((2 * Math.PI * k) / 5), Math.sin((2 * Math.PI * k) / 5)]), /intersects itself/],
    ["spike", [[0, 0], [2, 0], [1, 0], [1, 1]], /doubles back/],
  ])("%s", (_name, pts, expected) => {
    const problem = convexPolygonProblem(flat(pts as number[][]), (pts as number[][]).length);
    if (expected === null) expect(problem).toBeNull();
    else expect(problem).toMatch(expected as RegExp);
  });
});
