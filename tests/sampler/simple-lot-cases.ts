import seedrandom from "seedrandom";
import type { LotLine, MassingInput, Point } from "@floorcast/sampler";
import { simpleLot } from "../../packages/bench/src/benchmarks/simple-lot-families.js";
import type { SimpleLotFamily } from "../../packages/bench/src/benchmarks/simple-lot-families.js";

/**
 * Seeded random massing inputs on random lots of one non-convex family, with every control drawn as in
 * randomMassingCases (helper of the massing tests): rotated, translated, half of them clockwise.
 */
export function simpleLotCases(family: SimpleLotFamily, count: number, seed: string): MassingInput[] {
  const rng = seedrandom(`${seed}:${family}`);
  const u = (lo: number, hi: number): number => lo + (hi - lo) * rng();
  const cases: MassingInput[] = [];
  while (cases.length < count) {
    const lot = simpleLot(family, u);
    let vertices: Point[] = lot.vertices.map((v) => [v[0], v[1]] as Point);
    let lotLines: LotLine[] = [...lot.lotLines];
    const th = u(0, 2 * Math.PI);
    const tx = u(-1000, 1000);
    const ty = u(-1000, 1000);
    vertices = vertices.map(([x, y]) => [tx + x * Math.cos(th) - y * Math.sin(th), ty + x * Math.sin(th) + y * Math.cos(th)]);
    if (rng() < 0.5) {
      const n = vertices.length;
      vertices = vertices.slice().reverse();
      lotLines = lotLines.map((_, i) => lotLines[(((n - 2 - i) % n) + n) % n]!);
    }
    const input: { -readonly [K in keyof MassingInput]: MassingInput[K] } = {
      parcel: { vertices, lotLines },
      setbacks: { front: u(0, 8), side: u(0, 5), rear: u(0, 10), ...(rng() < 0.5 ? { street: u(0, 6) } : {}) },
      floorHeight: u(2.8, 4.5),
      maxHeight: u(2, 90),
    };
    if (rng() < 0.6) input.maxFar = u(0.3, 8);
    if (rng() < 0.5) input.maxCoverage = u(0.15, 1);
    if (rng() < 0.5) input.skyPlane = { startHeight: u(0, 40), ratio: u(0.5, 6) };
    if (rng() < 0.35) input.minPlateWidth = u(0, 15);
    if (rng() < 0.35) input.minPlateArea = u(0, 400);
    cases.push(input);
  }
  return cases;
}
