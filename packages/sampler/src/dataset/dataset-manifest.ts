import { readFile } from "node:fs/promises";
import { basename } from "node:path";
import { z } from "zod";

/** Shown in every manifest: what the numbers are and are not. */
export const DATASET_CAUTION =
  "Estimates for early feasibility studies, not a zoning determination; local codes and licensed professionals decide.";

const sha = z.string().regex(/^[0-9a-f]{64}$/, "must be a hex SHA-256");
const count = z.number().int().nonnegative();

/** The zod schema of a dataset manifest (format version 1). */
export const datasetManifestSchema = z.strictObject({
  kind: z.literal("floorcast.dataset-manifest"),
  formatVersion: z.literal(1),
  caution: z.string(),
  scenario: z.strictObject({ name: z.string(), file: z.string(), sha256: sha }),
  design: z.string(),
  seed: z.union([z.number(), z.string()]),
  n: count,
  shard: z.strictObject({ index: count, count, start: count, end: count }),
  evaluator: z.string(),
  packageVersion: z.string(),
  columns: z.array(z.string()),
  rows: count,
  csv: z.strictObject({ file: z.string(), bytes: count, sha256: sha }),
});

/**
 * The manifest written beside each dataset CSV: where the rows came from (scenario and its SHA-256, design,
 * seed, n, shard, evaluator, package version) and the SHA-256 (FIPS 180-4) of the CSV's bytes.
 */
export type DatasetManifest = z.infer<typeof datasetManifestSchema>;

/**
 * The manifest path of a dataset CSV: `name.csv` → `name.manifest.json` (other names get `.manifest.json` appended).
 * @param csvPath - the CSV path.
 * @returns the manifest path beside it.
 */
export function manifestPathFor(csvPath: string): string {
  return csvPath.endsWith(".csv") ? `${csvPath.slice(0, -4)}.manifest.json` : `${csvPath}.manifest.json`;
}

/**
 * Serialises a manifest deterministically (fixed key order, two-space indent, final newline).
 * @param manifest - the manifest.
 * @returns its JSON text.
 */
export function formatManifest(manifest: DatasetManifest): string {
  return `${JSON.stringify(datasetManifestSchema.parse(manifest), null, 2)}\n`;
}

/**
 * Reads and validates the manifest beside a dataset CSV.
 * @param csvPath - the CSV path (its manifest is manifestPathFor(csvPath)).
 * @param caller - starts error messages.
 * @returns the manifest.
 * @throws RangeError naming the manifest file and, for schema errors, the path and problem.
 */
export async function readManifest(csvPath: string, caller = "readManifest"): Promise<DatasetManifest> {
  const path = manifestPathFor(csvPath);
  let text: string;
  try {
    text = await readFile(path, "utf8");
  } catch (error) {
    throw new RangeError(`${caller}: cannot read the manifest ${path}: ${(error as NodeJS.ErrnoException).code ?? String(error)}`);
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new RangeError(`${caller}: ${basename(path)}: not valid JSON: ${(error as Error).message}`);
  }
  const r = datasetManifestSchema.safeParse(value);
  if (!r.success) {
    const problems = r.error.issues.map((i) => `${i.path.map(String).join(".") || "(top level)"}: ${i.message}`);
    throw new RangeError(`${caller}: ${basename(path)}: ${problems.join("; ")}`);
  }
  return r.data;
}
