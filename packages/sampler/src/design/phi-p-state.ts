/**
 * The Morris–Mitchell (1995) sum S = Σ_{i<j} d_ij^(−p) (Euclidean d) of a design, kept up to date under
 * exchanges of two elements of one column in O(n) time: only the distances from the two rows change.
 * Distances are measured in units of 1/n (a stratum width), so for Latin designs the terms stay in range;
 * φp itself is (S)^(1/p) / n.
 *
 * Squared distances are stored in an n×n matrix up to `MATRIX_LIMIT` points and recomputed from the
 * coordinates (O(n·d) per exchange, still linear in n) above it.
 */
export class PhiPState {
  /** Points in units of 1/n, column-major: x[k·n + i]. */
  private readonly x: Float64Array;
  /** Squared distances and their terms d^(−p), n × n, when n ≤ MATRIX_LIMIT. */
  private readonly d2: Float64Array | undefined;
  private readonly tm: Float64Array | undefined;
  private readonly half: number;
  private readonly intHalf: boolean;
  private sum: number;
  private readonly scratch: Float64Array[];

  constructor(
    points: readonly (readonly number[])[],
    readonly dims: number,
    readonly p: number,
  ) {
    const n = points.length;
    this.n = n;
    this.x = new Float64Array(n * dims);
    points.forEach((row, i) => row.forEach((v, k) => (this.x[k * n + i] = v * n)));
    this.half = p / 2;
    this.intHalf = Number.isInteger(this.half) && this.half > 0 && this.half <= 64;
    this.scratch = [0, 1, 2, 3].map(() => new Float64Array(n));
    const keep = n <= MATRIX_LIMIT;
    this.d2 = keep ? new Float64Array(n * n) : undefined;
    this.tm = keep ? new Float64Array(n * n) : undefined;
    this.sum = 0;
    this.sum = this.recompute();
  }

  readonly n: number;

  /** φp of the current design in unit-cube distances. */
  phi(sum = this.sum): number {
    return Math.pow(sum, 1 / this.p) * this.n;
  }

  /**
   * Re-sums S from the stored terms (O(n²), no distances), removing the drift of many incremental
   * updates; without matrices, the same as recompute().
   */
  resum(): number {
    if (this.tm === undefined) return this.recompute();
    const n = this.n;
    const t = this.tm;
    let s = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) s += t[i * n + j] as number;
    this.sum = s;
    return s;
  }

  /** Recomputes S (and the matrices) from scratch, removing drift from many updates. */
  recompute(): number {
    const n = this.n;
    let s = 0;
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) {
        const q = this.dist2(i, j);
        const t = this.term(q);
        if (this.d2 !== undefined && this.tm !== undefined) {
          this.d2[i * n + j] = q;
          this.d2[j * n + i] = q;
          this.tm[i * n + j] = t;
          this.tm[j * n + i] = t;
        }
        s += t;
      }
    }
    this.sum = s;
    return s;
  }

  /** The sum S after exchanging column k of rows a and b (the design is not changed). O(n). */
  sumAfterExchange(a: number, b: number, k: number): number {
    const n = this.n;
    const col = this.x.subarray(k * n, (k + 1) * n);
    const xa = col[a] as number;
    const xb = col[b] as number;
    const [da, db, ta, tb] = this.rows(a, b) as [Float64Array, Float64Array, Float64Array, Float64Array];
    const h = this.intHalf ? this.half : -this.half;
    let delta = 0;
    if (h === 25) {
      // The default p = 50, unrolled: one division gives both reciprocals.
      for (let j = 0; j < n; j++) {
        if (j === a || j === b) continue; // the a–b distance does not change
        const xj = col[j] as number;
        const ea = (xa - xj) * (xa - xj);
        const eb = (xb - xj) * (xb - xj);
        let qa = (da[j] as number) - ea + eb;
        let qb = (db[j] as number) - eb + ea;
        if (qa < TINY) qa = TINY;
        if (qb < TINY) qb = TINY;
        const inv = 1 / (qa * qb);
        const ra = qb * inv;
        const rb = qa * inv;
        const ra2 = ra * ra;
        const rb2 = rb * rb;
        const ra4 = ra2 * ra2;
        const rb4 = rb2 * rb2;
        const ra8 = ra4 * ra4;
        const rb8 = rb4 * rb4;
        delta += ra8 * ra8 * ra8 * ra - (ta[j] as number) + (rb8 * rb8 * rb8 * rb - (tb[j] as number));
      }
      return this.sum + delta;
    }
    for (let j = 0; j < n; j++) {
      if (j === a || j === b) continue; // the a–b distance does not change
      const xj = col[j] as number;
      const ea = (xa - xj) * (xa - xj);
      const eb = (xb - xj) * (xb - xj);
      delta += powNeg((da[j] as number) - ea + eb, h) - (ta[j] as number);
      delta += powNeg((db[j] as number) - eb + ea, h) - (tb[j] as number);
    }
    return this.sum + delta;
  }

  /** Exchanges column k of rows a and b and sets S to `newSum` (from sumAfterExchange). O(n). */
  exchange(a: number, b: number, k: number, newSum: number): void {
    const n = this.n;
    const col = this.x.subarray(k * n, (k + 1) * n);
    const xa = col[a] as number;
    const xb = col[b] as number;
    if (this.d2 !== undefined && this.tm !== undefined) {
      const m = this.d2;
      const t = this.tm;
      for (let j = 0; j < n; j++) {
        if (j === a || j === b) continue;
        const xj = col[j] as number;
        const ea = (xa - xj) * (xa - xj);
        const eb = (xb - xj) * (xb - xj);
        const na = (m[a * n + j] as number) - ea + eb;
        const nb = (m[b * n + j] as number) - eb + ea;
        const fa = this.term(na);
        const fb = this.term(nb);
        m[a * n + j] = na;
        m[j * n + a] = na;
        m[b * n + j] = nb;
        m[j * n + b] = nb;
        t[a * n + j] = fa;
        t[j * n + a] = fa;
        t[b * n + j] = fb;
        t[j * n + b] = fb;
      }
    }
    col[a] = xb;
    col[b] = xa;
    this.sum = newSum;
  }

  /** A copy of the current coordinates (stratum units, column-major), for points(). */
  snapshot(into?: Float64Array): Float64Array {
    const out = into ?? new Float64Array(this.x.length);
    out.set(this.x);
    return out;
  }

  /** The design (or a snapshot of it) in unit-cube coordinates. */
  points(from: Float64Array = this.x): number[][] {
    const n = this.n;
    return Array.from({ length: n }, (_, i) => Array.from({ length: this.dims }, (_, k) => (from[k * n + i] as number) / n));
  }

  /** Squared distances and terms from rows a and b to every row (own entries 0 / term(0)). */
  private rows(a: number, b: number): Float64Array[] {
    const n = this.n;
    if (this.d2 !== undefined && this.tm !== undefined) {
      return [a, b, a, b].map((r, i) => (i < 2 ? this.d2 : this.tm)!.subarray(r * n, (r + 1) * n));
    }
    const [da, db, ta, tb] = this.scratch as [Float64Array, Float64Array, Float64Array, Float64Array];
    for (let j = 0; j < n; j++) {
      const qa = j === a ? 0 : this.dist2(a, j);
      const qb = j === b ? 0 : this.dist2(b, j);
      da[j] = qa;
      db[j] = qb;
      ta[j] = this.term(qa);
      tb[j] = this.term(qb);
    }
    return [da, db, ta, tb];
  }

  private dist2(i: number, j: number): number {
    const n = this.n;
    let s = 0;
    for (let k = 0; k < this.dims; k++) {
      const t = (this.x[k * n + i] as number) - (this.x[k * n + j] as number);
      s += t * t;
    }
    return s;
  }

  /** d^(−p) from a squared distance, guarded against overflow for near-coincident points. */
  private term(q: number): number {
    return powNeg(q, this.intHalf ? this.half : -this.half);
  }
}

/**
 * q^(−h) for a squared distance q (floored at TINY). h > 0 is a whole exponent (repeated squaring;
 * h = 25, the default p = 50, is unrolled); h < 0 stands for the fractional exponent −h (Math.pow).
 */
function powNeg(q: number, h: number): number {
  const r = 1 / (q > TINY ? q : TINY);
  if (h === 25) {
    const r2 = r * r;
    const r4 = r2 * r2;
    const r8 = r4 * r4;
    return r8 * r8 * r8 * r;
  }
  if (h < 0) return Math.pow(r, -h);
  let e = h;
  let base = r;
  let acc = 1;
  while (e > 0) {
    if (e & 1) acc *= base;
    base *= base;
    e >>= 1;
  }
  return acc;
}

/** Up to this many points the squared distances and terms are kept in matrices (16·n² bytes). */
const MATRIX_LIMIT = 3000;
/** Smallest squared distance (in stratum units) used in a term; keeps d^(−p) finite (numerical guard). */
const TINY = 1e-12;
