import { datasetManifestSchema, type DatasetManifest } from "./dataset-manifest.js";

/**
 * Serialises a manifest deterministically (fixed key order, two-space indent, final newline).
 * @param manifest - the manifest.
 * @returns its JSON text.
 */
export function formatManifest(manifest: DatasetManifest): string {
  return `${JSON.stringify(datasetManifestSchema.parse(manifest), null, 2)}\n`;
}
