import { standardNormal } from "@floorcast/surrogate";

/**
 * Expected improvement of a Gaussian prediction N(mean, sd²) below the incumbent `best` (losses
 * minimised): EI = (best − μ)Φ(z) + σφ(z), z = (best − μ)/σ (Jones, Schonlau & Welch 1998,
 * J. Global Optim. 13, eq. 15). For σ = 0 it is max(0, best − μ).
 * @returns EI ≥ 0 (0 for a NaN input).
 */
export function expectedImprovement(mean: number, sd: number, best: number): number {
  if (Number.isNaN(mean) || Number.isNaN(sd) || Number.isNaN(best)) return 0;
  const gain = best - mean;
  if (!(sd > 0)) return Math.max(0, gain);
  const z = gain / sd;
  return Math.max(0, gain * standardNormal.cdf(z) + sd * standardNormal.pdf(z));
}

/**
 * Probability that a constraint g ≤ 0 holds under a Gaussian prediction N(mean, sd²):
 * Φ(−μ/σ) (Schonlau, Welch & Jones 1998, "Global versus local search in constrained
 * optimization of computer models"; Gardner et al. 2014). For σ = 0 it is 1 when μ ≤ 0, else 0.
 * @returns a probability in [0, 1] (0 for a NaN input).
 */
export function probabilityOfFeasibility(mean: number, sd: number): number {
  if (Number.isNaN(mean) || Number.isNaN(sd)) return 0;
  if (!(sd > 0)) return mean <= 0 ? 1 : 0;
  return standardNormal.cdf(-mean / sd);
}
