/** Options of {@link readTable} and {@link openTableStream}. */
export interface ReadTableOptions {
  /**
   * Numeric columns to read, in this order. When absent (and `inputs`/`targets` are absent too),
   * every column not named in `categorical` is read as a number.
   */
  readonly columns?: readonly string[];
  /** Columns read as strings (e.g. `limitedBy`), in this order. */
  readonly categorical?: readonly string[];
  /** Input columns; numeric. With `targets`, the result also holds `x` and `y`. */
  readonly inputs?: readonly string[];
  /** Target columns; numeric. */
  readonly targets?: readonly string[];
  /**
   * Levels of categorical numeric columns (name → levels, e.g. from an input schema). A column whose levels
   * include a string is read as text and coded as the codec codes model rows: a string level as its position in
   * the list, a number level as itself; any other cell is refused, naming row and column. Columns whose levels are
   * all numbers are read as numbers, as without this option.
   */
  readonly levels?: Readonly<Record<string, readonly (string | number)[]>>;
}

/** One data row as read by {@link openTableStream}. */
export interface TableRow {
  /** 1-based data row number (the header is row 0). */
  readonly row: number;
  /** 1-based line of the file on which the row starts (the header is line 1). */
  readonly line: number;
  /** Values of the numeric columns, in `TableStream.columns` order. */
  readonly values: number[];
  /** Values of the categorical columns, in `TableStream.categorical` order. */
  readonly labels: string[];
}

/** A CSV file opened for streaming: the header is read, data rows follow one at a time. */
export interface TableStream extends AsyncIterable<TableRow> {
  /** Every column of the file, in file order. */
  readonly header: readonly string[];
  /** Numeric columns read, in order. */
  readonly columns: readonly string[];
  /** Categorical (string) columns read, in order. */
  readonly categorical: readonly string[];
  /** Stops reading and releases the file (also done when iteration ends or breaks). */
  close(): void;
}

/** A whole CSV file read into memory by {@link readTable}. */
export interface Table {
  /** Every column of the file, in file order. */
  readonly header: string[];
  /** Numeric columns read, in order (`inputs` then `targets` when those were given). */
  readonly columns: string[];
  /** `rows[i][j]`: data row i, numeric column j. */
  readonly rows: number[][];
  /** Categorical columns: name → one string per data row. */
  readonly categorical: Record<string, string[]>;
  /** Input column names (empty when not asked for). */
  readonly inputs: string[];
  /** Target column names (empty when not asked for). */
  readonly targets: string[];
  /** `x[i]`: the input values of row i (empty arrays when no inputs were asked for). */
  readonly x: number[][];
  /** `y[i]`: the target values of row i (empty arrays when no targets were asked for). */
  readonly y: number[][];
}
