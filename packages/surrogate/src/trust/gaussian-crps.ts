import { standardNormal } from "./standard-normal.js";

const INV_SQRT_PI = 0.5641895835477563;

/**
 * Continuous ranked probability score of a Gaussian forecast N(μ, σ²) for an observation y,
 * in closed form: CRPS = σ[z(2Φ(z) − 1) + 2φ(z) − 1/√π], z = (y − μ)/σ
 * (Gneiting & Raftery 2007, JASA 102:359–378, eq. 21). Lower is better; it has the units of y.
 * For σ = 0 it is the limit |y − μ|.
 * @param y - observation.
 * @param mu - forecast mean.
 * @param sigma - forecast standard deviation, ≥ 0.
 * @returns the score; NaN if any argument is NaN or sigma < 0.
 */
export function gaussianCrps(y: number, mu: number, sigma: number): number {
  if (!(sigma >= 0) || Number.isNaN(y) || Number.isNaN(mu)) return NaN;
  if (sigma === 0) return Math.abs(y - mu);
  const z = (y - mu) / sigma;
  return sigma * (z * (2 * standardNormal.cdf(z) - 1) + 2 * standardNormal.pdf(z) - INV_SQRT_PI);
}
