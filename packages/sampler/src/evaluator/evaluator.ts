/** The values an evaluator receives: one sample's parameter values plus the scenario's fixed values. */
export type EvaluatorInput = Readonly<Record<string, number | string | boolean>>;

/** What an evaluator answers: named finite numbers, strings or booleans (the same names for every sample). */
export type EvaluatorOutput = Readonly<Record<string, number | string | boolean>>;

/** Any function, sync or async, from an input record to an output record. */
export type EvaluatorFunction = (input: EvaluatorInput) => EvaluatorOutput | Promise<EvaluatorOutput>;

/** A named evaluator, possibly holding resources (a child process, a worker pool) released by `close`. */
export interface Evaluator {
  /** Recorded in dataset manifests, e.g. "massing-rule-v1" or "command: python3 model.py". */
  readonly name: string;
  /** How many evaluations may usefully run at once (1 for in-process functions). */
  readonly concurrency: number;
  /** Evaluates one sample. */
  evaluate(input: EvaluatorInput): EvaluatorOutput | Promise<EvaluatorOutput>;
  /** Releases resources; the evaluator is unusable afterwards. */
  close(): Promise<void>;
}
