import seedrandom from "seedrandom";
import { standardNormal } from "../trust/standard-normal.js";

const PRIMES = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29];

/** Radical inverse of i in base b (van der Corput; Halton 1960). */
function radicalInverse(i: number, b: number): number {
  let f = 1;
  let r = 0;
  for (let k = i; k > 0; k = Math.floor(k / b)) {
    f /= b;
    r += f * (k % b);
  }
  return r;
}

/**
 * Quasi-Monte Carlo standard-normal draws: the first `count` points of the Halton sequence (Halton 1960) in `dims`
 * dimensions, shifted modulo 1 by one seeded uniform vector (Cranley & Patterson 1976) and mapped through the
 * standard normal quantile Φ⁻¹.
 * @param count - number of draws, ≥ 1.
 * @param dims - dimensions, 1..10.
 * @param seed - seed of the shift (seedrandom).
 * @returns count × dims standard-normal values.
 */
export function qmcNormalDraws(count: number, dims: number, seed: number): number[][] {
  if (!Number.isInteger(count) || count < 1) throw new RangeError(`qmcNormalDraws: count must be an integer ≥ 1, got ${count}`);
  if (!Number.isInteger(dims) || dims < 1 || dims > PRIMES.length) {
    throw new RangeError(`qmcNormalDraws: dims must be an integer in [1, ${PRIMES.length}], got ${dims}`);
  }
  const rng = seedrandom(`qmc-normal-${seed}`);
  const shift = Array.from({ length: dims }, () => rng());
  return Array.from({ length: count }, (_, i) =>
    shift.map((s, j) => {
      const u = (radicalInverse(i + 1, PRIMES[j]!) + s) % 1;
      return standardNormal.quantile(Math.min(1 - 1e-12, Math.max(1e-12, u)));
    }),
  );
}
