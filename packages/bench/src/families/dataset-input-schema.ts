import { existsSync } from "node:fs";
import { basename } from "node:path";
import { manifestPathFor, readManifest, type InputSchemaEntry } from "@floorcast/sampler";

/**
 * The input schema of the chosen input columns of a dataset, read from the manifest beside its CSV (written by
 * `floorcast sample`), in the order of `inputs`; undefined when there is no manifest (a user's own CSV), and
 * undefined with a note through `say` when the manifest records no schema or an input is not a sampled column
 * (e.g. an output used as an input).
 * @param csvPath - the dataset CSV.
 * @param inputs - the input columns, in the model's order.
 * @param say - writes one note line.
 * @returns the schema entries, or undefined.
 * @throws RangeError when a manifest is present but malformed.
 */
export async function datasetInputSchema(csvPath: string, inputs: readonly string[], say: (line: string) => void): Promise<InputSchemaEntry[] | undefined> {
  const path = manifestPathFor(csvPath);
  if (!existsSync(path)) return undefined;
  const manifest = await readManifest(csvPath, "fit");
  const byName = new Map((manifest.inputSchema ?? []).map((e) => [e.name, e]));
  const missing = inputs.filter((n) => !byName.has(n));
  if (missing.length > 0) {
    say(`fit: note: ${basename(path)} describes no sampled input ${missing.join(", ")}, so the model file records no input schema`);
    return undefined;
  }
  return inputs.map((n) => byName.get(n)!);
}
