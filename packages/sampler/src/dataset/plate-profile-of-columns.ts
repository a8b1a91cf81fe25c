/** How the manifest describes plate-profile columns (README "Plate profiles"). */
export const PLATE_PROFILE_NAMING =
  "rule_<slot>: the row's value of a stacking-rule slot; plateArea_<k>, plateWidth_<k>: area (m²) and least width (m) " +
  "of the plate of storey k (top at k × floorHeight) after the yards, the coverage cap and the sky exposure plane, " +
  "before the plate and FAR stops; 0 above the row's height limit";

/**
 * The manifest's `plateProfile` entry for a dataset's columns: present when they hold `plateArea_1…plateArea_K`
 * and `plateWidth_1…plateWidth_K` (K ≥ 1) with lotArea and buildableArea.
 * @param columns - the dataset's columns.
 * @returns storeys, rule columns and the naming note, or undefined when the columns hold no plate profile.
 */
export function plateProfileOfColumns(
  columns: readonly string[],
): { storeys: number; ruleColumns: string[]; naming: string } | undefined {
  const has = new Set(columns);
  let k = 0;
  while (has.has(`plateArea_${k + 1}`) && has.has(`plateWidth_${k + 1}`)) k++;
  if (k === 0 || !has.has("lotArea") || !has.has("buildableArea")) return undefined;
  return { storeys: k, ruleColumns: columns.filter((c) => c.startsWith("rule_")), naming: PLATE_PROFILE_NAMING };
}
