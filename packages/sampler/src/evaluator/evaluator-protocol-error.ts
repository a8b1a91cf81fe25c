/**
 * An evaluator broke its contract for one sample: a missing, extra, duplicate, out-of-order, unparsable or
 * ill-formed answer. Not a usage error: the CLI exits 1 and names the sample. When `misaligned` is true,
 * answers may already have been paired with the wrong samples (only possible for a program answering in order
 * without ids), so rows written in the same run cannot be trusted and are discarded.
 */
export class EvaluatorProtocolError extends Error {
  override readonly name = "EvaluatorProtocolError";
  /**
   * @param message - what went wrong, naming the sample.
   * @param sample - the sample (design row index) concerned, when known.
   * @param misaligned - whether earlier answers may belong to other samples.
   */
  constructor(
    message: string,
    readonly sample: number | undefined,
    readonly misaligned = false,
  ) {
    super(message);
  }
}
