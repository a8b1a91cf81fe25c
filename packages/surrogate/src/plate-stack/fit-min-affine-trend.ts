import seedrandom from "seedrandom";
import type { MinAffineTrend } from "../predict/min-affine-trend.js";
import { minAffineAt } from "../predict/min-affine-trend.js";
import { shuffleInPlace } from "../seeded-shuffle.js";

/** Options of {@link fitMinAffineTrend}. */
export interface MinAffineTrendOptions {
  /** Most affine pieces tried (default 4); the count is chosen by 5-fold cross-validation among 1..maxPieces. */
  readonly maxPieces?: number;
  /** Random starts of the partition iteration per piece count (default 10). */
  readonly starts?: number;
  /** Seed of the starts and the folds (default 0). */
  readonly seed?: number;
}

const FN = "fitMinAffineTrend";
const MAX_ITERATIONS = 50;
const FOLDS = 5;
/** Ridge on the slopes (× rows), unit-cube units: keeps a piece's normal equations solvable on collinear rows or a constant input, with a bias far below round-off of the fitted values (derived). */
const RIDGE = 1e-12;

/** Solves the small dense system A z = b in place (Gaussian elimination with partial pivoting). */
function solve(a: number[][], b: number[]): number[] {
  const n = b.length;
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[p]![c]!)) p = r;
    [a[c], a[p]] = [a[p]!, a[c]!];
    [b[c], b[p]] = [b[p]!, b[c]!];
    const piv = a[c]![c]! === 0 ? 1e-300 : a[c]![c]!;
    for (let r = c + 1; r < n; r++) {
      const f = a[r]![c]! / piv;
      if (f === 0) continue;
      for (let k = c; k < n; k++) a[r]![k]! -= f * a[c]![k]!;
      b[r]! -= f * b[c]!;
    }
  }
  const z = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]!;
    for (let k = r + 1; k < n; k++) s -= a[r]![k]! * z[k]!;
    z[r] = a[r]![r]! === 0 ? 0 : s / a[r]![r]!;
  }
  return z;
}

/** Least-squares affine fit on the rows idx (intercept first). */
function affine(x: readonly number[][], y: readonly number[], idx: readonly number[]): number[] {
  const d = x[0]!.length + 1;
  const a = Array.from({ length: d }, () => new Array<number>(d).fill(0));
  const b = new Array<number>(d).fill(0);
  const z = new Array<number>(d);
  for (const i of idx) {
    z[0] = 1;
    for (let j = 1; j < d; j++) z[j] = x[i]![j - 1]!;
    for (let p = 0; p < d; p++) {
      b[p]! += z[p]! * y[i]!;
      for (let q = 0; q < d; q++) a[p]![q]! += z[p]! * z[q]!;
    }
  }
  for (let p = 1; p < d; p++) a[p]![p]! += RIDGE * idx.length;
  return solve(a, b);
}

function argminPiece(pieces: readonly number[][], row: readonly number[]): number {
  let best = 0;
  let bv = Infinity;
  pieces.forEach((p, k) => {
    const v = minAffineAt({ pieces: [p] }, row);
    if (v < bv) {
      bv = v;
      best = k;
    }
  });
  return best;
}

/** Least-squares partition iteration from random centres, best of `starts` (Magnani & Boyd 2009, §3). */
function fitPieces(x: readonly number[][], y: readonly number[], rows: readonly number[], k: number, starts: number, rng: () => number): number[][] {
  const d = x[0]!.length;
  let best: { pieces: number[][]; sse: number } | undefined;
  for (let s = 0; s < starts; s++) {
    const centres = Array.from({ length: k }, () => x[rows[Math.floor(rng() * rows.length)]!]!);
    let assign = rows.map((i) => {
      let c = 0;
      let cd = Infinity;
      centres.forEach((ctr, j) => {
        const dist = ctr.reduce((t, v, m) => t + (v - x[i]![m]!) ** 2, 0);
        if (dist < cd) {
          cd = dist;
          c = j;
        }
      });
      return c;
    });
    let pieces: number[][] = [];
    for (let it = 0; it < MAX_ITERATIONS; it++) {
      const groups = Array.from({ length: k }, () => [] as number[]);
      assign.forEach((c, r) => groups[c]!.push(rows[r]!));
      pieces = groups.filter((g) => g.length >= d + 2).map((g) => affine(x, y, g));
      if (pieces.length === 0) pieces = [affine(x, y, rows)];
      const next = rows.map((i) => argminPiece(pieces, x[i]!));
      const stable = next.every((c, r) => c === assign[r]);
      assign = next;
      if (stable) break;
    }
    const sse = rows.reduce((t, i) => t + (minAffineAt({ pieces }, x[i]!) - y[i]!) ** 2, 0);
    if (best === undefined || sse < best.sse) best = { pieces, sse };
  }
  return best!.pieces;
}

/**
 * Fits a trend that is the least of a few affine functions, t(x) = min_k (b_k + a_k · x), to one quantity by least
 * squares: the partition iteration of Magnani & Boyd (2009), "Convex piecewise-linear fitting", Optim. Eng. 10,
 * §3 (here for the concave form, a min of affine pieces), from seeded random starts, on inputs scaled to the unit
 * cube. The number of pieces is the one among 1..maxPieces with the least 5-fold cross-validated squared error.
 * Used for the plate widths of a plate stack (a plate's least width is a min over its edge directions of smooth
 * extents; see MinAffineTrend).
 * @param x - rows × inputs, original units (at least 2 rows).
 * @param y - one value per row.
 * @param options - most pieces, starts, seed.
 * @returns the trend, pieces in the original input units.
 * @throws TypeError when x, y or options have the wrong type; RangeError naming the field for mismatched or
 *   non-finite data or bad options.
 */
export function fitMinAffineTrend(x: readonly (readonly number[])[], y: readonly number[], options: MinAffineTrendOptions = {}): MinAffineTrend {
  if (!Array.isArray(x) || !Array.isArray(y) || !x.every((r) => Array.isArray(r))) throw new TypeError(`${FN}: x must be an array of rows and y an array`);
  if (typeof options !== "object" || options === null) throw new TypeError(`${FN}: options must be an object`);
  const n = x.length;
  if (n < 2 || y.length !== n) throw new RangeError(`${FN}: x and y must have the same number of rows (≥ 2), got ${n} and ${y.length}`);
  const d = x[0]!.length;
  if (!x.every((r) => r.length === d && r.every(Number.isFinite)) || !y.every(Number.isFinite)) {
    throw new RangeError(`${FN}: x must be rows of ${d} finite numbers and y finite numbers`);
  }
  const maxPieces = options.maxPieces ?? 4;
  const starts = options.starts ?? 10;
  if (!Number.isInteger(maxPieces) || maxPieces < 1) throw new RangeError(`${FN}: options.maxPieces must be an integer ≥ 1, got ${maxPieces}`);
  if (!Number.isInteger(starts) || starts < 1) throw new RangeError(`${FN}: options.starts must be an integer ≥ 1, got ${starts}`);
  const seed = options.seed ?? 0;
  const lower = Array.from({ length: d }, (_, j) => Math.min(...x.map((r) => r[j]!)));
  const span = Array.from({ length: d }, (_, j) => Math.max(...x.map((r) => r[j]!)) - lower[j]! || 1);
  const u = x.map((r) => r.map((v, j) => (v - lower[j]!) / span[j]!));
  const all = Array.from({ length: n }, (_, i) => i);
  const order = [...all];
  shuffleInPlace(order, seedrandom(`min-affine-folds-${seed}`));
  let chosen = 1;
  let bestCv = Infinity;
  // more pieces than the rows can fit (d + 2 rows each, in every fold) are not tried
  const most = Math.max(1, Math.min(maxPieces, Math.floor((n * (1 - 1 / FOLDS)) / (d + 2))));
  for (let k = 1; k <= most; k++) {
    const rng = seedrandom(`min-affine-${seed}-${k}`);
    let sse = 0;
    for (let f = 0; f < FOLDS; f++) {
      const held = order.filter((_, r) => r % FOLDS === f);
      const fit = order.filter((_, r) => r % FOLDS !== f);
      const pieces = fitPieces(u, y, fit, k, starts, rng);
      sse += held.reduce((t, i) => t + (minAffineAt({ pieces }, u[i]!) - y[i]!) ** 2, 0);
    }
    if (sse < bestCv * (1 - 1e-9)) {
      bestCv = sse;
      chosen = k;
    }
  }
  const pieces = fitPieces(u, y, all, chosen, starts, seedrandom(`min-affine-${seed}-all`));
  // back to original units: b + Σ a_j (x_j − lo_j)/span_j
  return {
    pieces: pieces.map((p) => {
      const slopes = p.slice(1).map((a, j) => a / span[j]!);
      return [p[0]! - slopes.reduce((t, a, j) => t + a * lower[j]!, 0), ...slopes];
    }),
  };
}
