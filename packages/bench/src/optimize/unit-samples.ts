import seedrandom from "seedrandom";
import { createDesign } from "@floorcast/sampler";

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
 * Points of the unit cube from @floorcast/sampler's createDesign: independent uniform ("random")
 * or a random Latin hypercube ("lhs"; McKay, Beckman & Conover 1979), seeded by the next draw of
 * `rng` so that a run stays one deterministic stream.
 * @param n - number of points (0 gives none).
 * @param dims - dimension.
 * @param design - "random" or "lhs".
 * @param rng - seeded generator.
 * @returns n rows of dims coordinates in [0, 1).
 */
export function unitSamples(n: number, dims: number, design: "random" | "lhs", rng: Rng): number[][] {
  const seed = Math.floor(rng() * 2 ** 32);
  return n === 0 ? [] : createDesign({ n, dims, design, seed });
}
