/**
 * The Morris–Mitchell (1995) sum S = Σ_{i<j} d_ij^(−p) (Euclidean d) of a design, kept up to date under
 * exchanges of two elements of one column in O(n) time: only the distances from the two rows change.
 * Distances are measured in units of 1/n (a stratum width), so for Latin designs the terms stay in range;
 * φp itself is (S)^(1/p) / n.
 *
 * Squared distances and terms are stored in n×n matrices up to `matrixLimit` points (default 3,000) and
 * recomputed from the coordinates (O(n·d) per exchange, still linear in n) above it.
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
    matrixLimit = MATRIX_LIMIT,
  ) {
    const n = points.length;
    this.n = n;
    this.x = new Float64Array(n * dims);
    points.forEach((row, i) => row.forEach((v, k) => (this.x[k * n + i] = v * n)));
    this.half = p / 2;
    this.intHalf = Number.isInteger(this.half) && this.half > 0 && this.half <= 64;
    this.scratch = [new Float64Array(2 * n), new Float64Array(2 * n)];
    const keep = n <= matrixLimit;
    this.d2 = keep ? new Float64Array(n * n) : undefined;
    this.tm = keep ? new Float64Array(n * n) : undefined;
    this.sum = 0;
    this.sum = this.recompute();
  }

  readonly n: number;

  /** The current sum S (in stratum units). */
  get total(): number {
    return this.sum;
  }

  /** φp of the current design in unit-cube distances. */
  phi(sum = this.sum): number {
    return Math.pow(sum, 1 / this.p) * this.n;
  }

  /**
   * Re-sums S from the stored terms (O(n²), no distances), removing the drift of many incremental
   * updates; without matrices it does nothing (call recompute(), O(n²·d), now and then instead).
   */
  resum(): number {
    if (this.tm === undefined) return this.sum;
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
    const x = this.x;
    const c = k * n;
    const xa = x[c + a] as number;
    const xb = x[c + b] as number;
    // Rows a and b of the squared distances (dm) and terms (tv), at offsets oa and ob; no allocation.
    let dm: Float64Array;
    let tv: Float64Array;
    let oa: number;
    let ob: number;
    if (this.d2 !== undefined && this.tm !== undefined) {
      dm = this.d2;
      tv = this.tm;
      oa = a * n;
      ob = b * n;
    } else {
      dm = this.scratch[0] as Float64Array;
      tv = this.scratch[1] as Float64Array;
      this.fillRows(a, b, dm, tv);
      oa = 0;
      ob = n;
    }
    const h = this.intHalf ? this.half : -this.half;
    let delta = 0;
    if (h === 25) {
      // The default p = 50, unrolled: one division gives both reciprocals.
      for (let j = 0; j < n; j++) {
        if (j === a || j === b) continue; // the a–b distance does not change
        const xj = x[c + j] as number;
        const ea = (xa - xj) * (xa - xj);
        const eb = (xb - xj) * (xb - xj);
        let qa = (dm[oa + j] as number) - ea + eb;
        let qb = (dm[ob + j] as number) - eb + ea;
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
        delta += ra8 * ra8 * ra8 * ra + rb8 * rb8 * rb8 * rb - (tv[oa + j] as number) - (tv[ob + j] as number);
      }
      return this.sum + delta;
    }
    for (let j = 0; j < n; j++) {
      if (j === a || j === b) continue; // the a–b distance does not change
      const xj = x[c + j] as number;
      const ea = (xa - xj) * (xa - xj);
      const eb = (xb - xj) * (xb - xj);
      delta += powNeg((dm[oa + j] as number) - ea + eb, h) - (tv[oa + j] as number);
      delta += powNeg((dm[ob + j] as number) - eb + ea, h) - (tv[ob + j] as number);
    }
    return this.sum + delta;
  }

  /**
   * Exchanges column k of rows a and b and sets S to `newSum` (from sumAfterExchange). O(n).
   * Note: a candidate sum S + Δ carries an absolute error of about n·ε·S, so when S + Δ ≪ S its relative
   * error grows as S / (S + Δ); ranking candidates is unaffected, and the re-sum below restores accuracy.
   */
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
    // A large drop (the closest pair broken up) leaves S with the absolute rounding error of the old, larger
    // sum: re-sum then (rare; O(n²), or O(n²·d) without matrices), so the current S stays accurate.
    const drop = newSum < this.sum * 1e-3;
    this.sum = newSum;
    if (drop) {
      if (this.tm !== undefined) this.resum();
      else this.recompute();
    }
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

  /** Without matrices: rows a (at 0) and b (at n) of the squared distances and terms. */
  private fillRows(a: number, b: number, dm: Float64Array, tv: Float64Array): void {
    const n = this.n;
    for (let j = 0; j < n; j++) {
      const qa = j === a ? 0 : this.dist2(a, j);
      const qb = j === b ? 0 : this.dist2(b, j);
      dm[j] = qa;
      dm[n + j] = qb;
      tv[j] = this.term(qa);
      tv[n + j] = this.term(qb);
    }
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
