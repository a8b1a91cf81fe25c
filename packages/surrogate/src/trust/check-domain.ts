import { z } from "zod";
import type { Surrogate } from "../surrogate-types.js";
import { checkMatrix } from "../check-training-data.js";
import { DomainError } from "./domain-error.js";
import { modelTrainingInputs } from "./model-training-inputs.js";
import { buildValidityDomain, nearestDistance, scaleToDomain, type ValidityDomain } from "./validity-domain.js";

/** Optional capability of a surrogate that knows its own domain of validity. */
export interface DomainAware {
  validityDomain(): ValidityDomain;
}

/** Domain check of one row. */
export interface DomainRowCheck {
  /** Inside the training box (inputs compared with a relative tolerance of 1e-9 of each range). */
  readonly inBounds: boolean;
  /** Names of the inputs outside the training box. */
  readonly outOfBounds: readonly string[];
  /** Scaled distance to the nearest training row. */
  readonly nnDistance: number;
  /** In the box and nnDistance ≤ threshold. */
  readonly inDomain: boolean;
}

/** Result of checking rows against a domain of validity. */
export interface DomainCheck {
  readonly rows: readonly DomainRowCheck[];
  /** 0-based indices of rows outside. */
  readonly outside: readonly number[];
  readonly nnThreshold: number;
}

const domainSchema = z.object({
  kind: z.literal("floorcast.validity-domain"),
  formatVersion: z.literal(1),
  inputs: z.array(z.string()),
  lower: z.array(z.number()),
  upper: z.array(z.number()),
  percentile: z.number().gt(0).lte(1),
  nnThreshold: z.number().nonnegative(),
  points: z.array(z.array(z.number())).min(1),
});

/**
 * The validity domain a surrogate carries: its `validityDomain()` capability, else the `training.domain`
 * of its model file (validated), else one built from the training inputs its file stores (a GP's
 * `payload.trainingInputs`).
 * @param model - a surrogate.
 * @returns the domain, or null when the model carries none.
 */
export function domainOfModel(model: Surrogate): ValidityDomain | null {
  const aware = model as Partial<DomainAware>;
  if (typeof aware.validityDomain === "function") return aware.validityDomain();
  const file = model.toJSON() as { training?: { domain?: unknown } } | null;
  const raw = file?.training?.domain;
  if (raw === undefined) {
    const x = modelTrainingInputs(file);
    return x && x.length >= 2 ? buildValidityDomain(model.inputs, x) : null;
  }
  const parsed = domainSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new RangeError(`domainOfModel: model file training.domain.${issue.path.join(".")}: ${issue.message}`);
  }
  return parsed.data as ValidityDomain;
}

/**
 * Flags rows outside a surrogate's domain of validity (training bounds and NN distance threshold,
 * see ValidityDomain). In strict mode it refuses them.
 * @param source - a ValidityDomain, or a surrogate that carries one (see domainOfModel).
 * @param x - rows × inputs (finite), in the domain's input order.
 * @param options.strict - throw a DomainError naming the rows outside instead of flagging them.
 * @returns per-row flags.
 */
export function checkDomain(
  source: ValidityDomain | Surrogate,
  x: readonly (readonly number[])[],
  options: { strict?: boolean } = {},
): DomainCheck {
  const fn = "checkDomain";
  if (typeof source !== "object" || source === null) throw new TypeError(`${fn}: source must be a domain or a surrogate`);
  const domain =
    (source as ValidityDomain).kind === "floorcast.validity-domain" ? (source as ValidityDomain) : domainOfModel(source as Surrogate);
  if (domain === null) throw new TypeError(`${fn}: the model carries no validity domain; build one from its training data`);
  checkMatrix(fn, "x", x, domain.inputs.length);
  const rows = x.map((r): DomainRowCheck => {
    const outOfBounds = domain.inputs.filter((_, j) => {
      const tol = 1e-9 * Math.max(domain.upper[j]! - domain.lower[j]!, Math.abs(domain.upper[j]!), 1e-300);
      return r[j]! < domain.lower[j]! - tol || r[j]! > domain.upper[j]! + tol;
    });
    const nnDistance = nearestDistance(domain.points, scaleToDomain(domain, r));
    const inBounds = outOfBounds.length === 0;
    return { inBounds, outOfBounds, nnDistance, inDomain: inBounds && nnDistance <= domain.nnThreshold };
  });
  const outside = rows.flatMap((r, i) => (r.inDomain ? [] : [i]));
  if (options.strict && outside.length > 0) {
    const shown = outside.slice(0, 20).join(", ") + (outside.length > 20 ? `, … (${outside.length} in all)` : "");
    throw new DomainError(`${fn}: rows ${shown} (0-based) are outside the model's domain of validity`, outside);
  }
  return { rows, outside, nnThreshold: domain.nnThreshold };
}
