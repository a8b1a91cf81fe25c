import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { hullWidth } from "../../packages/sampler/src/geometry/hull-width.js";

const ring = (pts: readonly (readonly [number, number])[]): Float64Array => Float64Array.from(pts.flat());

/**
 * Width by brute force: the least, over every direction through two vertices, of the vertices'
 * extent across that direction. The minimum is reached with a line through an edge of the hull
 * (Houle & Toussaint 1988), and every hull edge joins two vertices, so trying every vertex pair
 * finds it (derived; O(n³), for tests only).
 */
function bruteWidth(xy: Float64Array): number {
  const n = xy.length >> 1;
  let best = Infinity;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const dx = xy[2 * j]! - xy[2 * i]!;
      const dy = xy[2 * j + 1]! - xy[2 * i + 1]!;
      const len = Math.hypot(dx, dy);
      if (len === 0) continue;
      let lo = Infinity;
      let hi = -Infinity;
      for (let k = 0; k < n; k++) {
        const t = (-dy * xy[2 * k]! + dx * xy[2 * k + 1]!) / len;
        lo = Math.min(lo, t);
        hi = Math.max(hi, t);
      }
      // Only lines with every vertex on one side are supporting lines (hull edges).
      const base = (-dy * xy[2 * i]! + dx * xy[2 * i + 1]!) / len;
      if (Math.abs(lo - base) > 1e-9 * (1 + Math.abs(base)) && Math.abs(hi - base) > 1e-9 * (1 + Math.abs(base))) continue;
      best = Math.min(best, hi - lo);
    }
  }
  return best === Infinity ? 0 : best;
}

describe("hullWidth", () => {
  it("gives 20 for the L-shaped lot (0,0)…(0,20) of the README's worked check", () => {
    // Derived: hull (0,0), (20,0), (20,10), (10,20), (0,20); extents 20 across both axes and
    // 30/√2 ≈ 21.2 across the (1, 1) direction, so the least is 20.
    const l = ring([[0, 0], [20, 0], [20, 10], [10, 10], [10, 20], [0, 20]]);
    expect(hullWidth(l, 6)).toBeCloseTo(20, 12);
  });

  it("gives 2·R·cos(π/n) for a regular 40-gon (the sorted path for more than 32 vertices)", () => {
    // Derived: an even regular n-gon's width is twice its apothem, R·cos(π/n).
    const n = 40;
    const pts: [number, number][] = [];
    for (let k = 0; k < n; k++) pts.push([10 * Math.cos((2 * Math.PI * k) / n), 10 * Math.sin((2 * Math.PI * k) / n)]);
    expect(hullWidth(ring(pts), n)).toBeCloseTo(20 * Math.cos(Math.PI / n), 9);
  });

  it("is 0 for fewer than 3 vertices and for collinear points", () => {
    expect(hullWidth(ring([[0, 0], [1, 1]]), 2)).toBe(0);
    expect(hullWidth(ring([[0, 0], [1, 1], [2, 2], [3, 3]]), 4)).toBe(0);
  });

  it("ignores repeated vertices", () => {
    const sq = ring([[0, 0], [3, 0], [3, 0], [3, 2], [0, 2], [0, 0]]);
    expect(hullWidth(sq, 6)).toBeCloseTo(2, 12);
  });

  it("agrees with the brute-force width on random point sets of 3 to 60 points (both sort paths)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true })), {
          minLength: 3,
          maxLength: 60,
        }),
        (pts) => {
          const xy = ring(pts);
          const want = bruteWidth(xy);
          // Round-off of the extents, relative to the set's size (1e-9 of 100 m; derived).
          expect(Math.abs(hullWidth(xy, pts.length) - want)).toBeLessThanOrEqual(1e-7);
        },
      ),
      { numRuns: 300, seed: 16 },
    );
  });
});

describe("leastWidth (the public entry to the same width)", () => {
  it("gives the README's L-shaped lot 20 m (derived, as above) and validates its input", async () => {
    const { leastWidth } = await import("@floorcast/sampler");
    expect(leastWidth([[0, 0], [20, 0], [20, 10], [10, 10], [10, 20], [0, 20]])).toBeCloseTo(20, 12);
    expect(leastWidth([[0, 0], [1, 1]])).toBe(0);
    expect(() => leastWidth("x" as never)).toThrow(TypeError);
    expect(() => leastWidth([[0, Number.NaN], [1, 0], [0, 1]])).toThrow(/leastWidth: points\[0\] must be finite/);
  });
});
