import { checkCount, checkPoints, seededRandom } from "./check-design-args.js";

/** Arguments of extendDesign. */
export interface ExtendDesignOptions {
  /** Seed of the candidate draws (through seedrandom). */
  readonly seed: number | string;
  /** Candidate points drawn per new point (default 50; at least 1,000 candidates in all, at most 100,000). */
  readonly candidatesPerPoint?: number;
}

/**
 * New points that extend an existing unit-cube design while keeping it space filling, by greedy maximin
 * (sequential "coffee-house" design, Kennard & Stone 1969): from a seeded set of uniform candidates, add
 * one at a time the candidate farthest from every point kept so far (old and new). The old points are
 * never moved. Chosen over re-running ESE on the new points because it needs no Latin structure (the old
 * design may be anything, e.g. Sobol' or a user's points) and costs O(C·(N + m)·d) for C candidates.
 * @param existing - the current design: at least one row of coordinates in [0, 1].
 * @param m - number of points to add, an integer ≥ 1.
 * @returns the m new rows only.
 * @throws TypeError/RangeError naming the bad field.
 */
export function extendDesign(
  existing: readonly (readonly number[])[],
  m: number,
  options: ExtendDesignOptions,
): number[][] {
  const fn = "extendDesign";
  const d = checkPoints(fn, existing, true);
  if (existing.length === 0) throw new RangeError(`${fn}: existing must hold at least one point`);
  checkCount(fn, "m", m);
  if (typeof options !== "object" || options === null) throw new TypeError(`${fn}: options must be an object`);
  const rng = seededRandom(fn, options.seed);
  const per = options.candidatesPerPoint === undefined ? 50 : checkCount(fn, "candidatesPerPoint", options.candidatesPerPoint);
  const c = Math.max(m, Math.min(100_000, Math.max(1000, per * m)));
  const cand = new Float64Array(c * d);
  for (let i = 0; i < cand.length; i++) cand[i] = rng();
  const nearest = new Float64Array(c).fill(Infinity);
  const used = new Uint8Array(c);
  const lower = (point: ArrayLike<number>, offset: number): void => {
    for (let i = 0; i < c; i++) {
      if (used[i] === 1) continue;
      let s = 0;
      for (let k = 0; k < d; k++) {
        const t = (cand[i * d + k] as number) - (point[offset + k] as number);
        s += t * t;
      }
      if (s < (nearest[i] as number)) nearest[i] = s;
    }
  };
  for (const row of existing) lower(row, 0);
  const added: number[][] = [];
  for (let t = 0; t < m; t++) {
    let pick = -1;
    let far = -1;
    for (let i = 0; i < c; i++) {
      if (used[i] === 0 && (nearest[i] as number) > far) {
        far = nearest[i] as number;
        pick = i;
      }
    }
    used[pick] = 1;
    added.push(Array.from(cand.subarray(pick * d, (pick + 1) * d)));
    lower(cand, pick * d);
  }
  return added;
}
