import type { HyperparameterLayout } from "../kernels/kernel-hyperparameters.js";

/**
 * Factors by which each lengthscale is shortened in turn when probing a subset's optimum on all rows (derived: a
 * maximin subset of m of n rows in d dimensions is spaced about (n/m)^(1/d) times wider than the full data, and
 * structure finer than its spacing, such as whole-floor or FAR steps along one input, cannot raise its likelihood).
 */
export const PROBE_FACTORS: readonly number[] = [1 / 4, 1 / 16];

/**
 * Lengthscales (unit-cube units: inputs are scaled to [0, 1]) each lengthscale longer than them is also set to in
 * turn: an input the subset found irrelevant (a lengthscale far beyond the cube) may matter on all rows, where
 * weaker effects become detectable, and a fixed fraction of an arbitrarily long lengthscale would not reach it.
 */
export const PROBE_LENGTHSCALES: readonly number[] = [1, 1 / 4];

/** One probe: θ with the lengthscale of input `dim` shortened, and how (`× 1/4`, `= 1`, ...). */
export interface LengthscaleProbe {
  readonly theta: Float64Array;
  readonly dim: number;
  /** "× 1/4", "× 1/16", "= 1" or "= 1/4"; "(at its lower bound)" added when the bound cut it short. */
  readonly change: string;
}

/**
 * The probes of a subset optimum: θ with one ARD lengthscale at a time multiplied by each of
 * {@link PROBE_FACTORS}, then set to each of {@link PROBE_LENGTHSCALES} that is shorter, in log space, clamped to
 * the lower bound; a probe that would not shorten it by more than a factor of 2, or within a factor of 2 of an
 * earlier probe of the same lengthscale, is left out. Nothing for a shared lengthscale (ARD off).
 * @param theta - the subset's optimum (log space). @param layout - θ layout. @param logLower - lower bounds.
 * @returns the probes, lengthscale by lengthscale.
 */
export function shorterLengthscaleProbes(theta: Float64Array, layout: HyperparameterLayout, logLower: Float64Array): LengthscaleProbe[] {
  if (!layout.ard) return [];
  const probes: LengthscaleProbe[] = [];
  for (let k = 0; k < layout.dims; k++) {
    const wanted = [
      ...PROBE_FACTORS.map((f) => ({ log: theta[k]! + Math.log(f), change: `× 1/${Math.round(1 / f)}` })),
      ...PROBE_LENGTHSCALES.map((l) => ({ log: Math.log(l), change: l === 1 ? "= 1" : `= 1/${Math.round(1 / l)}` })),
    ];
    const taken: number[] = [];
    for (const w of wanted) {
      const v = Math.max(logLower[k]!, w.log);
      if (v >= theta[k]! - Math.LN2 || taken.some((t) => Math.abs(t - v) < Math.LN2)) continue;
      taken.push(v);
      const p = Float64Array.from(theta);
      p[k] = v;
      probes.push({ theta: p, dim: k, change: v > w.log ? `${w.change} (at its lower bound)` : w.change });
    }
  }
  return probes;
}
