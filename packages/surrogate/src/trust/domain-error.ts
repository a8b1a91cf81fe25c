/**
 * Thrown by a strict domain check when rows fall outside a surrogate's domain of validity.
 * `rows` are 0-based row indices; the message names them.
 */
export class DomainError extends RangeError {
  override readonly name = "DomainError";
  /** 0-based indices of the rows outside the domain. */
  readonly rows: readonly number[];
  constructor(message: string, rows: readonly number[]) {
    super(message);
    this.rows = rows;
  }
}
