/**
 * Indices of a space-filling subset of m rows chosen greedily by maximin distance (Gonzalez 1985 farthest-point
 * traversal): start at the row nearest the centroid, then repeatedly add the row farthest from the chosen set.
 * O(n·m·d) time, O(n) memory; deterministic (ties go to the lowest index).
 * @param x - flat scaled inputs (n × d).
 * @param n - rows.
 * @param d - inputs.
 * @param m - subset size (≤ n).
 * @returns m distinct row indices, in order of selection.
 */
export function greedyMaximinSubset(x: Float64Array, n: number, d: number, m: number): number[] {
  const centroid = new Float64Array(d);
  for (let i = 0; i < n; i++) for (let p = 0; p < d; p++) centroid[p] = centroid[p]! + x[i * d + p]! / n;
  const dist = new Float64Array(n);
  let first = 0;
  let best = Infinity;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let p = 0; p < d; p++) s += (x[i * d + p]! - centroid[p]!) ** 2;
    if (s < best) {
      best = s;
      first = i;
    }
  }
  const chosen = [first];
  dist.fill(Infinity);
  let last = first;
  while (chosen.length < Math.min(m, n)) {
    let far = -1;
    let farD = -1;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let p = 0; p < d; p++) s += (x[i * d + p]! - x[last * d + p]!) ** 2;
      if (s < dist[i]!) dist[i] = s;
      if (dist[i]! > farD) {
        farD = dist[i]!;
        far = i;
      }
    }
    if (farD <= 0) {
      // Only duplicates of chosen rows remain: take the lowest unchosen index.
      const taken = new Set(chosen);
      for (let i = 0; i < n && chosen.length < m; i++) if (!taken.has(i)) chosen.push(i);
      break;
    }
    chosen.push(far);
    dist[far] = 0;
    last = far;
  }
  return chosen;
}
