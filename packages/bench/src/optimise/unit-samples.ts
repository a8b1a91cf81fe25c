import seedrandom from "seedrandom";

/** A seeded uniform generator on [0, 1) (seedrandom's ARC4). */
export type Rng = () => number;

/**
 * A seeded generator from a user seed (seedrandom; default seed 0).
 * @param seed - number or string.
 */
export function createRng(seed: number | string | undefined): Rng {
  return seedrandom(String(seed ?? 0));
}

/**
 * Points of the unit cube, either independent uniform ("random") or a random Latin hypercube
 * ("lhs": each axis cut into n equal strata, one point per stratum, strata paired by random
 * permutations; McKay, Beckman & Conover 1979, Technometrics 21(2)).
 * @param n - number of points.
 * @param dims - dimension.
 * @param design - "random" or "lhs".
 * @param rng - seeded generator.
 * @returns n rows of dims coordinates in [0, 1).
 */
export function unitSamples(n: number, dims: number, design: "random" | "lhs", rng: Rng): number[][] {
  const rows = Array.from({ length: n }, () => new Array<number>(dims).fill(0));
  for (let j = 0; j < dims; j++) {
    const perm = Array.from({ length: n }, (_, i) => i);
    for (let i = n - 1; i > 0; i--) {
      const k = Math.floor(rng() * (i + 1));
      [perm[i], perm[k]] = [perm[k]!, perm[i]!];
    }
    for (let i = 0; i < n; i++) {
      rows[i]![j] = design === "lhs" ? (perm[i]! + rng()) / n : rng();
    }
  }
  return rows;
}
