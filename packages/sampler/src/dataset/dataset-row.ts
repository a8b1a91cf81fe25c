/** One dataset row: `sample` (the 0-based row of the whole design), each parameter, then each output. */
export type DatasetRow = Readonly<Record<string, number | string | boolean>>;
