/**
 * The manifest path of a dataset CSV: `name.csv` → `name.manifest.json` (other names get `.manifest.json` appended).
 * @param csvPath - the CSV path.
 * @returns the manifest path beside it.
 */
export function manifestPathFor(csvPath: string): string {
  return csvPath.endsWith(".csv") ? `${csvPath.slice(0, -4)}.manifest.json` : `${csvPath}.manifest.json`;
}
