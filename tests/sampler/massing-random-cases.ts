import seedrandom from "seedrandom";
import { quadParcel } from "@floorcast/sampler";
import type { LotLine, MassingInput, Point } from "@floorcast/sampler";

/** Seeded random massing inputs on random convex parcels (helper of the massing tests). */
export function randomMassingCases(count: number, seed: string): MassingInput[] {
  const rng = seedrandom(seed);
  const u = (lo: number, hi: number): number => lo + (hi - lo) * rng();
  const cases: MassingInput[] = [];
  while (cases.length < count) {
    let vertices: Point[];
    let lotLines: LotLine[];
    if (rng() < 0.3) {
      const p = quadParcel({
        frontage: u(10, 50),
        depth: u(15, 60),
        rearWidth: u(8, 50),
        skew: u(-25, 25),
        corner: rng() < 0.33 ? "left" : rng() < 0.5 ? "right" : "none",
      });
      vertices = p.vertices.map((v) => [v[0], v[1]] as Point);
      lotLines = [...p.lotLines];
    } else {
      const n = 3 + Math.floor(rng() * 6);
      const angles = Array.from({ length: n }, () => u(0, 2 * Math.PI)).sort((a, b) => a - b);
      const ax = u(12, 60);
      const by = u(12, 60);
      vertices = angles.map((t) => [ax * Math.cos(t), by * Math.sin(t)] as Point);
      const tooShort = vertices.some((v, i) => {
        const w = vertices[(i + 1) % n]!;
        return Math.hypot(w[0] - v[0], w[1] - v[1]) < 1;
      });
      if (tooShort) continue;
      const front = Math.floor(rng() * n);
      lotLines = vertices.map(() => "side" as LotLine);
      lotLines[front] = "front";
      if (n >= 4) lotLines[(front + Math.floor(n / 2)) % n] = "rear";
      if (rng() < 0.3) lotLines[(front + 1) % n] = "street";
    }
    // Rotate, translate and sometimes reverse the orientation (lot lines follow their edges).
    const th = u(0, 2 * Math.PI);
    const tx = u(-1000, 1000);
    const ty = u(-1000, 1000);
    vertices = vertices.map(([x, y]) => [tx + x * Math.cos(th) - y * Math.sin(th), ty + x * Math.sin(th) + y * Math.cos(th)]);
    if (rng() < 0.5) {
      const n = vertices.length;
      vertices = vertices.slice().reverse();
      lotLines = lotLines.map((_, i) => lotLines[(((n - 2 - i) % n) + n) % n]!);
    }
    const input: {
      -readonly [K in keyof MassingInput]: MassingInput[K];
    } = {
      parcel: { vertices, lotLines },
      setbacks: { front: u(0, 8), side: u(0, 5), rear: u(0, 10), ...(rng() < 0.5 ? { street: u(0, 6) } : {}) },
      floorHeight: u(2.8, 4.5),
      maxHeight: u(2, 90),
    };
    if (rng() < 0.6) input.maxFar = u(0.3, 8);
    if (rng() < 0.5) input.maxCoverage = u(0.15, 1);
    if (rng() < 0.5) input.skyPlane = { startHeight: u(0, 40), ratio: u(0.5, 6) };
    if (rng() < 0.35) input.minPlateWidth = u(0, 25);
    if (rng() < 0.35) input.minPlateArea = u(0, 700);
    cases.push(input);
  }
  return cases;
}
