import type { SeededRandom } from "./check-design-args.js";

/** Options of polishCentredDiscrepancy. */
export interface CentredDiscrepancyPolishOptions {
  /** Exchanges tried (default 120 · n). */
  readonly exchanges?: number;
  /** Least pairwise distance every accepted design keeps (default: 0.7 × the start's minimum distance). */
  readonly minDistanceFloor?: number;
  /** Keep the n × n pair products (default: when n ≤ 4,000); without them each exchange recomputes O(n·d). */
  readonly pairMatrix?: boolean;
}

/** What polishCentredDiscrepancy returns. */
export interface CentredDiscrepancyPolishResult {
  readonly points: number[][];
  /** Squared centred L2 discrepancy before and after (Hickernell 1998; as scipy.stats.qmc.discrepancy "CD"). */
  readonly cdStart: number;
  readonly cdEnd: number;
  readonly accepted: number;
  /** The floor on the minimum pairwise distance that was kept. */
  readonly minDistanceFloor: number;
}

/** Pairwise product matrices are kept up to this n (n² doubles: 128 MB at 4,000); above it, rows are recomputed. */
const MATRIX_LIMIT = 4000;

/**
 * Lowers the centred L2 discrepancy of a design by exchanging two elements of one column at a time
 * (which keeps a Latin hypercube Latin), accepting an exchange only when it lowers the discrepancy and
 * every pairwise distance of the two moved points stays at or above a floor. A greedy exchange search in
 * the spirit of the column-exchange polish of Jin, Chen & Sudjianto (2005), on Hickernell's (1998)
 * criterion: CD² = (13/12)^d − (2/n) Σᵢ Πₖ (1 + ½|zᵢₖ| − ½zᵢₖ²) + (1/n²) Σᵢⱼ Πₖ (1 + ½|zᵢₖ| + ½|zⱼₖ| − ½|xᵢₖ − xⱼₖ|),
 * zᵢₖ = xᵢₖ − ½, updated in O(n) per exchange with the row and pair products kept.
 * @param start - the design to polish (unit cube rows; not modified).
 * @param rng - seeded generator.
 * @param options - exchanges and distance floor.
 * @returns the polished design and its discrepancy before and after.
 */
export function polishCentredDiscrepancy(
  start: readonly (readonly number[])[],
  rng: SeededRandom,
  options: CentredDiscrepancyPolishOptions = {},
): CentredDiscrepancyPolishResult {
  const n = start.length;
  const d = n > 0 ? start[0]!.length : 0;
  const x = new Float64Array(n * d);
  start.forEach((row, i) => row.forEach((v, k) => (x[i * d + k] = v)));
  const floor = options.minDistanceFloor ?? 0.7 * Math.sqrt(minSquaredDistance(x, n, d));
  const floor2 = floor * floor;
  const f1 = (v: number): number => {
    const z = Math.abs(v - 0.5);
    return 1 + 0.5 * z - 0.5 * z * z;
  };
  const f2 = (u: number, v: number): number => 1 + 0.5 * Math.abs(u - 0.5) + 0.5 * Math.abs(v - 0.5) - 0.5 * Math.abs(u - v);
  const rowProduct = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let p = 1;
    for (let k = 0; k < d; k++) p *= f1(x[i * d + k]!);
    rowProduct[i] = p;
  }
  const keep = options.pairMatrix ?? n <= MATRIX_LIMIT;
  const pair = keep ? new Float64Array(n * n) : new Float64Array(0);
  const pairOf = (i: number, j: number): number => {
    if (keep) return pair[i * n + j]!;
    let q = 1;
    for (let k = 0; k < d; k++) q *= f2(x[i * d + k]!, x[j * d + k]!);
    return q;
  };
  if (keep) {
    for (let i = 0; i < n; i++) {
      for (let j = i; j < n; j++) {
        let q = 1;
        for (let k = 0; k < d; k++) q *= f2(x[i * d + k]!, x[j * d + k]!);
        pair[i * n + j] = q;
        pair[j * n + i] = q;
      }
    }
  }
  let s1 = 0;
  let s2 = 0;
  for (let i = 0; i < n; i++) {
    s1 += rowProduct[i]!;
    for (let j = 0; j < n; j++) s2 += pairOf(i, j);
  }
  const cdOf = (a: number, b: number): number => (13 / 12) ** d - (2 / n) * a + b / (n * n);
  const cdStart = n > 0 ? cdOf(s1, s2) : 0;
  const exchanges = options.exchanges ?? 120 * n;
  const new1 = new Float64Array(n);
  const new2 = new Float64Array(n);
  let accepted = 0;
  for (let t = 0; t < exchanges && n >= 2 && d >= 1; t++) {
    const k = Math.floor(rng() * d);
    const i1 = Math.floor(rng() * n);
    let i2 = Math.floor(rng() * (n - 1));
    if (i2 >= i1) i2++;
    const u1 = x[i1 * d + k]!;
    const u2 = x[i2 * d + k]!;
    if (u1 === u2) continue;
    const a1 = (rowProduct[i1]! / f1(u1)) * f1(u2);
    const a2 = (rowProduct[i2]! / f1(u2)) * f1(u1);
    let dS2 = 0;
    for (let j = 0; j < n; j++) {
      if (j === i1 || j === i2) continue;
      const v = x[j * d + k]!;
      const p1 = pairOf(i1, j);
      const p2 = pairOf(i2, j);
      new1[j] = (p1 / f2(u1, v)) * f2(u2, v);
      new2[j] = (p2 / f2(u2, v)) * f2(u1, v);
      dS2 += 2 * (new1[j]! - p1 + new2[j]! - p2);
    }
    const d1 = (pairOf(i1, i1) / f2(u1, u1)) * f2(u2, u2);
    const d2 = (pairOf(i2, i2) / f2(u2, u2)) * f2(u1, u1);
    dS2 += d1 - pairOf(i1, i1) + d2 - pairOf(i2, i2); // the (i1, i2) pair product is unchanged by the swap
    const dS1 = a1 - rowProduct[i1]! + a2 - rowProduct[i2]!;
    if ((-2 / n) * dS1 + dS2 / (n * n) >= 0) continue;
    x[i1 * d + k] = u2;
    x[i2 * d + k] = u1;
    if (!keepsFloor(x, n, d, i1, i2, floor2)) {
      x[i1 * d + k] = u1;
      x[i2 * d + k] = u2;
      continue;
    }
    rowProduct[i1] = a1;
    rowProduct[i2] = a2;
    if (keep) {
      for (let j = 0; j < n; j++) {
        if (j === i1 || j === i2) continue;
        pair[i1 * n + j] = pair[j * n + i1] = new1[j]!;
        pair[i2 * n + j] = pair[j * n + i2] = new2[j]!;
      }
      pair[i1 * n + i1] = d1;
      pair[i2 * n + i2] = d2;
    }
    s1 += dS1;
    s2 += dS2;
    accepted++;
  }
  const points = Array.from({ length: n }, (_, i) => Array.from(x.subarray(i * d, (i + 1) * d)));
  return { points, cdStart, cdEnd: n > 0 ? cdOf(s1, s2) : 0, accepted, minDistanceFloor: floor };
}

/** Whether rows i1 and i2 are at least √floor2 from every other row. */
function keepsFloor(x: Float64Array, n: number, d: number, i1: number, i2: number, floor2: number): boolean {
  for (let j = 0; j < n; j++) {
    if ((j !== i1 && squaredDistance(x, d, i1, j) < floor2) || (j !== i2 && squaredDistance(x, d, i2, j) < floor2)) return false;
  }
  return true;
}

/** Squared distance between rows i and j. */
function squaredDistance(x: Float64Array, d: number, i: number, j: number): number {
  let s = 0;
  for (let k = 0; k < d; k++) {
    const t = x[i * d + k]! - x[j * d + k]!;
    s += t * t;
  }
  return s;
}

/** The least squared pairwise distance of n rows (Infinity for fewer than 2). */
function minSquaredDistance(x: Float64Array, n: number, d: number): number {
  let best = Infinity;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) best = Math.min(best, squaredDistance(x, d, i, j));
  }
  return best;
}
