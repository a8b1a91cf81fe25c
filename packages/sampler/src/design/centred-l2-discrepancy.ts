import { checkPoints } from "./check-design-args.js";

/**
 * The squared centred L2 discrepancy of Hickernell (1998, Math. Comp. 67), the quantity
 * scipy.stats.qmc.discrepancy(x, method="CD") returns:
 * CD² = (13/12)^d − (2/n) Σ_i Π_k (1 + ½|z_ik| − ½ z_ik²)
 *       + (1/n²) Σ_i Σ_j Π_k (1 + ½|z_ik| + ½|z_jk| − ½|x_ik − x_jk|),  z = x − ½.
 * Smaller is more uniform. O(n²·d).
 * @param points - at least one row of coordinates in [0, 1].
 * @returns CD² (square it-root for the discrepancy itself).
 * @throws TypeError/RangeError for empty, ragged, non-finite or out-of-cube input.
 */
export function centredL2Discrepancy(points: readonly (readonly number[])[]): number {
  const fn = "centredL2Discrepancy";
  const d = checkPoints(fn, points, true);
  const n = points.length;
  if (n === 0) throw new RangeError(`${fn}: points must not be empty`);
  let single = 0;
  for (const row of points) {
    let prod = 1;
    for (let k = 0; k < d; k++) {
      const z = Math.abs((row[k] as number) - 0.5);
      prod *= 1 + 0.5 * z - 0.5 * z * z;
    }
    single += prod;
  }
  let pairs = 0;
  for (let i = 0; i < n; i++) {
    const a = points[i] as readonly number[];
    for (let j = 0; j < n; j++) {
      const b = points[j] as readonly number[];
      let prod = 1;
      for (let k = 0; k < d; k++) {
        const xa = a[k] as number;
        const xb = b[k] as number;
        prod *= 1 + 0.5 * Math.abs(xa - 0.5) + 0.5 * Math.abs(xb - 0.5) - 0.5 * Math.abs(xa - xb);
      }
      pairs += prod;
    }
  }
  return (13 / 12) ** d - (2 / n) * single + pairs / (n * n);
}
