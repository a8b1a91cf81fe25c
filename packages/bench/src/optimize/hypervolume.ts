/** Hypervolume of minimised points below `ref` (coordinates already checked and reduced to those strictly dominating ref). */
function hvRecursive(points: number[][], ref: readonly number[], d: number): number {
  if (points.length === 0) return 0;
  if (d === 1) return ref[0]! - Math.min(...points.map((p) => p[0]!));
  if (d === 2) {
    const s = [...points].sort((a, b) => a[0]! - b[0]! || a[1]! - b[1]!);
    let area = 0;
    let lastF2 = ref[1]!;
    for (const p of s) {
      if (p[1]! < lastF2) {
        area += (ref[0]! - p[0]!) * (lastF2 - p[1]!);
        lastF2 = p[1]!;
      }
    }
    return area;
  }
  // Slicing along the last objective (hypervolume by slicing objectives, While et al. 2006, IEEE TEC 10(1)).
  const s = [...points].sort((a, b) => a[d - 1]! - b[d - 1]!);
  let vol = 0;
  for (let i = 0; i < s.length; i++) {
    const top = i + 1 < s.length ? s[i + 1]![d - 1]! : ref[d - 1]!;
    const depth = top - s[i]![d - 1]!;
    if (depth > 0) vol += depth * hvRecursive(s.slice(0, i + 1), ref, d - 1);
  }
  return vol;
}

/**
 * Exact hypervolume (the Lebesgue measure of the region dominated by the points and bounded by
 * the reference point; Zitzler & Thiele 1998). Two objectives: the sorted sweep, O(n log n).
 * More: hypervolume by slicing objectives (While, Hingston, Barone & Huband 2006), exact and
 * fine for small fronts (cost grows like n^(d−1)). Points that do not strictly dominate the
 * reference point add nothing; duplicates and dominated points are harmless.
 * @param points - objective vectors, each the reference point's length.
 * @param reference - the reference point (finite).
 * @param senses - per objective "min" (default) or "max"; for a maximised objective the reference
 *   lies below the front and the region from the reference up to each point counts.
 * @returns the hypervolume (0 for no points).
 */
export function hypervolume(
  points: readonly (readonly number[])[],
  reference: readonly number[],
  senses?: readonly ("min" | "max")[],
): number {
  const fn = "hypervolume";
  if (!Array.isArray(points)) throw new TypeError(`${fn}: points must be an array`);
  if (!Array.isArray(reference)) throw new TypeError(`${fn}: reference must be an array`);
  const d = reference.length;
  if (d === 0) throw new RangeError(`${fn}: reference must not be empty`);
  reference.forEach((r, k) => {
    if (typeof r !== "number" || !Number.isFinite(r)) throw new RangeError(`${fn}: reference[${k}] must be finite, got ${r}`);
  });
  if (senses !== undefined && senses.length !== d) throw new RangeError(`${fn}: senses must have ${d} entries, got ${senses.length}`);
  const flip = (k: number): number => (senses?.[k] === "max" ? -1 : 1);
  const ref = reference.map((r, k) => flip(k) * r);
  const kept: number[][] = [];
  points.forEach((p, i) => {
    if (!Array.isArray(p) || p.length !== d) throw new RangeError(`${fn}: points[${i}] must have ${d} coordinates`);
    if (p.some((v) => typeof v !== "number" || Number.isNaN(v))) throw new RangeError(`${fn}: points[${i}] has a NaN or non-number coordinate`);
    const q = p.map((v, k) => flip(k) * v);
    if (q.every((v, k) => v < ref[k]!)) kept.push(q);
  });
  return hvRecursive(kept, ref, d);
}
