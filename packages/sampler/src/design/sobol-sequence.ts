import type { SeededRandom } from "./check-design-args.js";
import { SOBOL_DIRECTION_NUMBERS } from "./sobol-direction-numbers.js";

/** Bits per coordinate, as scipy.stats.qmc.Sobol's default (points are k / 2^30). */
const BITS = 30;

/** The largest dimension with checked direction numbers. */
export const SOBOL_MAX_DIMS = SOBOL_DIRECTION_NUMBERS.length + 1;

/**
 * The first n points of the Sobol' (1967) sequence in Gray-code order (Antonov & Saleev 1979), with the
 * Joe & Kuo (2008) direction numbers and 30 bits, starting at the origin, exactly as
 * scipy.stats.qmc.Sobol(d, scramble=False).random(n). With `rng`, the sequence is scrambled as scipy does
 * it, with its own draws: a random lower-triangular binary matrix with unit diagonal per dimension
 * applied to the direction numbers (Matoušek's 1998 linear matrix scramble, a restricted form of Owen's
 * 1995 scrambling) followed by a random digital shift (XOR). Both keep the (t, m, s)-net property: for
 * n = 2^m each of the 2^m intervals [k/2^m, (k+1)/2^m) of every coordinate holds exactly one point.
 * @param n - number of points (≤ 2^30). @param d - dimensions (1 … SOBOL_MAX_DIMS).
 * @param rng - seeded generator; omit for the unscrambled sequence.
 * @returns n rows of d coordinates in [0, 1).
 */
export function sobolSequence(n: number, d: number, rng?: SeededRandom): number[][] {
  const next = sobolRowsFrom(0, d, rng);
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) rows.push(next());
  return rows;
}

/**
 * The points of sobolSequence(·, d, rng) from index `start` on, one per call, in O(d) memory: the scramble is drawn
 * first (as sobolSequence draws it), point `start` is built directly from the bits of its Gray code
 * g = start XOR (start >> 1) (x = shift XOR the direction integers of g's set bits; Antonov & Saleev 1979), and each
 * later point flips the direction integer of the lowest zero bit of its predecessor's index.
 * @param start - index of the first point (0 … 2^30 − 1). @param d - dimensions. @param rng - as for sobolSequence.
 * @returns a function giving point start, start + 1, … on successive calls.
 */
export function sobolRowsFrom(start: number, d: number, rng?: SeededRandom): () => number[] {
  const v = directionIntegers(d);
  const shift = new Uint32Array(d);
  if (rng !== undefined) {
    for (let k = 0; k < d; k++) v[k] = scrambleColumn(v[k] as Uint32Array, rng);
    for (let k = 0; k < d; k++) shift[k] = randomBits(rng);
  }
  const scale = 1 / 2 ** BITS;
  const quasi = Uint32Array.from(shift);
  const gray = (start ^ (start >>> 1)) >>> 0;
  for (let j = 0; j < BITS; j++) {
    if ((gray >>> j) & 1) for (let k = 0; k < d; k++) quasi[k] = ((quasi[k] as number) ^ ((v[k] as Uint32Array)[j] as number)) >>> 0;
  }
  let i = start;
  return () => {
    if (i > start) {
      const c = trailingZeros(i);
      for (let k = 0; k < d; k++) quasi[k] = ((quasi[k] as number) ^ ((v[k] as Uint32Array)[c] as number)) >>> 0;
    }
    i++;
    return Array.from(quasi, (q) => q * scale);
  };
}

/** v[k][j]: direction integer of bit j + 1 for dimension k, m_{j+1} · 2^(BITS − j − 1). */
function directionIntegers(d: number): Uint32Array[] {
  const v: Uint32Array[] = [];
  for (let k = 0; k < d; k++) {
    const m = new Array<number>(BITS).fill(1);
    if (k > 0) {
      const entry = SOBOL_DIRECTION_NUMBERS[k - 1] as readonly number[];
      const s = entry[0] as number;
      const a = entry[1] as number;
      for (let j = 0; j < s; j++) m[j] = entry[2 + j] as number;
      for (let j = s; j < BITS; j++) {
        let mj = (m[j - s] as number) ^ ((m[j - s] as number) << s);
        for (let t = 1; t < s; t++) {
          if ((a >> (s - 1 - t)) & 1) mj ^= (m[j - t] as number) << t;
        }
        m[j] = mj;
      }
    }
    v.push(Uint32Array.from(m, (mj, j) => mj * 2 ** (BITS - j - 1)));
  }
  return v;
}

/** Applies y = L·v to each direction integer, L random lower triangular (MSB first) with unit diagonal. */
function scrambleColumn(v: Uint32Array, rng: SeededRandom): Uint32Array {
  const rowsOfL = new Uint32Array(BITS);
  for (let r = 0; r < BITS; r++) {
    const own = 2 ** (BITS - 1 - r);
    const higher = (2 ** BITS - 2 * own) >>> 0; // bits more significant than `own`
    rowsOfL[r] = ((randomBits(rng) & higher) | own) >>> 0;
  }
  return v.map((x) => {
    let y = 0;
    for (let r = 0; r < BITS; r++) {
      if (parity(((rowsOfL[r] as number) & x) >>> 0)) y += 2 ** (BITS - 1 - r);
    }
    return y;
  });
}

function randomBits(rng: SeededRandom): number {
  return (rng.int32() >>> 0) & (2 ** BITS - 1);
}

function parity(x: number): boolean {
  let y = x ^ (x >>> 16);
  y ^= y >>> 8;
  y ^= y >>> 4;
  y ^= y >>> 2;
  y ^= y >>> 1;
  return (y & 1) === 1;
}

function trailingZeros(i: number): number {
  let c = 0;
  while ((i & 1) === 0) {
    i >>>= 1;
    c++;
  }
  return c;
}
