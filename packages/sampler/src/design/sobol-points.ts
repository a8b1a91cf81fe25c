import { checkCount, seededRandom } from "./check-design-args.js";
import { SOBOL_MAX_DIMS, sobolSequence } from "./sobol-sequence.js";

/**
 * The first n Sobol' points in [0, 1)^d (Joe & Kuo 2008 direction numbers, 30 bits, Gray-code order).
 * Without a seed: the plain sequence from the origin, identical to
 * scipy.stats.qmc.Sobol(d, scramble=False).random(n). With a seed: scrambled by a seeded linear matrix
 * scramble and digital shift (Matoušek 1998), as createDesign's "sobol" design.
 * @param n - number of points, 1 … 2^30 (powers of 2 keep the balance properties).
 * @param d - dimensions, 1 … SOBOL_MAX_DIMS.
 * @param options - `seed` to scramble.
 * @returns n rows of d coordinates.
 * @throws TypeError/RangeError naming the bad field.
 */
export function sobolPoints(n: number, d: number, options: { readonly seed?: number | string } = {}): number[][] {
  const fn = "sobolPoints";
  checkCount(fn, "n", n);
  checkCount(fn, "d", d);
  if (n > 2 ** 30) throw new RangeError(`${fn}: n must be ≤ 2^30, got ${n}`);
  if (d > SOBOL_MAX_DIMS) throw new RangeError(`${fn}: d must be ≤ ${SOBOL_MAX_DIMS}, got ${d}`);
  const rng = options.seed === undefined ? undefined : seededRandom(fn, options.seed);
  return sobolSequence(n, d, rng);
}
