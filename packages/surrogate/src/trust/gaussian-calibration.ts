import { checkVector } from "./check-vector.js";
import { gaussianCrps } from "./gaussian-crps.js";
import { percentile } from "./percentile.js";
import { standardNormal } from "./standard-normal.js";

/** Empirical coverage of one nominal central interval μ ± z·σ. */
export interface CoverageEntry {
  /** Nominal probability, e.g. 0.9. */
  readonly nominal: number;
  /** Fraction of rows with |y − μ| ≤ z·σ, z = Φ⁻¹((1 + nominal)/2). */
  readonly empirical: number;
}

/** Calibration of Gaussian predictive distributions N(mean, sd²) against observations. */
export interface GaussianCalibration {
  readonly n: number;
  /** Coverage at the requested nominal levels (default 50, 90, 95%). */
  readonly coverage: readonly CoverageEntry[];
  /** Coverage at 5%, 10%, …, 95%, 99%: the calibration curve. */
  readonly curve: readonly CoverageEntry[];
  /** Standardised residuals z = (y − μ)/σ: mean, sd and quantiles; N(0, 1) when calibrated. */
  readonly standardisedResiduals: {
    readonly mean: number;
    readonly sd: number;
    /** Quantiles at probabilities `at`, beside the N(0, 1) quantiles `gaussian`. */
    readonly quantiles: { readonly at: readonly number[]; readonly value: readonly number[]; readonly gaussian: readonly number[] };
    /** Histogram: counts in [edges[i], edges[i+1]); `below`/`above` count z outside the edges. */
    readonly histogram: { readonly edges: readonly number[]; readonly counts: readonly number[]; readonly below: number; readonly above: number };
  };
  /** Mean negative log predictive density ½log(2πσ²) + (y − μ)²/(2σ²); lower is better. */
  readonly nlpd: number;
  /** Mean CRPS of the Gaussian forecasts (Gneiting & Raftery 2007); units of y, lower is better. */
  readonly crps: number;
  /** Mean predicted sd (sharpness). */
  readonly meanSd: number;
}

const QUANTILE_AT = [0.025, 0.05, 0.25, 0.5, 0.75, 0.95, 0.975];
const CURVE = [0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45, 0.5, 0.55, 0.6, 0.65, 0.7, 0.75, 0.8, 0.85, 0.9, 0.95, 0.99];

/**
 * Calibration of Gaussian predictions where the model gives a standard deviation: empirical coverage of
 * nominal central intervals, the standardised residuals, NLPD and CRPS. Intervals from conformal or
 * ensemble models are treated as Gaussian with the given sd (common practice).
 * @param yTrue - observations, finite, non-empty.
 * @param mean - predictive means, same length.
 * @param sd - predictive standard deviations, same length, each > 0 and finite.
 * @param options.levels - nominal central-interval probabilities in (0, 1); default [0.5, 0.9, 0.95].
 * @returns the calibration summary.
 */
export function gaussianCalibration(
  yTrue: readonly number[],
  mean: readonly number[],
  sd: readonly number[],
  options: { levels?: readonly number[] } = {},
): GaussianCalibration {
  const fn = "gaussianCalibration";
  const y = checkVector(fn, "yTrue", yTrue);
  const m = checkVector(fn, "mean", mean, y.length);
  const s = checkVector(fn, "sd", sd, y.length);
  const n = y.length;
  if (n === 0) throw new RangeError(`${fn}: yTrue must not be empty`);
  s.forEach((v, i) => {
    if (!(v > 0)) throw new RangeError(`${fn}: sd[${i}] must be > 0, got ${v}`);
  });
  const levels = options.levels ?? [0.5, 0.9, 0.95];
  levels.forEach((l, i) => {
    if (typeof l !== "number" || !(l > 0 && l < 1)) throw new RangeError(`${fn}: levels[${i}] must be in (0, 1), got ${l}`);
  });
  const z = y.map((v, i) => (v - m[i]!) / s[i]!);
  const absZ = z.map(Math.abs);
  const cover = (nominal: number): CoverageEntry => {
    const half = standardNormal.quantile((1 + nominal) / 2);
    let k = 0;
    for (const a of absZ) if (a <= half) k++;
    return { nominal, empirical: k / n };
  };
  let nlpd = 0;
  let crps = 0;
  let meanSd = 0;
  for (let i = 0; i < n; i++) {
    nlpd += 0.5 * Math.log(2 * Math.PI * s[i]! * s[i]!) + 0.5 * z[i]! * z[i]!;
    crps += gaussianCrps(y[i]!, m[i]!, s[i]!);
    meanSd += s[i]!;
  }
  const zMean = z.reduce((a, b) => a + b, 0) / n;
  const zVar = n > 1 ? z.reduce((a, b) => a + (b - zMean) ** 2, 0) / (n - 1) : NaN;
  const edges: number[] = [];
  for (let e = -4; e <= 4 + 1e-9; e += 0.5) edges.push(e);
  const counts = new Array<number>(edges.length - 1).fill(0);
  let below = 0;
  let above = 0;
  for (const v of z) {
    if (v < edges[0]!) below++;
    else if (v >= edges[edges.length - 1]!) above++;
    else counts[Math.min(counts.length - 1, Math.floor((v - edges[0]!) / 0.5))]!++;
  }
  return {
    n,
    coverage: levels.map(cover),
    curve: CURVE.map(cover),
    standardisedResiduals: {
      mean: zMean,
      sd: Math.sqrt(zVar),
      quantiles: {
        at: QUANTILE_AT,
        value: QUANTILE_AT.map((q) => percentile(z, q)),
        gaussian: QUANTILE_AT.map((q) => standardNormal.quantile(q)),
      },
      histogram: { edges, counts, below, above },
    },
    nlpd: nlpd / n,
    crps: crps / n,
    meanSd: meanSd / n,
  };
}
