import { checkVector } from "./check-vector.js";
import { regressionMetrics, type RegressionMetrics } from "./regression-metrics.js";

/**
 * Error metrics for each value of a categorical column (a regime, e.g. which rule binds:
 * height, far, plate, setbacks). Surrogates tend to fail near regime switches; this shows where.
 * @param yTrue - true values.
 * @param yPred - predictions, same length.
 * @param groups - the regime of each row (string or number), same length.
 * @returns one entry per distinct regime value (keyed by its string form), in order of first appearance.
 */
export function metricsByRegime(
  yTrue: readonly number[],
  yPred: readonly number[],
  groups: readonly (string | number)[],
): Record<string, RegressionMetrics> {
  const y = checkVector("metricsByRegime", "yTrue", yTrue);
  const p = checkVector("metricsByRegime", "yPred", yPred, y.length);
  if (!Array.isArray(groups)) throw new TypeError("metricsByRegime: groups must be an array");
  if (groups.length !== y.length) {
    throw new RangeError(`metricsByRegime: groups must have length ${y.length}, got ${groups.length}`);
  }
  const index = new Map<string, number[]>();
  groups.forEach((g, i) => {
    if (typeof g !== "string" && typeof g !== "number") {
      throw new TypeError(`metricsByRegime: groups[${i}] must be a string or number`);
    }
    const key = String(g);
    const list = index.get(key);
    if (list) list.push(i);
    else index.set(key, [i]);
  });
  const out: Record<string, RegressionMetrics> = {};
  for (const [key, rows] of index) {
    out[key] = regressionMetrics(
      rows.map((i) => y[i]!),
      rows.map((i) => p[i]!),
    );
  }
  return out;
}
