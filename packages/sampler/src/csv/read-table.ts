import { basename } from "node:path";
import { openTableStreamAs } from "./open-table-stream.js";
import type { ReadTableOptions, Table } from "./table-types.js";

/**
 * Reads a whole CSV file with a header row into numeric columns (plus string columns named as categorical).
 * Parsing follows RFC 4180 (quoted fields, doubled quotes, CRLF or LF); a UTF-8 byte-order mark is skipped.
 * @param path - the CSV file.
 * @param options - `columns` to read (default: every column not categorical), `categorical` string columns, and
 *   optionally `inputs`/`targets`, which also fill `x` and `y`.
 * @returns the table; numeric values are parsed exactly by `Number` (shortest round-trip text reads back bit for bit).
 * @throws RangeError naming the file for an unreadable or empty file, a file with no data rows, missing columns
 *   (listing the ones present), a ragged row (row named) or a non-numeric cell (row and column named).
 */
export async function readTable(path: string, options: ReadTableOptions = {}): Promise<Table> {
  const stream = await openTableStreamAs("readTable", path, options);
  const rows: number[][] = [];
  const labels: string[][] = stream.categorical.map(() => []);
  for await (const r of stream) {
    rows.push(r.values);
    for (let k = 0; k < r.labels.length; k++) labels[k]!.push(r.labels[k]!);
  }
  if (rows.length === 0) throw new RangeError(`readTable: ${basename(path)} has a header but no data rows`);
  const categorical: Record<string, string[]> = {};
  stream.categorical.forEach((c, k) => {
    categorical[c] = labels[k]!;
  });
  const inputs = [...(options.inputs ?? [])];
  const targets = [...(options.targets ?? [])];
  const columns = [...stream.columns];
  const inIdx = inputs.map((c) => columns.indexOf(c));
  const tgIdx = targets.map((c) => columns.indexOf(c));
  return {
    header: [...stream.header],
    columns,
    rows,
    categorical,
    inputs,
    targets,
    x: rows.map((r) => inIdx.map((j) => r[j]!)),
    y: rows.map((r) => tgIdx.map((j) => r[j]!)),
  };
}
