/**
 * Training inputs stored in a model file, in original units: a GP file keeps them in the unit-cube
 * scaling (`payload.trainingInputs`, u = (x − lower)/(upper − lower), zero spans kept as 1), so
 * x = lower + u·span.
 * @param file - a parsed model file (any JSON value).
 * @returns rows × inputs, or null when the file stores no training inputs.
 */
export function modelTrainingInputs(file: unknown): number[][] | null {
  const f = file as {
    inputScaling?: { lower?: unknown; upper?: unknown };
    payload?: { trainingInputs?: unknown };
  } | null;
  const lower = f?.inputScaling?.lower;
  const upper = f?.inputScaling?.upper;
  const u = f?.payload?.trainingInputs;
  if (!Array.isArray(lower) || !Array.isArray(upper) || !Array.isArray(u)) return null;
  return u.map((row: unknown) => {
    if (!Array.isArray(row) || row.length !== lower.length) throw new RangeError("modelTrainingInputs: payload.trainingInputs rows must match inputScaling");
    return row.map((v: unknown, k) => {
      const lo = lower[k] as number;
      const span = (upper[k] as number) - lo;
      return lo + (v as number) * (span > 0 ? span : 1);
    });
  });
}
