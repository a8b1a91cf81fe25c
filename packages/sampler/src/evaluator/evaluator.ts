/** The values an evaluator receives: one sample's parameter values plus the scenario's fixed values. */
export type EvaluatorInput = Readonly<Record<string, number | string | boolean>>;

/** What an evaluator answers: named finite numbers, strings or booleans (the same names for every sample). */
export type EvaluatorOutput = Readonly<Record<string, number | string | boolean>>;

/** Any function, sync or async, from an input record to an output record. */
export type EvaluatorFunction = (input: EvaluatorInput) => EvaluatorOutput | Promise<EvaluatorOutput>;

/** What the caller knows about the sample being evaluated. */
export interface EvaluationContext {
  /** The sample's index in the design (its row id): external programs echo it with their answer. */
  readonly sample: number;
}

/** A named evaluator, possibly holding resources (a child process, a worker pool) released by `close`. */
export interface Evaluator {
  /** Recorded in dataset manifests, e.g. "massing-rule-v1" or "command: python3 model.py". */
  readonly name: string;
  /** How many evaluations may usefully run at once (1 for in-process functions). */
  readonly concurrency: number;
  /** Evaluates one sample; `context.sample` is its id in the design (dataset generation always gives it). */
  evaluate(input: EvaluatorInput, context?: EvaluationContext): EvaluatorOutput | Promise<EvaluatorOutput>;
  /**
   * Optional: called once every sample has its answer, before a dataset is committed; waits for the evaluator
   * to finish and rejects (EvaluatorProtocolError) when it broke its protocol after the last answer was
   * read (e.g. an external program wrote an extra answer, or answered fewer lines than it was sent).
   */
  finish?(): Promise<void>;
  /** Releases resources; the evaluator is unusable afterwards. */
  close(): Promise<void>;
}
