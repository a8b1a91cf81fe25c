import { createReadStream } from "node:fs";
import { stat } from "node:fs/promises";
import { basename } from "node:path";
import { parse } from "csv-parse";
import { parseNumericCell } from "./parse-numeric-cell.js";
import type { ReadTableOptions, TableRow, TableStream } from "./table-types.js";

function checkNames(caller: string, field: string, value: unknown): readonly string[] | undefined {
  if (value === undefined) return undefined;
  if (!Array.isArray(value) || value.some((v) => typeof v !== "string")) {
    throw new TypeError(`${caller}: options.${field} must be an array of column names`);
  }
  return value as string[];
}

function quoteList(names: readonly string[]): string {
  return names.map((n) => JSON.stringify(n)).join(", ");
}

/** Chooses the numeric columns asked for (see ReadTableOptions). */
function numericColumns(header: readonly string[], options: ReadTableOptions, categorical: readonly string[]): string[] {
  if (options.inputs !== undefined || options.targets !== undefined) {
    const chosen = [...(options.inputs ?? []), ...(options.targets ?? [])];
    for (const c of options.columns ?? []) if (!chosen.includes(c)) chosen.push(c);
    return chosen;
  }
  if (options.columns !== undefined) return [...options.columns];
  return header.filter((h) => !categorical.includes(h));
}

/**
 * The implementation of {@link openTableStream}; `caller` starts every error message.
 * @internal
 */
export async function openTableStreamAs(
  caller: string,
  path: string,
  options: ReadTableOptions = {},
): Promise<TableStream> {
  if (typeof path !== "string" || path === "") throw new TypeError(`${caller}: path must be a non-empty string`);
  if (options === null || typeof options !== "object") throw new TypeError(`${caller}: options must be an object`);
  for (const f of ["columns", "inputs", "targets"] as const) checkNames(caller, f, options[f]);
  const categorical = [...(checkNames(caller, "categorical", options.categorical) ?? [])];
  if (options.levels !== undefined) {
    const ok = typeof options.levels === "object" && options.levels !== null &&
      Object.values(options.levels).every((l) => Array.isArray(l) && l.every((v) => typeof v === "string" || typeof v === "number"));
    if (!ok) throw new TypeError(`${caller}: options.levels must map column names to arrays of string or number levels`);
  }
  const file = basename(path);
  try {
    const s = await stat(path);
    if (!s.isFile()) throw new RangeError(`${caller}: ${path} is not a file`);
  } catch (error) {
    if (error instanceof RangeError) throw error;
    throw new RangeError(`${caller}: cannot read ${path}: ${(error as NodeJS.ErrnoException).code ?? String(error)}`);
  }
  const source = createReadStream(path);
  const parser = parse({ bom: true, relax_column_count: true, skip_empty_lines: true, info: true });
  source.on("error", (e) => parser.destroy(e));
  source.pipe(parser);
  const iterator = parser[Symbol.asyncIterator]() as AsyncIterator<{
    record: string[];
    info: { empty_lines: number };
  }>;
  const close = (): void => {
    source.destroy();
    parser.destroy();
  };
  const next = async (): Promise<IteratorResult<{ record: string[]; info: { empty_lines: number } }>> => {
    try {
      return await iterator.next();
    } catch (error) {
      close();
      throw new RangeError(`${caller}: ${file}: ${(error as Error).message}`);
    }
  };
  const first = await next();
  if (first.done === true) {
    close();
    throw new RangeError(`${caller}: ${file} is empty (no header row)`);
  }
  const header = first.value.record;
  const seen = new Set<string>();
  for (const h of header) {
    if (seen.has(h)) {
      close();
      throw new RangeError(`${caller}: ${file} has the column ${JSON.stringify(h)} twice in its header`);
    }
    seen.add(h);
  }
  const columns = numericColumns(header, options, categorical);
  const missing = [...columns, ...categorical].filter((c) => !seen.has(c));
  if (missing.length > 0) {
    close();
    const other = header.length === 1 ? [";", "\t", "|"].find((d) => header[0]!.includes(d)) : undefined;
    const hint = other === undefined ? "" : ` (the header looks ${JSON.stringify(other)}-separated; fields must be separated by commas)`;
    throw new RangeError(
      `${caller}: ${file} is missing column${missing.length > 1 ? "s" : ""} ${quoteList(missing)}; it has ${quoteList(header)}${hint}`,
    );
  }
  const both = columns.filter((c) => categorical.includes(c));
  if (both.length > 0) {
    close();
    throw new RangeError(`${caller}: column ${quoteList(both)} is asked for both as numeric and as categorical`);
  }
  const numericIndex = columns.map((c) => header.indexOf(c));
  const coders = columns.map((c) => levelCoder(options.levels?.[c]));
  const labelIndex = categorical.map((c) => header.indexOf(c));
  let linesBefore = 1 + newlines(header);
  let row = 0;
  async function* rows(): AsyncGenerator<TableRow> {
    try {
      for (;;) {
        const r = await next();
        if (r.done === true) return;
        const { record, info } = r.value;
        row += 1;
        const line = 1 + linesBefore + info.empty_lines;
        linesBefore += 1 + newlines(record);
        const where = `${file} row ${row} (line ${line})`;
        if (record.length !== header.length) {
          throw new RangeError(
            `${caller}: ${where} has ${record.length} field${record.length === 1 ? "" : "s"}; the header has ${header.length}`,
          );
        }
        const values = new Array<number>(numericIndex.length);
        for (let j = 0; j < numericIndex.length; j++) {
          const coder = coders[j];
          const parsed = coder === undefined ? parseNumericCell(record[numericIndex[j]!]!) : coder(record[numericIndex[j]!]!);
          if (typeof parsed === "string") {
            const hint = coder === undefined && categorical.length === 0 && options.columns === undefined ? " (name text columns in options.categorical)" : "";
            throw new RangeError(`${caller}: ${where}, column ${JSON.stringify(columns[j])}: ${parsed}${hint}`);
          }
          values[j] = parsed;
        }
        yield { row, line, values, labels: labelIndex.map((k) => record[k]!) };
      }
    } finally {
      close();
    }
  }
  const generator = rows();
  return {
    header,
    columns,
    categorical,
    close,
    [Symbol.asyncIterator]: () => generator,
  };
}

/**
 * The cell reader of a categorical column with at least one string level: a string level's cell → its position, a
 * number level's cell → the number; anything else → an error message (a string). Undefined for all-number levels.
 */
function levelCoder(levels: readonly (string | number)[] | undefined): ((cell: string) => number | string) | undefined {
  if (levels === undefined || levels.every((l) => typeof l === "number")) return undefined;
  const byText = new Map<string, number>();
  levels.forEach((l, k) => {
    if (typeof l === "string") byText.set(l, k);
  });
  const numbers = new Set(levels.filter((l): l is number => typeof l === "number"));
  const list = levels.map((l) => JSON.stringify(l)).join(", ");
  return (cell) => {
    const k = byText.get(cell);
    if (k !== undefined) return k;
    const v = parseNumericCell(cell);
    if (typeof v === "number" && numbers.has(v)) return v;
    return `${JSON.stringify(cell)} is not one of the levels ${list}`;
  };
}

function newlines(fields: readonly string[]): number {
  let count = 0;
  for (const f of fields) {
    for (let i = f.indexOf("\n"); i !== -1; i = f.indexOf("\n", i + 1)) count++;
  }
  return count;
}

/**
 * Opens a CSV file with a header row for streaming (RFC 4180: quoted fields, CRLF or LF line ends;
 * a UTF-8 byte-order mark is skipped; blank lines are skipped). The header is read and checked before this
 * resolves; data rows are then parsed one at a time, so files far larger than memory can be read.
 * @param path - the CSV file.
 * @param options - which columns to read (see {@link ReadTableOptions}).
 * @returns the open stream; iterate it with `for await`.
 * @throws RangeError naming the file when it cannot be read, is empty, lacks a column (all present columns are
 *   listed), has a ragged row or a non-numeric cell (row, line and column named) — the last two while iterating.
 */
export function openTableStream(path: string, options: ReadTableOptions = {}): Promise<TableStream> {
  return openTableStreamAs("openTableStream", path, options);
}
