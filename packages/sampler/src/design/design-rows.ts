import { checkCount, seededRandom, type SeededRandom } from "./check-design-args.js";
import { createDesign, DESIGN_KINDS, type CreateDesignOptions } from "./create-design.js";
import { isStreamedDesign } from "./is-streamed-design.js";
import { SOBOL_MAX_DIMS, sobolRowsFrom } from "./sobol-sequence.js";

/** Options of {@link designRows}: those of createDesign plus the slice of rows wanted. */
export interface DesignRowsOptions extends CreateDesignOptions {
  /** First row wanted (default 0). */
  readonly start?: number;
  /** One past the last row wanted (default n). */
  readonly end?: number;
}

/**
 * Rows start … end − 1 of the design createDesign({ n, dims, design, seed }) returns, one at a time and the same
 * numbers. Streamed kinds (isStreamedDesign: "random", "sobol") are produced row by row in O(d) memory, so n may be
 * far larger than a design held whole (up to 2^30 for "sobol"); the other kinds are Latin or optimized over all n
 * rows, so they are computed whole first (createDesign's size limit applies) and each row is released once yielded.
 * @param options - createDesign's options (onProgress reports the optimization) plus start and end.
 * @returns an iterator of unit-cube rows.
 * @throws TypeError/RangeError naming the bad field (at the call for a streamed design's options, n, dims, start
 * and end; an optimized design's own settings when iteration starts).
 */
export function designRows(options: DesignRowsOptions): IterableIterator<number[]> {
  const fn = "designRows";
  if (typeof options !== "object" || options === null) throw new TypeError(`${fn}: options must be an object`);
  const n = checkCount(fn, "n", options.n);
  const dims = checkCount(fn, "dims", options.dims);
  const start = options.start === undefined ? 0 : checkCount(fn, "start", options.start, 0);
  const end = options.end === undefined ? n : checkCount(fn, "end", options.end, 0);
  if (!(start <= end && end <= n)) throw new RangeError(`${fn}: need 0 ≤ start ≤ end ≤ n = ${n}, got start ${start}, end ${end}`);
  if (!(DESIGN_KINDS as readonly string[]).includes(options.design)) {
    throw new RangeError(`${fn}: design must be one of ${DESIGN_KINDS.join(", ")}, got ${String(options.design)}`);
  }
  if (!isStreamedDesign(options.design)) return wholeDesignRows(options, start, end);
  const rng = seededRandom(fn, options.seed);
  if (options.design === "sobol") {
    if (dims > SOBOL_MAX_DIMS) throw new RangeError(`${fn}: dims must be ≤ ${SOBOL_MAX_DIMS} for "sobol", got ${dims}`);
    if (n > 2 ** 30) throw new RangeError(`${fn}: n must be ≤ 2^30 for "sobol", got ${n}`);
    return sobolRows(sobolRowsFrom(start, dims, rng), end - start);
  }
  return randomRows(rng, dims, start, end);
}

function* wholeDesignRows(options: CreateDesignOptions, start: number, end: number): Generator<number[], void, undefined> {
  const rows = createDesign(options);
  for (let i = start; i < end; i++) {
    const row = rows[i] as number[];
    rows[i] = RELEASED;
    yield row;
  }
}

function* sobolRows(next: () => number[], count: number): Generator<number[], void, undefined> {
  for (let i = 0; i < count; i++) yield next();
}

function* randomRows(rng: SeededRandom, dims: number, start: number, end: number): Generator<number[], void, undefined> {
  // "random": the draws of randomDesign, row after row; the rows before `start` are drawn and dropped.
  for (let i = 0; i < start * dims; i++) rng();
  for (let i = start; i < end; i++) {
    const row = new Array<number>(dims);
    for (let k = 0; k < dims; k++) row[k] = rng();
    yield row;
  }
}

/** Stands in for a row of a whole design once it has been yielded. */
const RELEASED: number[] = [];
