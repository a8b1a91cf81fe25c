import type { SeededRandom } from "./check-design-args.js";

/**
 * Independent uniform points in the unit cube (the plain Monte Carlo design).
 * @param n - number of points. @param d - dimensions. @param rng - seeded generator.
 * @returns n rows of d coordinates in [0, 1).
 */
export function randomDesign(n: number, d: number, rng: SeededRandom): number[][] {
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(d);
    for (let k = 0; k < d; k++) row[k] = rng();
    rows.push(row);
  }
  return rows;
}
