/**
 * Combines members' predictions as a uniform mixture (Lakshminarayanan, Pritzel & Blundell 2017,
 * §2.4): μ = (1/k) Σ μ_m, σ² = (1/k) Σ (σ_m² + μ_m²) − μ² (σ_m = 0 for a member without sd),
 * accumulated around μ for accuracy: σ² = (1/k) Σ (σ_m² + (μ_m − μ)²).
 * @param preds - k ≥ 1 predictions of the same rows × targets.
 * @returns the mixture's mean and sd.
 */
export function mixtureOfMembers(
  preds: readonly { readonly mean: readonly (readonly number[])[]; readonly sd?: readonly (readonly number[])[] }[],
): { mean: number[][]; sd: number[][] } {
  const k = preds.length;
  const first = preds[0]!.mean;
  const mean: number[][] = [];
  const sd: number[][] = [];
  for (let i = 0; i < first.length; i++) {
    const t = first[i]!.length;
    const mu = new Array<number>(t).fill(0);
    for (const p of preds) for (let j = 0; j < t; j++) mu[j]! += p.mean[i]![j]! / k;
    const v = new Array<number>(t).fill(0);
    for (const p of preds) {
      for (let j = 0; j < t; j++) {
        const s = p.sd ? p.sd[i]![j]! : 0;
        v[j]! += (s * s + (p.mean[i]![j]! - mu[j]!) ** 2) / k;
      }
    }
    mean.push(mu);
    sd.push(v.map(Math.sqrt));
  }
  return { mean, sd };
}
