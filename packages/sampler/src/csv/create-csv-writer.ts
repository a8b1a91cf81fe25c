import { createWriteStream } from "node:fs";
import { once } from "node:events";
import { pipeline } from "node:stream/promises";
import type { Writable } from "node:stream";
import { stringify } from "csv-stringify";
import { formatCsvValue, type CsvValue } from "./format-csv-value.js";

/** Options of {@link createCsvWriter}. */
export interface CsvWriterOptions {
  /** Write the header row first (default true). */
  readonly header?: boolean;
  /** Append to an existing file instead of replacing it (only when the target is a path). */
  readonly append?: boolean;
}

/** A streaming CSV writer: rows are formatted and written as they come, never held. */
export interface CsvWriter {
  /** The column names, in order. */
  readonly columns: readonly string[];
  /** Data rows written so far. */
  readonly rowsWritten: number;
  /** Writes one row (an array in column order, or a record keyed by column name); waits while the file is busy. */
  write(row: readonly CsvValue[] | Readonly<Record<string, CsvValue>>): Promise<void>;
  /** Ends the file and waits until every byte is written. */
  close(): Promise<void>;
}

/**
 * Opens a streaming CSV writer (csv-stringify). Lines end in LF; a field is quoted when it holds a comma,
 * a double quote (doubled inside), CR or LF, as RFC 4180 §2 items 6–7 require (a lone CR is quoted too, so
 * readers that take it for a line end still see one field). Numbers are written with
 * {@link formatCsvValue}, so the same values always give the same bytes.
 * @param target - a file path or a writable stream.
 * @param columns - the column names.
 * @param options - header and append flags.
 * @returns the writer.
 * @throws TypeError/RangeError for bad columns; `write` rejects a row of the wrong length or a missing field.
 */
export function createCsvWriter(
  target: string | Writable,
  columns: readonly string[],
  options: CsvWriterOptions = {},
): CsvWriter {
  if (!Array.isArray(columns) || columns.some((c) => typeof c !== "string")) {
    throw new TypeError("createCsvWriter: columns must be an array of strings");
  }
  if (columns.length === 0) throw new RangeError("createCsvWriter: columns must not be empty");
  if (new Set(columns).size !== columns.length) throw new RangeError("createCsvWriter: columns must be unique");
  const names = [...columns];
  const sink: Writable =
    typeof target === "string" ? createWriteStream(target, { flags: options.append === true ? "a" : "w", highWaterMark: 1 << 20 }) : target;
  const stringifier = stringify({ record_delimiter: "unix", quoted_match: /\r/ });
  const done = pipeline(stringifier, sink);
  let failure: unknown;
  done.catch((e: unknown) => {
    failure = e;
  });
  let rowsWritten = 0;
  const push = async (cells: string[]): Promise<void> => {
    if (failure !== undefined) throw failure;
    if (!stringifier.write(cells)) await Promise.race([once(stringifier, "drain"), done]);
  };
  const ready = options.header === false ? Promise.resolve() : push(names);
  return {
    columns: names,
    get rowsWritten() {
      return rowsWritten;
    },
    async write(row) {
      await ready;
      let cells: string[];
      if (Array.isArray(row)) {
        if (row.length !== names.length) {
          throw new RangeError(`CsvWriter.write: row ${rowsWritten + 1} has ${row.length} values, expected ${names.length}`);
        }
        cells = row.map((v, j) => formatCsvValue(v as CsvValue, `column ${JSON.stringify(names[j])}`));
      } else {
        const rec = row as Readonly<Record<string, CsvValue>>;
        cells = names.map((c) => {
          const v = rec[c];
          if (v === undefined) throw new RangeError(`CsvWriter.write: row ${rowsWritten + 1} lacks ${JSON.stringify(c)}`);
          return formatCsvValue(v, `column ${JSON.stringify(c)}`);
        });
      }
      await push(cells);
      rowsWritten += 1;
    },
    async close() {
      await ready;
      stringifier.end();
      await done;
    },
  };
}
