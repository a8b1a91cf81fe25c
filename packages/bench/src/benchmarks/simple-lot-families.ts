/**
 * Random non-convex lots of four families (L-shaped, flag, notched, star-shaped), at most 12
 * corners, for the massing benchmark and the reference tests. Counter-clockwise before the caller's
 * rotation; lot lines follow their edges.
 */
import type { LotLine, Parcel, Point } from "@floorcast/sampler";

/** The families of {@link simpleLot}. */
export const SIMPLE_LOT_FAMILIES = ["L-shaped", "flag", "notched", "star-shaped"] as const;
export type SimpleLotFamily = (typeof SIMPLE_LOT_FAMILIES)[number];

type Draw = (lo: number, hi: number) => number;

function jitter(vertices: Point[], u: Draw, amount: number): Point[] {
  return vertices.map(([x, y]) => [x + u(-amount, amount), y + u(-amount, amount)] as Point);
}

/**
 * One random lot of a family (metres, near the origin, counter-clockwise).
 * @param family - which family.
 * @param u - uniform draw in [lo, hi) from a seeded generator.
 * @returns the parcel.
 */
export function simpleLot(family: SimpleLotFamily, u: Draw): Parcel {
  switch (family) {
    case "L-shaped": {
      const w = u(14, 40);
      const d = u(16, 45);
      const cw = w * u(0.3, 0.7);
      const cd = d * u(0.3, 0.7);
      const vertices: Point[] = [[0, 0], [w, 0], [w, d - cd], [w - cw, d - cd], [w - cw, d], [0, d]];
      return { vertices: jitter(vertices, u, 0.8), lotLines: ["front", "side", "rear", "side", "rear", "side"] };
    }
    case "flag": {
      const p = u(3, 7);
      const a = u(10, 30);
      const w = u(15, 40);
      const b = u(12, 35);
      const x0 = u(1, w - p - 1);
      const vertices: Point[] = [[x0, 0], [x0 + p, 0], [x0 + p, a], [w, a], [w, a + b], [0, a + b], [0, a], [x0, a]];
      return {
        vertices: jitter(vertices, u, 0.3),
        lotLines: ["front", "side", "side", "side", "rear", "side", "side", "side"],
      };
    }
    case "notched": {
      const w = u(16, 45);
      const d = u(18, 45);
      const nw = w * u(0.2, 0.5);
      const nh = d * u(0.15, 0.45);
      const x1 = u(2, w - nw - 2);
      if (u(0, 1) < 0.5) {
        const vertices: Point[] = [[0, 0], [w, 0], [w, d], [x1 + nw, d], [x1 + nw, d - nh], [x1, d - nh], [x1, d], [0, d]];
        const lotLines: LotLine[] = ["front", "side", "rear", "side", "rear", "side", "rear", "side"];
        return { vertices: jitter(vertices, u, 0.5), lotLines };
      }
      const vertices: Point[] = [[0, 0], [x1, 0], [x1, nh], [x1 + nw, nh], [x1 + nw, 0], [w, 0], [w, d], [0, d]];
      const lotLines: LotLine[] = ["front", "side", "front", "side", "front", "side", "rear", "side"];
      return { vertices: jitter(vertices, u, 0.5), lotLines };
    }
    case "star-shaped": {
      for (;;) {
        const k = 5 + Math.floor(u(0, 8));
        const r = u(12, 35);
        const vertices: Point[] = [];
        for (let i = 0; i < k; i++) {
          const t = ((i + u(-0.3, 0.3)) / k) * 2 * Math.PI;
          const ri = r * u(0.45, 1);
          vertices.push([ri * Math.cos(t), ri * Math.sin(t)]);
        }
        const short = vertices.some((v, i) => {
          const q = vertices[(i + 1) % k]!;
          return Math.hypot(q[0] - v[0], q[1] - v[1]) < 1.5;
        });
        if (short) continue;
        const lotLines: LotLine[] = vertices.map(() => "side");
        lotLines[0] = "front";
        lotLines[Math.floor(k / 2)] = "rear";
        if (u(0, 1) < 0.3) lotLines[1] = "street";
        return { vertices, lotLines };
      }
    }
  }
}
