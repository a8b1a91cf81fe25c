import { existsSync } from "node:fs";
import { readFile, rm, writeFile } from "node:fs/promises";
import { basename } from "node:path";
import { createCsvWriter, type CsvWriter } from "../csv/create-csv-writer.js";
import type { DesignKind } from "../design/create-design.js";
import type { Evaluator, EvaluatorFunction } from "../evaluator/evaluator.js";
import { resolveEvaluator } from "../evaluator/resolve-evaluator.js";
import type { Scenario } from "../scenario/scenario.js";
import type { DatasetManifest } from "./dataset-manifest.js";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import { formatManifest } from "./format-manifest.js";
import { inputSchemaOf } from "../space/input-schema.js";
import { manifestPathFor } from "./manifest-path-for.js";
import { plateProfileOfColumns } from "./plate-profile-of-columns.js";
import { generateDataset } from "./generate-dataset.js";
import { PACKAGE_VERSION } from "./package-version.js";
import { recoverPartial } from "./recover-partial.js";
import type { Shard } from "./shard.js";
import { shardRange } from "./shard-range.js";
import { claimOutput, type ClaimedOutput } from "../output/claim-output.js";
import { EvaluatorProtocolError } from "../evaluator/evaluator-protocol-error.js";

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
  /** Files the run reads (e.g. the scenario file): an `out` that is one of them is refused. */
  readonly inputs?: readonly string[];
  /** Evaluator (default: the scenario's exact massing evaluator). Not closed here. */
  readonly evaluator?: Evaluator | EvaluatorFunction;
  /** Progress of an optimized design's search (createDesign's onProgress), before the first row. */
  readonly onDesignProgress?: (done: number, total: number) => void;
  /** Called after each row with rows done and rows in this file. */
  readonly onProgress?: (done: number, total: number) => void;
}


/**
 * Writes a dataset CSV and its manifest (streamed: rows are never held). The outputs are claimed first
 * (claimOutput: folder writable, not an input, an existing `out` or manifest only replaced with `force`, and an
 * exclusive lock, so a second run writing the same `out` is refused). The CSV is written under `<out>.partial`,
 * fsynced, hashed from the bytes on disk and renamed when complete. With
 * `resume`, an interrupted run (same scenario, design, seed, n, shard and evaluator, checked against the
 * settings saved beside the partial file) continues after its last complete row: a torn last line is dropped,
 * no row is lost or repeated, and the result is byte-identical to an uninterrupted run.
 * @param scenario - a validated scenario.
 * @param options - output path, n, design, seed, shard, resume, force, evaluator, progress callback.
 * @returns the manifest written.
 * @throws RangeError when `out` exists without `force`, another run writes it, or a partial file does not match this run.
 */
export async function writeDataset(scenario: Scenario, options: WriteDatasetOptions): Promise<DatasetManifest> {
  const fn = "writeDataset";
  if (typeof options !== "object" || options === null || typeof options.out !== "string" || options.out === "") {
    throw new TypeError(`${fn}: options.out must be a non-empty path`);
  }
  const { out } = options;
  const manifestPath = manifestPathFor(out);
  const claim = await claimOutput([out, manifestPath], { fn, force: options.force, inputs: options.inputs, keepTemporary: true });
  try {
    return await writeClaimed(scenario, options, claim);
  } finally {
    await claim.release();
  }
}

async function writeClaimed(scenario: Scenario, options: WriteDatasetOptions, claim: ClaimedOutput): Promise<DatasetManifest> {
  const fn = "writeDataset";
  const { out } = options;
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
  // The in-progress file (the claim's temporary name) and the settings that let `resume` check it is the same run.
  const partial = { csv: claim.temporary(out), settings: `${out}.partial.json` };
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
      const expectedFirst = recovered.rows === 0 ? undefined : start;
      if (recovered.brokenSequenceLine !== undefined) {
        throw new RangeError(
          `${fn}: ${partial.csv} line ${recovered.brokenSequenceLine}: the sample ids are not consecutive (a row missing, repeated or out of order); run without --resume`,
        );
      }
      if (recovered.header[0] !== "sample" || recovered.lastSample !== expectedLast || recovered.firstSample !== expectedFirst) {
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
    await evaluator.finish?.();
  } catch (error) {
    await writer?.close().catch(() => undefined);
    writer = undefined;
    if (error instanceof EvaluatorProtocolError && error.misaligned) {
      // answers of a program without ids may belong to other samples: keep no row of this run for --resume
      await rm(partial.csv, { force: true });
      await rm(partial.settings, { force: true });
    }
    throw error;
  } finally {
    await writer?.close();
  }
  if (header === undefined) throw new RangeError(`${fn}: no rows were generated`);
  const plateProfile = plateProfileOfColumns(header);
  const manifest: DatasetManifest = {
    kind: "floorcast.dataset-manifest",
    formatVersion: 1,
    caution: FLOORCAST_CAUTION,
    ...settings,
    columns: header,
    inputSchema: inputSchemaOf(scenario.parameters),
    ...(plateProfile === undefined ? {} : { plateProfile }),
    rows: total,
    csv: { file: basename(out), ...(await claim.seal(out)) },
  };
  await claim.put(manifestPathFor(out), formatManifest(manifest));
  await claim.commit();
  await rm(partial.settings, { force: true });
  return manifest;
}
