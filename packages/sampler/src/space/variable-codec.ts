import type { Variable, VariableRecord } from "./variable.js";
import { latticeCount } from "./lattice-count.js";

/**
 * The one coding of a list of variables, shared by datasets, model files and optimizers:
 *
 * - **record**: variable name → value (a number, or a categorical level), as CSV files hold it;
 * - **model row**: one number per variable, in order, as a surrogate is trained on it and predicts from it:
 *   the value itself, a numeric categorical level as its own value (3.9 stays 3.9, exactly as `sample` writes it
 *   in the CSV), a string level as its position in `levels`;
 * - **coded vector** (the optimizers' search coordinates): the value, with a categorical as its level index;
 *   lattice variables (integer, or continuous with a step) take min + k·step only;
 * - **unit point**: a point of [0, 1]^d (linear, or in ln(value) for a log-scale variable).
 */
export interface VariableCodec {
  readonly variables: readonly Variable[];
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
  /** The record of a coded vector. */
  toDesign(x: readonly number[]): VariableRecord;
  /** The coded vector of a record (throws RangeError naming `fn` for a missing or unknown value). */
  fromDesign(fn: string, d: VariableRecord): number[];
  /** Map a point of the unit cube to a legal coded vector (lattice and levels stratified evenly). */
  fromUnit(u: readonly number[]): number[];
  /** Coded vector → unit-cube coordinates (lattice values and categoricals by their cell's centre). */
  toUnit(x: readonly number[]): number[];
  /** The model row of a record (NaN where a value is missing, not a number or not a level). */
  toRow(d: VariableRecord): number[];
  /** The record of a model row (a categorical row value must be one of the levels' row values). */
  fromRow(fn: string, row: readonly number[]): VariableRecord;
}

/**
 * The model-row value of one variable's value (see {@link VariableCodec}); NaN when it is not legal for the kind.
 * @param v - the variable.
 * @param value - its value in a record.
 * @returns the number a surrogate sees.
 */
export function rowValue(v: Variable, value: number | string | undefined): number {
  if (v.kind === "categorical") {
    const k = v.levels.indexOf(value as string | number);
    if (k < 0) return Number.NaN;
    const level = v.levels[k]!;
    return typeof level === "number" ? level : k;
  }
  return typeof value === "number" ? value : Number.NaN;
}

/**
 * Builds the coding of a validated variable list (see validateDesignSpace; the bench's problems are checked by
 * its validateProblem).
 * @param variables - the variables, in order.
 * @returns the codec.
 */
export function createVariableCodec(variables: readonly Variable[]): VariableCodec {
  const lower: number[] = [];
  const upper: number[] = [];
  const step: number[] = [];
  const categorical: boolean[] = [];
  const count: number[] = [];
  const logScale: boolean[] = [];
  for (const v of variables) {
    if (v.kind === "categorical") {
      lower.push(0);
      upper.push(v.levels.length - 1);
      step.push(1);
      categorical.push(true);
      count.push(v.levels.length);
      logScale.push(false);
    } else {
      const s = v.kind === "integer" ? 1 : (v.step ?? 0);
      const n = s > 0 ? latticeCount(v.min, v.max, s) : v.max > v.min ? Infinity : 1;
      lower.push(v.min);
      upper.push(s > 0 ? v.min + (n - 1) * s : v.max);
      step.push(s);
      categorical.push(false);
      count.push(n);
      logScale.push(v.kind === "continuous" && v.log === true && s === 0 && v.min > 0);
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
  const toDesign = (x: readonly number[]): VariableRecord => {
    const d: Record<string, number | string> = {};
    variables.forEach((v, i) => {
      d[v.name] = v.kind === "categorical" ? v.levels[x[i]!]! : x[i]!;
    });
    return d;
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
    toDesign,
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
        if (logScale[i]) {
          const a = Math.log(lower[i]!);
          const b = Math.log(upper[i]!);
          return c === 0 ? lower[i]! : c === 1 ? upper[i]! : Math.min(upper[i]!, Math.max(lower[i]!, Math.exp(a + c * (b - a))));
        }
        return lower[i]! + c * (upper[i]! - lower[i]!);
      });
    },
    toUnit(x) {
      return x.map((xi, i) => {
        if (step[i]! > 0) return (Math.round((xi - lower[i]!) / step[i]!) + 0.5) / count[i]!;
        if (logScale[i]) {
          const a = Math.log(lower[i]!);
          return (Math.log(xi) - a) / (Math.log(upper[i]!) - a);
        }
        const w = upper[i]! - lower[i]!;
        return w > 0 ? (xi - lower[i]!) / w : 0.5;
      });
    },
    toRow: (d) => variables.map((v) => rowValue(v, d[v.name])),
    fromRow(fn, row) {
      const d: Record<string, number | string> = {};
      variables.forEach((v, i) => {
        const r = row[i];
        if (typeof r !== "number" || Number.isNaN(r)) throw new RangeError(`${fn}: row[${i}] (${v.name}) must be a number, got ${String(r)}`);
        if (v.kind !== "categorical") {
          d[v.name] = r;
          return;
        }
        const k = v.levels.findIndex((level, j) => (typeof level === "number" ? level === r : j === r));
        if (k < 0) throw new RangeError(`${fn}: row[${i}] (${v.name}) ${r} is not a level of ${v.name} (${v.levels.join(", ")})`);
        d[v.name] = v.levels[k]!;
      });
      return d;
    },
  };
}

/**
 * The bounds of each variable's model-row values: [min, max] of a numeric variable, the least and greatest numeric
 * level of a categorical (positions 0 … L − 1 for string levels), widened to width 1 when a categorical has one level.
 * @param variables - the variables, in order.
 * @returns lower and upper bound per variable.
 */
export function modelRowBounds(variables: readonly Variable[]): { lower: number[]; upper: number[] } {
  const lower: number[] = [];
  const upper: number[] = [];
  for (const v of variables) {
    if (v.kind !== "categorical") {
      lower.push(v.min);
      upper.push(v.max);
      continue;
    }
    const values = v.levels.map((l) => rowValue(v, l));
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    lower.push(lo);
    upper.push(hi > lo ? hi : lo + 1);
  }
  return { lower, upper };
}
