/** One diagnostic value found in a model file, with where it was found. */
export interface DiagnosticValue {
  /** JSON path in the model file, e.g. "training.diagnostics.jitter". */
  readonly path: string;
  readonly value: unknown;
}

/** Training diagnostics of a surrogate and the quality of its training design. */
export interface TrustDiagnostics {
  /** Model family from the model file (`modelType`), or null. */
  readonly modelType: string | null;
  /** Training rows recorded in the model file (`training.n`), or null. */
  readonly trainingRows: number | null;
  /** Hyperparameters reported at a bound of their search range (GP), by path. */
  readonly hyperparametersOnBounds: readonly DiagnosticValue[];
  /** Jitter added to the kernel diagonal (GP). */
  readonly jitter: readonly DiagnosticValue[];
  /** Condition number of the kernel matrix (GP). */
  readonly conditionNumber: readonly DiagnosticValue[];
  /** Epoch at which early stopping kept the weights (NN). */
  readonly earlyStoppingEpoch: readonly DiagnosticValue[];
  /** Training design quality in scaled input space, when given. */
  readonly design: { readonly minDistance: number | null; readonly centredDiscrepancy: number | null } | null;
  /** Plain-language warnings drawn from the values above. */
  readonly warnings: readonly string[];
}

const KEYS: Record<string, keyof Pick<TrustDiagnostics, "hyperparametersOnBounds" | "jitter" | "conditionNumber" | "earlyStoppingEpoch">> = {
  hyperparametersonbounds: "hyperparametersOnBounds",
  onbounds: "hyperparametersOnBounds",
  atbounds: "hyperparametersOnBounds",
  jitter: "jitter",
  conditionnumber: "conditionNumber",
  condition: "conditionNumber",
  earlystoppingepoch: "earlyStoppingEpoch",
  bestepoch: "earlyStoppingEpoch",
  stoppedepoch: "earlyStoppingEpoch",
};

/** Condition numbers above this lose more than ~6 of 16 significant digits in a solve (common practice). */
const ILL_CONDITIONED = 1e10;

/**
 * Gathers training diagnostics from a model file: every field named like hyperparametersOnBounds,
 * jitter, conditionNumber or earlyStoppingEpoch anywhere in it (ensemble members nest their own), plus
 * the design quality given by the caller (surrogate does not compute design metrics itself).
 * @param modelFile - the parsed model file (any JSON value).
 * @param design - min pairwise distance and centred L2 discrepancy of the scaled training inputs, if known.
 * @returns the diagnostics with warnings.
 */
export function collectDiagnostics(
  modelFile: unknown,
  design?: { minDistance?: number | null; centredDiscrepancy?: number | null },
): TrustDiagnostics {
  const found: Record<string, DiagnosticValue[]> = { hyperparametersOnBounds: [], jitter: [], conditionNumber: [], earlyStoppingEpoch: [] };
  const walk = (v: unknown, path: string, depth: number): void => {
    if (depth > 8 || typeof v !== "object" || v === null) return;
    if (Array.isArray(v)) {
      v.forEach((e, i) => walk(e, `${path}[${i}]`, depth + 1));
      return;
    }
    for (const [k, child] of Object.entries(v)) {
      const p = path ? `${path}.${k}` : k;
      const field = KEYS[k.toLowerCase()];
      if (field && child !== null && child !== undefined) found[field]!.push({ path: p, value: child });
      else walk(child, p, depth + 1);
    }
  };
  walk(modelFile, "", 0);
  const file = (typeof modelFile === "object" && modelFile !== null ? modelFile : {}) as {
    modelType?: unknown;
    training?: { n?: unknown };
  };
  const warnings: string[] = [];
  for (const h of found.hyperparametersOnBounds!) {
    const list = Array.isArray(h.value) ? h.value : [h.value];
    if (list.length > 0 && h.value !== false) {
      warnings.push(`Hyperparameters at a bound of their search range (${h.path}: ${JSON.stringify(h.value)}); the fit may be constrained by the range.`);
    }
  }
  for (const j of found.jitter!) {
    if (typeof j.value === "number" && j.value > 0) warnings.push(`Jitter ${j.value} was added to the kernel diagonal (${j.path}); near-duplicate training rows are likely.`);
  }
  for (const c of found.conditionNumber!) {
    if (typeof c.value === "number" && c.value > ILL_CONDITIONED) warnings.push(`Kernel condition number ${c.value.toExponential(2)} (${c.path}) is large; predictions may be numerically fragile.`);
  }
  return {
    modelType: typeof file.modelType === "string" ? file.modelType : null,
    trainingRows: typeof file.training?.n === "number" ? file.training.n : null,
    hyperparametersOnBounds: found.hyperparametersOnBounds!,
    jitter: found.jitter!,
    conditionNumber: found.conditionNumber!,
    earlyStoppingEpoch: found.earlyStoppingEpoch!,
    design: design ? { minDistance: design.minDistance ?? null, centredDiscrepancy: design.centredDiscrepancy ?? null } : null,
    warnings,
  };
}
