import type { KernelName } from "./kernel-name.js";

/**
 * A unit-variance stationary correlation written as a function of the squared scaled distance
 * r² = Σ_k ((x_k − x'_k)/ℓ_k)², with its derivative d g / d(r²) (finite at r = 0 for all three families).
 * Both are 0 at r² = +∞ (their limits): a point so far from the data that r² overflows (inputs beyond about
 * 1e154 in scaled units) has no correlation with it, so the GP falls back to its prior mean and variance.
 */
export interface RadialProfile {
  value(r2: number): number;
  dValueDr2(r2: number): number;
}

const SQRT3 = Math.sqrt(3);
const SQRT5 = Math.sqrt(5);

/** SE: g = exp(−r²/2) (Rasmussen & Williams 2006, eq. 4.9). */
const squaredExponential: RadialProfile = {
  value: (r2) => Math.exp(-0.5 * r2),
  dValueDr2: (r2) => -0.5 * Math.exp(-0.5 * r2),
};

/** Matérn 3/2: g = (1 + √3 r) e^{−√3 r}; dg/d(r²) = −(3/2) e^{−√3 r} (R&W eq. 4.17; derivative derived). */
const matern32: RadialProfile = {
  value: (r2) => {
    if (r2 === Infinity) return 0; // (1 + s)·e^{−s} → 0; ∞·0 would be NaN
    const s = SQRT3 * Math.sqrt(r2);
    return (1 + s) * Math.exp(-s);
  },
  dValueDr2: (r2) => -1.5 * Math.exp(-SQRT3 * Math.sqrt(r2)),
};

/** Matérn 5/2: g = (1 + √5 r + 5r²/3) e^{−√5 r}; dg/d(r²) = −(5/6)(1 + √5 r) e^{−√5 r} (R&W eq. 4.17; derived). */
const matern52: RadialProfile = {
  value: (r2) => {
    if (r2 === Infinity) return 0; // the polynomial times e^{−s} → 0; ∞·0 would be NaN
    const s = SQRT5 * Math.sqrt(r2);
    return (1 + s + (5 / 3) * r2) * Math.exp(-s);
  },
  dValueDr2: (r2) => {
    if (r2 === Infinity) return 0;
    const s = SQRT5 * Math.sqrt(r2);
    return (-5 / 6) * (1 + s) * Math.exp(-s);
  },
};

/**
 * The radial profile of a kernel family.
 * @param name - "se", "matern32" or "matern52".
 * @returns value and derivative with respect to r².
 */
export function radialProfile(name: KernelName): RadialProfile {
  switch (name) {
    case "se":
      return squaredExponential;
    case "matern32":
      return matern32;
    case "matern52":
      return matern52;
  }
}
