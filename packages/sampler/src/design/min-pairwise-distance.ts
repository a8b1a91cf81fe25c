import { checkPoints } from "./check-design-args.js";

/**
 * The smallest Euclidean distance between two of the points (the maximin criterion of Johnson, Moore &
 * Ylvisaker 1990). O(n²·d).
 * @param points - rows of finite coordinates, all of one length.
 * @returns the minimum distance; 0 when two points coincide; Infinity for fewer than two points.
 * @throws TypeError/RangeError for ragged, empty-row or non-finite input.
 */
export function minPairwiseDistance(points: readonly (readonly number[])[]): number {
  checkPoints("minPairwiseDistance", points, false);
  const n = points.length;
  let best = Infinity;
  for (let i = 0; i < n; i++) {
    const a = points[i] as readonly number[];
    for (let j = i + 1; j < n; j++) {
      const b = points[j] as readonly number[];
      let s = 0;
      for (let k = 0; k < a.length; k++) {
        const t = (a[k] as number) - (b[k] as number);
        s += t * t;
      }
      if (s < best) best = s;
    }
  }
  return Math.sqrt(best);
}
