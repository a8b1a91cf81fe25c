import type { Prediction, Surrogate, ValidityDomain } from "@floorcast/surrogate";
import { scaleToDomain } from "@floorcast/surrogate";

/**
 * Beyond this many training ranges from the domain's box the squared scaled distance of a row can overflow
 * double precision (derived: (10^150)^2 = 10^300 stays below Number.MAX_VALUE ≈ 1.8·10^308 for up to 10^8
 * inputs), so no surrogate's answer there means anything: such rows get an error, not a number.
 */
export const DOMAIN_SCALE_LIMIT = 1e150;

/** One row's predictions (targets in order) or, when it could not be predicted, the reason. */
export interface PredictedRow {
  readonly mean?: readonly number[];
  readonly sd?: readonly number[] | undefined;
  readonly lower?: readonly number[] | undefined;
  readonly upper?: readonly number[] | undefined;
  readonly error?: string;
}

const finite = (v: readonly number[] | undefined): boolean => v === undefined || v.every((x) => Number.isFinite(x));

function rowOf(p: Prediction, i: number): PredictedRow {
  const row = { mean: p.mean[i]!, sd: p.sd?.[i], lower: p.interval?.lower[i], upper: p.interval?.upper[i] };
  if (![row.mean, row.sd, row.lower, row.upper].every(finite)) return { error: "the model gave a prediction that is not a finite number" };
  return row;
}

/**
 * Predicts every row and reports each row that cannot be predicted in place instead of failing the batch: an
 * input more than DOMAIN_SCALE_LIMIT training ranges outside the model's domain (when a domain is known), a
 * model that throws on the row, or a mean, sd or bound that is not finite.
 * @param model - the surrogate.
 * @param x - rows × inputs (finite).
 * @param domain - the model's domain of validity, or null.
 * @returns one entry per row, in order.
 */
export function predictRows(model: Surrogate, x: readonly (readonly number[])[], domain: ValidityDomain | null): PredictedRow[] {
  const refused = x.map((row) => {
    if (!domain) return undefined;
    const s = scaleToDomain(domain, row);
    const j = s.findIndex((v) => !(Math.abs(v) <= DOMAIN_SCALE_LIMIT));
    return j < 0 ? undefined : `input ${model.inputs[j]} = ${row[j]} lies more than ${DOMAIN_SCALE_LIMIT} training ranges outside the model's domain`;
  });
  const keep = x.map((_, i) => i).filter((i) => refused[i] === undefined);
  const out: PredictedRow[] = refused.map((error) => ({ error: error ?? "" }));
  const put = (rows: readonly number[], p: Prediction): void => rows.forEach((i, k) => (out[i] = rowOf(p, k)));
  try {
    put(keep, model.predict(keep.map((i) => x[i]!)));
  } catch {
    for (const i of keep) {
      try {
        put([i], model.predict([x[i]!]));
      } catch (error) {
        out[i] = { error: `the model could not predict this row: ${(error as Error).message}` };
      }
    }
  }
  return out;
}
