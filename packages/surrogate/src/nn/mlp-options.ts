import type { MlpActivation } from "../predict/mlp-payload.js";
import type { NnBackendRequest } from "./tf-backend.js";

/** Learning-rate schedule: halve on a validation plateau, exponential decay per epoch, or constant. */
export type LearningRateSchedule =
  | { readonly kind: "plateau"; readonly factor?: number; readonly patience?: number; readonly minLearningRate?: number }
  | { readonly kind: "exponential"; readonly decay: number }
  | { readonly kind: "constant" };

/** Options of {@link fitMlp}; every field has a default. */
export interface MlpOptions {
  /** Hidden-layer widths, e.g. [64, 64] (default). */
  readonly layers?: readonly number[];
  /** Hidden activation (default "relu"); the output layer is linear. */
  readonly activation?: MlpActivation;
  /** Maximum number of epochs (default 300). */
  readonly epochs?: number;
  /** Mini-batch size (default 32, capped at the training-set size). */
  readonly batchSize?: number;
  /** Initial Adam step size (default 0.003). */
  readonly learningRate?: number;
  /** Learning-rate schedule (default plateau: ×0.5 after 10 epochs without improvement, floor 1e-5). */
  readonly schedule?: LearningRateSchedule;
  /**
   * L2 penalty on the weights (not biases): loss = MSE + (l2 / batch rows) Σ W², so l2 plays the role
   * of scikit-learn's MLPRegressor `alpha` (default 1e-4, as there).
   */
  readonly l2?: number;
  /** Fraction held out for early stopping (default 0.15; 0 trains on everything for `epochs`). */
  readonly validationFraction?: number;
  /** Epochs without validation improvement before stopping (default 30). */
  readonly patience?: number;
  /** Seed of the initial weights, the validation split and the shuffles (default 0). */
  readonly seed?: number;
  /** tfjs backend (default "auto": WebAssembly when it loads, else plain CPU). */
  readonly backend?: NnBackendRequest;
  /** Declared input bounds for the input scaling (default: the training data's range). */
  readonly inputBounds?: { readonly lower: readonly number[]; readonly upper: readonly number[] };
}

/** Options with every default filled in. */
export interface ResolvedMlpOptions {
  readonly layers: readonly number[];
  readonly activation: MlpActivation;
  readonly epochs: number;
  readonly batchSize: number;
  readonly learningRate: number;
  readonly schedule: LearningRateSchedule;
  readonly l2: number;
  readonly validationFraction: number;
  readonly patience: number;
  readonly seed: number;
  readonly backend: NnBackendRequest;
}

function positiveInt(fn: string, name: string, v: unknown): number {
  if (typeof v !== "number") throw new TypeError(`${fn}: options.${name} must be a number`);
  if (!Number.isInteger(v) || v < 1) throw new RangeError(`${fn}: options.${name} must be an integer ≥ 1, got ${v}`);
  return v;
}

function inRange(fn: string, name: string, v: unknown, lo: number, hi: number, openLo: boolean): number {
  if (typeof v !== "number") throw new TypeError(`${fn}: options.${name} must be a number`);
  if (!Number.isFinite(v) || v > hi || v < lo || (openLo && v === lo)) {
    throw new RangeError(`${fn}: options.${name} must be in ${openLo ? "(" : "["}${lo}, ${hi}], got ${v}`);
  }
  return v;
}

/**
 * Fills in defaults and validates {@link MlpOptions}.
 * @throws TypeError for a wrong type, RangeError for a bad value (the message names the option).
 */
export function resolveMlpOptions(fn: string, o: MlpOptions = {}): ResolvedMlpOptions {
  if (typeof o !== "object" || o === null) throw new TypeError(`${fn}: options must be an object`);
  const layers = o.layers ?? [64, 64];
  if (!Array.isArray(layers)) throw new TypeError(`${fn}: options.layers must be an array of widths`);
  layers.forEach((w, i) => positiveInt(fn, `layers[${i}]`, w));
  const activation = o.activation ?? "relu";
  if (activation !== "relu" && activation !== "tanh" && activation !== "elu") {
    throw new RangeError(`${fn}: options.activation must be relu, tanh or elu, got ${String(activation)}`);
  }
  const schedule = o.schedule ?? { kind: "plateau" };
  if (schedule.kind === "plateau") {
    if (schedule.factor !== undefined) inRange(fn, "schedule.factor", schedule.factor, 0, 1, true);
    if (schedule.patience !== undefined) positiveInt(fn, "schedule.patience", schedule.patience);
    if (schedule.minLearningRate !== undefined) inRange(fn, "schedule.minLearningRate", schedule.minLearningRate, 0, 1, false);
  } else if (schedule.kind === "exponential") {
    inRange(fn, "schedule.decay", schedule.decay, 0, 1, true);
  } else if (schedule.kind !== "constant") {
    throw new RangeError(`${fn}: options.schedule.kind must be plateau, exponential or constant`);
  }
  const seed = o.seed ?? 0;
  if (typeof seed !== "number" || !Number.isFinite(seed)) throw new RangeError(`${fn}: options.seed must be a finite number`);
  const backend = o.backend ?? "auto";
  if (backend !== "auto" && backend !== "wasm" && backend !== "cpu") {
    throw new RangeError(`${fn}: options.backend must be wasm, cpu or auto, got ${String(backend)}`);
  }
  return {
    layers: [...layers],
    activation,
    epochs: positiveInt(fn, "epochs", o.epochs ?? 300),
    batchSize: positiveInt(fn, "batchSize", o.batchSize ?? 32),
    learningRate: inRange(fn, "learningRate", o.learningRate ?? 0.003, 0, 1, true),
    schedule,
    l2: inRange(fn, "l2", o.l2 ?? 1e-4, 0, 1, false),
    validationFraction: inRange(fn, "validationFraction", o.validationFraction ?? 0.15, 0, 0.5, false),
    patience: positiveInt(fn, "patience", o.patience ?? 30),
    seed,
    backend,
  };
}
