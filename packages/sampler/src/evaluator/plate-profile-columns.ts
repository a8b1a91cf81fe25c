import type { MassingInput } from "../massing/massing-types.js";
import type { MassingProfile } from "../massing/massing-profile.js";
import type { Scenario } from "../scenario/scenario.js";

/**
 * Rule columns of a plate profile: the values of the stacking arithmetic for the row, `rule_<slot>`. A column is
 * written only when the scenario gives that slot (as a parameter or a fixed value); an absent column means the
 * rule's default (no FAR cap, coverage 1, no plate minimum, no sky exposure plane).
 */
export const PLATE_RULE_SLOTS = [
  "floorHeight",
  "maxHeight",
  "maxFar",
  "maxCoverage",
  "minPlateWidth",
  "minPlateArea",
  "skyPlaneStart",
  "skyPlaneRatio",
] as const;

/** Storey columns: `plateArea_<k>` and `plateWidth_<k>`, k = 1..storeys. */
export const plateAreaColumn = (k: number): string => `plateArea_${k}`;
/** See {@link plateAreaColumn}. */
export const plateWidthColumn = (k: number): string => `plateWidth_${k}`;

function slotRange(scenario: Scenario, name: string): [number, number] | undefined {
  const p = scenario.parameters.find((q) => q.name === name);
  if (p === undefined) {
    const v = scenario.fixed[name];
    return typeof v === "number" ? [v, v] : undefined;
  }
  if (p.kind === "categorical") {
    const nums = p.levels.filter((l): l is number => typeof l === "number");
    return nums.length === 0 ? undefined : [Math.min(...nums), Math.max(...nums)];
  }
  return [p.min, p.max];
}

/**
 * The plate-profile column layout of a scenario: its rule columns and its storey count, the most storeys any
 * of its samples can have (⌊largest maxHeight / smallest floorHeight⌋, plus one for rounding at the boundary).
 * @param scenario - a validated scenario.
 * @returns rule slots written and the storey count.
 */
export function plateProfileLayout(scenario: Scenario): { readonly ruleSlots: readonly string[]; readonly storeys: number } {
  const ruleSlots = PLATE_RULE_SLOTS.filter((s) => slotRange(scenario, s) !== undefined);
  const fh = slotRange(scenario, "floorHeight");
  const mh = slotRange(scenario, "maxHeight");
  if (fh === undefined || mh === undefined || !(fh[0] > 0)) {
    throw new RangeError(`plateProfileLayout: scenario ${scenario.name} must give numeric floorHeight and maxHeight`);
  }
  return { ruleSlots, storeys: Math.floor(mh[1] / fh[0] + 1e-9) };
}

/**
 * The plate-profile columns of one evaluated row: `rule_<slot>` for each rule slot, then `plateArea_k` and
 * `plateWidth_k` for k = 1..storeys (0 for a storey above the row's own height limit).
 * @param input - the row's massing input.
 * @param profile - its massingProfile.
 * @param layout - the scenario's plateProfileLayout.
 * @returns the extra columns, in layout order.
 */
export function plateProfileColumns(
  input: MassingInput,
  profile: MassingProfile,
  layout: { readonly ruleSlots: readonly string[]; readonly storeys: number },
): Record<string, number> {
  const out: Record<string, number> = {};
  const ruleValue: Record<string, number | undefined> = {
    floorHeight: input.floorHeight,
    maxHeight: input.maxHeight,
    maxFar: input.maxFar,
    maxCoverage: input.maxCoverage ?? 1,
    minPlateWidth: input.minPlateWidth ?? 0,
    minPlateArea: input.minPlateArea ?? 0,
    skyPlaneStart: input.skyPlane?.startHeight,
    skyPlaneRatio: input.skyPlane?.ratio,
  };
  for (const s of layout.ruleSlots) {
    const v = ruleValue[s];
    if (v === undefined) throw new RangeError(`plateProfileColumns: the row gives no value for ${s}`);
    out[`rule_${s}`] = v;
  }
  if (profile.storeys.length > layout.storeys) {
    throw new RangeError(`plateProfileColumns: ${profile.storeys.length} storeys exceed the layout's ${layout.storeys}`);
  }
  for (let k = 1; k <= layout.storeys; k++) {
    const st = profile.storeys[k - 1];
    out[plateAreaColumn(k)] = st?.area ?? 0;
    out[plateWidthColumn(k)] = st?.width ?? 0;
  }
  return out;
}
