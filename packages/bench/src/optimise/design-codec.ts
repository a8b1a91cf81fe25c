import type { Design, OptimisationProblem, OptimisationVariable } from "./optimisation-problem.js";

/**
 * The numeric coding the optimisers work in, built from a validated problem. A design is a
 * vector x with one entry per variable: a continuous value, an integer, or a categorical level
 * index. Lattice variables (integer, or continuous with a step) take min + k·step only.
 */
export interface DesignCodec {
  readonly variables: readonly OptimisationVariable[];
  readonly dims: number;
  /** Lower bound of each coordinate (0 for a categorical index). */
  readonly lower: readonly number[];
  /** Upper bound of each coordinate (the largest legal lattice value; levels − 1 for a categorical). */
  readonly upper: readonly number[];
  /** Lattice step per coordinate: 0 for plain continuous, step for stepped, 1 for integer and categorical. */
  readonly step: readonly number[];
  /** True where the coordinate is a categorical level index. */
  readonly categorical: readonly boolean[];
  /** Number of legal values per coordinate (Infinity for plain continuous). */
  readonly count: readonly number[];
  /** Clamp to the bounds and snap to the lattice. */
  snap(i: number, v: number): number;
  /** Snap every coordinate. */
  snapAll(x: readonly number[]): number[];
  /** The design record for a coded vector. */
  toDesign(x: readonly number[]): Design;
  /** The coded vector of a design record (throws RangeError naming `fn` for a missing or unknown value). */
  fromDesign(fn: string, d: Design): number[];
  /** Map a point of the unit cube to a legal coded vector (lattice and levels stratified evenly). */
  fromUnit(u: readonly number[]): number[];
  /** Coded vector → unit-cube coordinates (categoricals by level centre). */
  toUnit(x: readonly number[]): number[];
}

/** Legal lattice values of a stepped range: min + k·step, k = 0 … ⌊(max − min)/step⌋. */
function latticeCount(min: number, max: number, step: number): number {
  return Math.floor((max - min) / step + 1e-9) + 1;
}

/**
 * Builds the coding of an already validated problem (see validateProblem).
 * @param problem - the problem.
 * @returns the codec.
 */
export function createDesignCodec(problem: OptimisationProblem): DesignCodec {
  const variables = problem.variables;
  const lower: number[] = [];
  const upper: number[] = [];
  const step: number[] = [];
  const categorical: boolean[] = [];
  const count: number[] = [];
  for (const v of variables) {
    if (v.kind === "categorical") {
      lower.push(0);
      upper.push(v.levels.length - 1);
      step.push(1);
      categorical.push(true);
      count.push(v.levels.length);
    } else {
      const s = v.kind === "integer" ? 1 : (v.step ?? 0);
      const n = s > 0 ? latticeCount(v.min, v.max, s) : v.max > v.min ? Infinity : 1;
      lower.push(v.min);
      upper.push(s > 0 ? v.min + (n - 1) * s : v.max);
      step.push(s);
      categorical.push(false);
      count.push(n);
    }
  }
  const snap = (i: number, v: number): number => {
    const lo = lower[i]!;
    const hi = upper[i]!;
    const x = Number.isFinite(v) ? Math.min(hi, Math.max(lo, v)) : lo;
    const s = step[i]!;
    if (s <= 0) return x;
    const k = Math.min(count[i]! - 1, Math.max(0, Math.round((x - lo) / s)));
    return lo + k * s;
  };
  return {
    variables,
    dims: variables.length,
    lower,
    upper,
    step,
    categorical,
    count,
    snap,
    snapAll: (x) => x.map((v, i) => snap(i, v)),
    toDesign(x) {
      const d: Record<string, number | string> = {};
      variables.forEach((v, i) => {
        d[v.name] = v.kind === "categorical" ? v.levels[x[i]!]! : x[i]!;
      });
      return d;
    },
    fromDesign(fn, d) {
      return variables.map((v, i) => {
        const value = d[v.name];
        if (v.kind === "categorical") {
          const k = v.levels.indexOf(value as string | number);
          if (k < 0) throw new RangeError(`${fn}: design.${v.name} must be one of the levels, got ${String(value)}`);
          return k;
        }
        if (typeof value !== "number" || !Number.isFinite(value)) {
          throw new RangeError(`${fn}: design.${v.name} must be a finite number, got ${String(value)}`);
        }
        return snap(i, value);
      });
    },
    fromUnit(u) {
      return u.map((ui, i) => {
        const c = Math.min(1, Math.max(0, ui));
        if (step[i]! > 0) {
          const k = Math.min(count[i]! - 1, Math.floor(c * count[i]!));
          return snap(i, lower[i]! + k * step[i]!);
        }
        return lower[i]! + c * (upper[i]! - lower[i]!);
      });
    },
    toUnit(x) {
      return x.map((xi, i) => {
        if (step[i]! > 0) return (Math.round((xi - lower[i]!) / step[i]!) + 0.5) / count[i]!;
        const w = upper[i]! - lower[i]!;
        return w > 0 ? (xi - lower[i]!) / w : 0.5;
      });
    },
  };
}
