/**
 * Pareto dominance of loss vectors (all objectives minimised): a dominates b when a is no worse
 * in every objective and strictly better in one (Deb et al. 2002, NSGA-II, §III).
 */
export function dominates(a: readonly number[], b: readonly number[]): boolean {
  let strictly = false;
  for (let i = 0; i < a.length; i++) {
    if (a[i]! > b[i]!) return false;
    if (a[i]! < b[i]!) strictly = true;
  }
  return strictly;
}

/**
 * The non-dominated subset of loss vectors (all objectives minimised). Rows with a NaN are
 * dropped; duplicates are kept once. Quadratic in the number of points.
 * @param points - loss vectors, all the same length.
 * @returns indices of the non-dominated points, in input order.
 */
export function nonDominatedIndices(points: readonly (readonly number[])[]): number[] {
  const keep: number[] = [];
  outer: for (let i = 0; i < points.length; i++) {
    const p = points[i]!;
    if (p.some((v) => Number.isNaN(v))) continue;
    for (let j = 0; j < points.length; j++) {
      if (j === i) continue;
      const q = points[j]!;
      if (q.some((v) => Number.isNaN(v))) continue;
      if (dominates(q, p)) continue outer;
      if (j < i && q.every((v, k) => v === p[k])) continue outer;
    }
    keep.push(i);
  }
  return keep;
}
