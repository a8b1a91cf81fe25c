import { erf, erfc } from "./error-function.js";

const SQRT1_2 = Math.SQRT1_2;
const INV_SQRT_2PI = 0.3989422804014327;

/**
 * The standard normal distribution: density φ, distribution function Φ and quantile Φ⁻¹.
 * Φ(x) = ½ erfc(−x/√2), using erf near 0 and erfc in the tails (the same split as Cephes' ndtr);
 * erf/erfc by Cody (1969). Φ⁻¹ starts from P. J. Acklam's rational approximation (relative error
 * 1.15e-9, from memory) and takes two Halley steps on Φ, which brings it to full double precision.
 */
export const standardNormal = {
  /**
   * Density φ(x) = exp(−x²/2)/√(2π).
   * @param x - any number.
   */
  pdf(x: number): number {
    return INV_SQRT_2PI * Math.exp(-0.5 * x * x);
  },
  /**
   * Distribution function Φ(x).
   * @param x - any number; NaN gives NaN.
   */
  cdf(x: number): number {
    const t = x * SQRT1_2;
    const z = Math.abs(t);
    if (z < SQRT1_2) return 0.5 + 0.5 * erf(t);
    const y = 0.5 * erfc(z);
    return t > 0 ? 1 - y : y;
  },
  /**
   * Quantile Φ⁻¹(p).
   * @param p - probability in [0, 1]; 0 gives −Infinity, 1 gives +Infinity, outside or NaN gives NaN.
   */
  quantile(p: number): number {
    if (!(p >= 0 && p <= 1)) return NaN;
    if (p === 0) return -Infinity;
    if (p === 1) return Infinity;
    let x = acklam(p);
    for (let i = 0; i < 2; i++) {
      // Halley's step for Φ(x) − p = 0 (derived: f' = φ, f'' = −xφ).
      // Upper half: Φ(x) − p = (1 − p) − Φ(−x), with 1 − p exact for p ≥ ½ (Sterbenz).
      const e = p < 0.5 ? standardNormal.cdf(x) - p : 1 - p - standardNormal.cdf(-x);
      const u = e / standardNormal.pdf(x);
      x = x - u / (1 + (x * u) / 2);
    }
    return x;
  },
};

const AA = [-39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716, 2.506628277459239];
const BB = [-54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572];
const CC = [-0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
const DD = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];

/** P. J. Acklam's starting approximation to Φ⁻¹ (from memory; refined by Halley steps above). */
function acklam(p: number): number {
  const plow = 0.02425;
  if (p < plow || p > 1 - plow) {
    const q = Math.sqrt(-2 * Math.log(p < plow ? p : 1 - p));
    const v =
      (((((CC[0]! * q + CC[1]!) * q + CC[2]!) * q + CC[3]!) * q + CC[4]!) * q + CC[5]!) /
      ((((DD[0]! * q + DD[1]!) * q + DD[2]!) * q + DD[3]!) * q + 1);
    return p < plow ? v : -v;
  }
  const q = p - 0.5;
  const r = q * q;
  return (
    ((((((AA[0]! * r + AA[1]!) * r + AA[2]!) * r + AA[3]!) * r + AA[4]!) * r + AA[5]!) * q) /
    (((((BB[0]! * r + BB[1]!) * r + BB[2]!) * r + BB[3]!) * r + BB[4]!) * r + 1)
  );
}
