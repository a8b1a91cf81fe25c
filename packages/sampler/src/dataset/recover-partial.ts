import { createReadStream } from "node:fs";
import { open, stat, truncate } from "node:fs/promises";
import { parse } from "csv-parse";

/** What survives of an interrupted dataset file. */
export interface RecoveredPartial {
  /** The header row. */
  readonly header: string[];
  /** Complete data rows kept. */
  readonly rows: number;
  /** `sample` of the last kept row (undefined when none). */
  readonly lastSample: number | undefined;
  /** `sample` of the first kept row (undefined when none). */
  readonly firstSample: number | undefined;
  /** Line number (1 = header) of the first kept row whose `sample` is not the previous row's + 1, if any. */
  readonly brokenSequenceLine: number | undefined;
  /** Bytes dropped from the end (a torn last line). */
  readonly dropped: number;
}

/**
 * Finds the last complete row of an interrupted dataset CSV and truncates the file just after it: a last line
 * without its line end, with too few fields, or with an unclosed quote is torn and dropped.
 * @param path - the partial CSV (written by writeDataset).
 * @returns header, rows kept and bytes dropped; undefined when not even the header is complete (start over).
 * @throws RangeError when a row before the last is malformed (the file is not an interrupted dataset).
 */
export async function recoverPartial(path: string): Promise<RecoveredPartial | undefined> {
  const size = (await stat(path)).size;
  if (size === 0) return undefined;
  const fh = await open(path, "r");
  const last = Buffer.alloc(1);
  await fh.read(last, 0, 1, size - 1);
  await fh.close();
  const endsWithNewline = last[0] === 0x0a;
  const parser = parse({ relax_column_count: true, info: true, skip_empty_lines: false });
  createReadStream(path).pipe(parser);
  let header: string[] | undefined;
  let good = 0;
  let rows = 0;
  let lastSample: number | undefined;
  let firstSample: number | undefined;
  let brokenSequenceLine: number | undefined;
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { bytes: number } }>) {
      const complete = info.bytes < size || endsWithNewline;
      if (header === undefined) {
        if (!complete) break;
        header = record;
        good = info.bytes;
        continue;
      }
      if (!complete || record.length !== header.length) {
        if (complete && info.bytes < size) {
          throw new RangeError(`recoverPartial: ${path}: a row before the last has ${record.length} fields, the header ${header.length}`);
        }
        break;
      }
      good = info.bytes;
      rows += 1;
      const id = Number(record[0]);
      if (rows === 1) firstSample = id;
      else if (brokenSequenceLine === undefined && !(id === lastSample! + 1)) brokenSequenceLine = rows + 1;
      lastSample = id;
    }
  } catch (error) {
    if (error instanceof RangeError) throw error;
    // an unclosed quote at the end of the file: the rows before it are kept
  } finally {
    parser.destroy();
  }
  if (header === undefined) return undefined;
  if (good < size) await truncate(path, good);
  return { header, rows, lastSample, firstSample, brokenSequenceLine, dropped: size - good };
}
