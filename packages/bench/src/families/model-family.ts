import type { Surrogate, SurrogateTrainer, TrainingData } from "@floorcast/surrogate";

/** Parsed fit options, keyed by the camel-case name of the long flag (`--batch-size` → `batchSize`). */
export type FitOptions = Readonly<Record<string, string | boolean | undefined>>;

/** One option a family adds to `floorcast fit`, with its default (the one default every caller uses). */
export interface FamilyOption {
  /** Commander flags, e.g. "--restarts <n>". */
  readonly flags: string;
  readonly description: string;
  /** Default value as the command line would give it (none: the option is off or unset). */
  readonly default?: string;
}

/**
 * A surrogate family as `floorcast fit`, `assess` refits and the benchmark use it: its `--model` name, its options
 * with their defaults, and its fitter. A family lives in one folder under `families/` and is registered with one
 * line in `model-families.ts`.
 */
export interface ModelFamily {
  /** The `--model` value, e.g. "gp". */
  readonly name: string;
  /** One line for the help text. */
  readonly summary: string;
  readonly options: readonly FamilyOption[];
  /**
   * Fits the family on data with parsed options (defaults filled in); `say` prints notes. Wrong option values
   * throw UsageError naming the flag.
   */
  fit?(data: TrainingData, opts: FitOptions, seed: number, say: (line: string) => void): Promise<Surrogate>;
  /**
   * Instead of `fit`, for a family that reads more of the CSV than the input and target columns (the plate
   * profile): fits from the file itself. `--ensemble` and `--conformal` do not apply.
   */
  fitCsv?(path: string, inputs: readonly string[], targets: readonly string[], opts: FitOptions, seed: number, say: (line: string) => void): Promise<Surrogate>;
  /** The model file `modelType` this family writes, e.g. "gp" (the nn family writes "mlp"). */
  readonly modelType: string;
  /**
   * A trainer refitting a model of this family with the settings its file records (assess --folds), when it can.
   * `trainCsv` is the training CSV the rows come from (assess --train), for a family that reads more of it than
   * the input and target columns (the plate profile).
   */
  refit?(file: { readonly payload?: unknown; readonly training?: Readonly<Record<string, unknown>> }, trainCsv?: string): SurrogateTrainer;
}

/**
 * The options key of a flag: the long flag's name in camel case, as commander stores it.
 * @param flags - e.g. "--batch-size <n>".
 * @returns e.g. "batchSize".
 */
export function optionKey(flags: string): string {
  const long = flags.split(/[ ,|]+/).find((f) => f.startsWith("--")) ?? flags;
  return long.replace(/^--/, "").replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());
}

/**
 * The defaults of a list of options, keyed as parsed options are.
 * @param options - the options.
 * @returns key → default, for options that have one.
 */
export function optionDefaults(options: readonly FamilyOption[]): Record<string, string> {
  return Object.fromEntries(options.filter((o) => o.default !== undefined).map((o) => [optionKey(o.flags), o.default!]));
}
