/**
 * Relative optimum gap: (exact optimum − exact value at the surrogate-driven optimum) / |exact optimum|,
 * written for a maximised objective (for a minimised one pass the sense and the sign flips), so the gap
 * is ≥ 0 whenever the surrogate-driven design is no better than the exact optimum (derived from the
 * definition in the benchmark's problem statement; the absolute value in the denominator keeps the sign
 * meaningful when the optimum is negative, as for the published minimisation test functions).
 * @param exactOptimum - exact objective value at the exact optimum, finite, non-zero.
 * @param exactAtSurrogate - exact objective value at the surrogate-driven design, finite.
 * @param sense - "maximise" (default) or "minimise" (or the optimizers' "max" / "min").
 * @returns the gap (0 = no loss; 0.05 = 5% of the optimum lost).
 */
export function optimumGap(
  exactOptimum: number,
  exactAtSurrogate: number,
  sense: "maximise" | "minimise" | "max" | "min" = "maximise",
): number {
  if (typeof exactOptimum !== "number" || typeof exactAtSurrogate !== "number") {
    throw new TypeError("optimumGap: exactOptimum and exactAtSurrogate must be numbers");
  }
  if (!Number.isFinite(exactOptimum) || exactOptimum === 0) {
    throw new RangeError(`optimumGap: exactOptimum must be finite and non-zero, got ${exactOptimum}`);
  }
  if (!Number.isFinite(exactAtSurrogate)) {
    throw new RangeError(`optimumGap: exactAtSurrogate must be finite, got ${exactAtSurrogate}`);
  }
  if (!["maximise", "minimise", "max", "min"].includes(sense)) {
    throw new RangeError(`optimumGap: sense must be "maximise" or "minimise", got ${String(sense)}`);
  }
  const loss = sense === "maximise" || sense === "max" ? exactOptimum - exactAtSurrogate : exactAtSurrogate - exactOptimum;
  return loss / Math.abs(exactOptimum);
}
