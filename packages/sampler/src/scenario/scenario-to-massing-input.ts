import type { MassingInput } from "../massing/massing-types.js";
import { quadParcel } from "../massing/quad-parcel.js";
import type { Scenario } from "./scenario.js";
import { SCENARIO_SLOTS } from "./scenario-slots.js";

/** Parameter names of each scenario already checked to be massing slots (scenarios are immutable values). */
const checked = new WeakMap<Scenario, ReadonlySet<string>>();

function checkedNames(fn: string, scenario: Scenario): ReadonlySet<string> {
  let names = checked.get(scenario);
  if (names === undefined) {
    names = new Set(scenario.parameters.map((p) => p.name));
    for (const name of [...names, ...Object.keys(scenario.fixed)]) {
      if (SCENARIO_SLOTS[name] === undefined) throw new RangeError(`${fn}: ${name} is not a massing slot`);
    }
    checked.set(scenario, names);
  }
  return names;
}

/**
 * Builds the massing input of one sample: the scenario's fixed values plus the sampled record, mapped onto the
 * massing rule through the quad parcel family (`quadParcel({ frontage, depth, rearWidth, skew, corner })`, with
 * `rearWidth = rearRatio × frontage` when the rear line is given as a ratio) and the slots listed in
 * README "Scenario files".
 * @param scenario - a validated scenario.
 * @param record - one value per scenario parameter, keyed by name (as `mapUnitToSpace` returns).
 * @returns the massing input (evaluateMassing validates it again).
 * @throws TypeError when a value has the wrong type; RangeError when a parameter is missing or unknown.
 */
export function scenarioToMassingInput(
  scenario: Scenario,
  record: Readonly<Record<string, number | string>>,
): MassingInput {
  const fn = "scenarioToMassingInput";
  if (typeof scenario !== "object" || scenario === null || !Array.isArray(scenario.parameters)) {
    throw new TypeError(`${fn}: scenario must be a parsed scenario`);
  }
  if (typeof record !== "object" || record === null) throw new TypeError(`${fn}: record must be an object`);
  const names = checkedNames(fn, scenario);
  for (const key in record) {
    if (!names.has(key)) throw new RangeError(`${fn}: record.${key} is not a parameter of scenario ${scenario.name}`);
  }
  for (const name of names) {
    if (record[name] === undefined) throw new RangeError(`${fn}: record.${name} is missing`);
  }
  const fixed = scenario.fixed;
  const valueOf = (name: string): number | string | boolean | undefined => (names.has(name) ? record[name] : fixed[name]);
  const num = (name: string): number | undefined => {
    const v = valueOf(name);
    if (v === undefined) return undefined;
    if (typeof v !== "number") throw new TypeError(`${fn}: ${name} must be a number, got ${JSON.stringify(v)}`);
    return v;
  };
  const need = (name: string): number => {
    const v = num(name);
    if (v === undefined) throw new RangeError(`${fn}: ${name} is not given by scenario ${scenario.name}`);
    return v;
  };
  const corner = valueOf("corner");
  if (corner !== undefined && corner !== "none" && corner !== "left" && corner !== "right") {
    throw new TypeError(`${fn}: corner must be "none", "left" or "right", got ${JSON.stringify(corner)}`);
  }
  const frontage = need("frontage");
  const ratio = num("rearRatio");
  const rearWidth = num("rearWidth") ?? (ratio === undefined ? undefined : ratio * frontage);
  const skew = num("skew");
  const parcel = quadParcel({
    frontage,
    depth: need("depth"),
    ...(rearWidth === undefined ? {} : { rearWidth }),
    ...(skew === undefined ? {} : { skew }),
    ...(corner === undefined ? {} : { corner }),
  });
  const street = num("setbackStreet");
  const input: { -readonly [K in keyof MassingInput]: MassingInput[K] } = {
    parcel,
    setbacks: {
      front: need("setbackFront"),
      side: need("setbackSide"),
      rear: need("setbackRear"),
      ...(street === undefined ? {} : { street }),
    },
    floorHeight: need("floorHeight"),
    maxHeight: need("maxHeight"),
  };
  const maxFar = num("maxFar");
  if (maxFar !== undefined) input.maxFar = maxFar;
  const maxCoverage = num("maxCoverage");
  if (maxCoverage !== undefined) input.maxCoverage = maxCoverage;
  const start = num("skyPlaneStart");
  const slope = num("skyPlaneRatio");
  if (start !== undefined && slope !== undefined) input.skyPlane = { startHeight: start, ratio: slope };
  const minPlateWidth = num("minPlateWidth");
  if (minPlateWidth !== undefined) input.minPlateWidth = minPlateWidth;
  const minPlateArea = num("minPlateArea");
  if (minPlateArea !== undefined) input.minPlateArea = minPlateArea;
  return input;
}
