export type {
  LimitedBy,
  LotLine,
  MassingInput,
  MassingResult,
  Parcel,
  Point,
  Setbacks,
  SkyPlane,
} from "./massing/massing-types.js";
export type { ReadTableOptions, Table, TableRow, TableStream } from "./csv/table-types.js";
export { readTable } from "./csv/read-table.js";
export { openTableStream } from "./csv/open-table-stream.js";
export { createCsvWriter } from "./csv/create-csv-writer.js";
export type { CsvWriter, CsvWriterOptions } from "./csv/create-csv-writer.js";
export { formatCsvValue } from "./csv/format-csv-value.js";
export type { CsvValue } from "./csv/format-csv-value.js";
