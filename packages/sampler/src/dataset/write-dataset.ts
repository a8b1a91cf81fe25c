import { existsSync } from "node:fs";
import { readFile, rename, rm, stat, writeFile } from "node:fs/promises";
import { basename, dirname } from "node:path";
import { createCsvWriter, type CsvWriter } from "../csv/create-csv-writer.js";
import type { DesignKind } from "../design/create-design.js";
import type { Evaluator, EvaluatorFunction } from "../evaluator/evaluator.js";
import { resolveEvaluator } from "../evaluator/resolve-evaluator.js";
import type { Scenario } from "../scenario/scenario.js";
import { DATASET_CAUTION, type DatasetManifest } from "./dataset-manifest.js";
import { formatManifest } from "./format-manifest.js";
import { inputSchemaOf } from "../space/input-schema.js";
import { manifestPathFor } from "./manifest-path-for.js";
import { plateProfileOfColumns } from "./plate-profile-of-columns.js";
import { generateDataset } from "./generate-dataset.js";
import { PACKAGE_VERSION } from "./package-version.js";
import { recoverPartial } from "./recover-partial.js";
import type { Shard } from "./shard.js";
import { shardRange } from "./shard-range.js";
import { sha256File } from "./sha256-file.js";

/** Options of {@link writeDataset}. */
export interface WriteDatasetOptions {
  /** The CSV to write; its manifest goes beside it (manifestPathFor). */
  readonly out: string;
  readonly n: number;
  readonly design: DesignKind;
  readonly seed: number | string;
  readonly shard?: Shard;
  /** Continue an interrupted run from its last complete row. */
  readonly resume?: boolean;
  /** Replace an existing output file. */
  readonly force?: boolean;
  /** Evaluator (default: the scenario's exact massing evaluator). Not closed here. */
  readonly evaluator?: Evaluator | EvaluatorFunction;
  /** Progress of an optimised design's search (createDesign's onProgress), before the first row. */
  readonly onDesignProgress?: (done: number, total: number) => void;
  /** Called after each row with rows done and rows in this file. */
  readonly onProgress?: (done: number, total: number) => void;
}

/** The in-progress file of `out` and the settings file that lets `resume` check it belongs to the same run. */
function partialPaths(out: string): { csv: string; settings: string } {
  return { csv: `${out}.partial`, settings: `${out}.partial.json` };
}

/**
 * Writes a dataset CSV and its manifest (streamed: rows are never held). The CSV is written under
 * `<out>.partial` and renamed when complete; an existing `out` is never replaced unless `force` is set. With
 * `resume`, an interrupted run (same scenario, design, seed, n, shard and evaluator, checked against the
 * settings saved beside the partial file) continues after its last complete row: a torn last line is dropped,
 * no row is lost or repeated, and the result is byte-identical to an uninterrupted run.
 * @param scenario - a validated scenario.
 * @param options - output path, n, design, seed, shard, resume, force, evaluator, progress callback.
 * @returns the manifest written.
 * @throws RangeError when `out` exists without `force`, or a partial file does not match this run.
 */
export async function writeDataset(scenario: Scenario, options: WriteDatasetOptions): Promise<DatasetManifest> {
  const fn = "writeDataset";
  if (typeof options !== "object" || options === null || typeof options.out !== "string" || options.out === "") {
    throw new TypeError(`${fn}: options.out must be a non-empty path`);
  }
  const { out } = options;
  if (existsSync(out) && options.force !== true) {
    throw new RangeError(`${fn}: ${out} already exists; use --force (force: true) to replace it`);
  }
  if (!existsSync(dirname(out))) throw new RangeError(`${fn}: the folder of ${out} does not exist`);
  const shard = options.shard ?? { index: 1, count: 1 };
  const { start, end } = shardRange(options.n, shard);
  const evaluator = resolveEvaluator(scenario, options.evaluator);
  const settings = {
    scenario: { name: scenario.name, file: scenario.fileName, sha256: scenario.sha256 },
    design: options.design,
    seed: options.seed,
    n: options.n,
    shard: { index: shard.index, count: shard.count, start, end },
    evaluator: evaluator.name,
    packageVersion: PACKAGE_VERSION,
  };
  const settingsText = `${JSON.stringify(settings, null, 2)}\n`;
  const partial = partialPaths(out);
  let done = 0;
  let header: string[] | undefined;
  if (options.resume === true && existsSync(partial.csv)) {
    const saved = existsSync(partial.settings) ? await readFile(partial.settings, "utf8") : undefined;
    if (saved !== settingsText) {
      throw new RangeError(
        `${fn}: ${partial.csv} was started with other settings (scenario, design, seed, n, shard or evaluator); ` +
          `run without --resume to start again`,
      );
    }
    const recovered = await recoverPartial(partial.csv);
    if (recovered !== undefined) {
      const expectedLast = recovered.rows === 0 ? undefined : start + recovered.rows - 1;
      if (recovered.header[0] !== "sample" || recovered.lastSample !== expectedLast) {
        throw new RangeError(`${fn}: ${partial.csv} does not hold rows ${start}… of this run; run without --resume`);
      }
      done = recovered.rows;
      header = recovered.header;
    }
  }
  if (header === undefined) {
    await rm(partial.csv, { force: true });
    await writeFile(partial.settings, settingsText);
  }
  const total = end - start;
  let writer: CsvWriter | undefined;
  try {
    for await (const row of generateDataset(scenario, { ...options, shard, skip: done, evaluator })) {
      if (writer === undefined) {
        const columns = Object.keys(row);
        if (header !== undefined && (header.length !== columns.length || header.some((h, j) => h !== columns[j]))) {
          throw new RangeError(`${fn}: ${partial.csv} has other columns than this run; run without --resume`);
        }
        writer = createCsvWriter(partial.csv, columns, { header: header === undefined, append: header !== undefined });
        header = columns;
      }
      await writer.write(row);
      done += 1;
      options.onProgress?.(done, total);
    }
  } finally {
    await writer?.close();
  }
  if (header === undefined) throw new RangeError(`${fn}: no rows were generated`);
  const plateProfile = plateProfileOfColumns(header);
  const manifest: DatasetManifest = {
    kind: "floorcast.dataset-manifest",
    formatVersion: 1,
    caution: DATASET_CAUTION,
    ...settings,
    columns: header,
    inputSchema: inputSchemaOf(scenario.parameters),
    ...(plateProfile === undefined ? {} : { plateProfile }),
    rows: total,
    csv: { file: basename(out), bytes: (await stat(partial.csv)).size, sha256: await sha256File(partial.csv) },
  };
  const manifestPath = manifestPathFor(out);
  await writeFile(`${manifestPath}.partial`, formatManifest(manifest));
  await rename(partial.csv, out);
  await rename(`${manifestPath}.partial`, manifestPath);
  await rm(partial.settings, { force: true });
  return manifest;
}
