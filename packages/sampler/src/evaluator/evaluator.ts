/** The values an evaluator receives: one design's variable values plus the scenario's or problem's fixed values. */
export type EvaluatorInput = Readonly<Record<string, number | string | boolean>>;

/** What an evaluator answers for one design: named finite numbers, strings or booleans (the same names for every design). */
export type EvaluatorOutput = Readonly<Record<string, number | string | boolean>>;

/** Any function, sync or async, from one input record to its output record (wrapped by functionEvaluator). */
export type EvaluatorFunction = (input: EvaluatorInput) => EvaluatorOutput | Promise<EvaluatorOutput>;

/**
 * Partial derivatives of numeric outputs with respect to numeric inputs at one design:
 * `gradient[output][input]`. Categorical inputs are omitted.
 */
export type OutputGradient = Readonly<Record<string, Readonly<Record<string, number>>>>;

/** What the caller knows about the batch being evaluated. */
export interface BatchContext {
  /**
   * The designs' ids, one per input (their row ids in a dataset's design): external programs echo each with its
   * answer. Dataset generation always gives them; an optimizer does not.
   */
  readonly samples?: readonly number[];
}

/**
 * The one evaluator contract of floorcast, used by dataset generation (`generateDataset`, `floorcast sample`) and by
 * every optimizer: a named function of a batch of designs, possibly holding resources (a child process, a worker
 * pool) released by `close`. Adapters: functionEvaluator, massingEvaluator, commandEvaluator, workerPoolEvaluator;
 * the bench adds the published test functions and the surrogates.
 *
 * `evaluate` answers a batch with one output record per input, in order. In-process evaluators may answer
 * synchronously (dataset generation then spends no promise per row); callers `await` the result either way. A
 * design that cannot be evaluated makes the whole batch reject, naming the design; an optimizer treats an output
 * holding NaN, or lacking an objective or constraint, as infeasible. `O` narrows the output records where an
 * evaluator is known to answer numbers only (the bench's exact and surrogate evaluators).
 */
export interface Evaluator<O extends EvaluatorOutput = EvaluatorOutput> {
  /** Recorded in dataset manifests, e.g. "massing-rule-v1" or "command: python3 model.py". */
  readonly name: string;
  /** How many designs may usefully be in flight at once (1 for in-process functions). */
  readonly concurrency: number;
  /** Evaluates a batch of designs; `context.samples` gives their ids (one per input). */
  evaluate(batch: readonly EvaluatorInput[], context?: BatchContext): readonly O[] | Promise<readonly O[]>;
  /** Optional (surrogates): d output / d input per design, used by the gradient optimizer. */
  gradient?(batch: readonly EvaluatorInput[]): Promise<readonly OutputGradient[]>;
  /**
   * Optional: called once every sample has its answer, before a dataset is committed; waits for the evaluator
   * to finish and rejects (EvaluatorProtocolError) when it broke its protocol after the last answer was
   * read (e.g. an external program wrote an extra answer, or answered fewer lines than it was sent).
   */
  finish?(): Promise<void>;
  /** Releases resources; the evaluator is unusable afterwards. */
  close(): Promise<void>;
}
