import { checkVector } from "./check-vector.js";

/** A power law error ≈ a·nᵇ fitted on log-log axes. */
export interface PowerLawFit {
  /** Exponent b: the slope of log(error) against log(n). Negative when error falls with n. */
  readonly slope: number;
  /** Coefficient a = exp(intercept). */
  readonly coefficient: number;
  /** R² of the straight-line fit on log-log axes. */
  readonly r2LogLog: number;
}

/**
 * Least-squares straight line through (log n, log error): error ≈ a·nᵇ (ordinary least squares,
 * common practice for learning curves).
 * @param sizes - training sizes, each > 0, at least two distinct.
 * @param errors - errors, each > 0, same length.
 * @returns slope b, coefficient a and the log-log R² (NaN when the errors are all equal).
 */
export function powerLawFit(sizes: readonly number[], errors: readonly number[]): PowerLawFit {
  const fn = "powerLawFit";
  const n = checkVector(fn, "sizes", sizes);
  const e = checkVector(fn, "errors", errors, n.length);
  n.forEach((v, i) => {
    if (!(v > 0)) throw new RangeError(`${fn}: sizes[${i}] must be > 0, got ${v}`);
  });
  e.forEach((v, i) => {
    if (!(v > 0)) throw new RangeError(`${fn}: errors[${i}] must be > 0, got ${v}`);
  });
  const lx = n.map(Math.log);
  const ly = e.map(Math.log);
  const mx = lx.reduce((a, b) => a + b, 0) / lx.length;
  const my = ly.reduce((a, b) => a + b, 0) / ly.length;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < lx.length; i++) {
    sxx += (lx[i]! - mx) ** 2;
    sxy += (lx[i]! - mx) * (ly[i]! - my);
    syy += (ly[i]! - my) ** 2;
  }
  if (!(sxx > 0)) throw new RangeError(`${fn}: sizes must contain at least two distinct values`);
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  return { slope, coefficient: Math.exp(intercept), r2LogLog: syy === 0 ? NaN : (sxy * sxy) / (sxx * syy) };
}
