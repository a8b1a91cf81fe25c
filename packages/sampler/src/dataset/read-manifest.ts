import { readFile } from "node:fs/promises";
import { basename } from "node:path";
import { datasetManifestSchema, type DatasetManifest } from "./dataset-manifest.js";
import { manifestPathFor } from "./manifest-path-for.js";

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
