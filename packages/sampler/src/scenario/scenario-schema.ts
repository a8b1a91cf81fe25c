import { z } from "zod";
import { SCENARIO_SLOTS, type SlotDomain } from "./scenario-slots.js";

const text = z.string().min(1, "must be a non-empty string");
const finite = z.number().refine(Number.isFinite, "must be a finite number");
const level = z.union([
  z.string().min(1, "must be a non-empty string").refine((s) => !/[\r\n]/.test(s), "must not contain a line break"),
  finite,
]);

const continuous = z.strictObject({
  kind: z.literal("continuous"),
  name: text,
  min: finite,
  max: finite,
  log: z.boolean().optional(),
  unit: z.string(),
  description: text,
});
const integer = z.strictObject({
  kind: z.literal("integer"),
  name: text,
  min: z.number().int("must be an integer"),
  max: z.number().int("must be an integer"),
  unit: z.string(),
  description: text,
});
const categorical = z.strictObject({
  kind: z.literal("categorical"),
  name: text,
  levels: z.array(level).min(1, "must hold at least one level"),
  unit: z.string(),
  description: text,
});

function outside(value: unknown, slot: SlotDomain): string | undefined {
  if (slot.choices !== undefined) {
    return typeof value === "string" && slot.choices.includes(value)
      ? undefined
      : `must be one of ${slot.choices.map((c) => JSON.stringify(c)).join(", ")}, got ${JSON.stringify(value)}`;
  }
  if (typeof value !== "number") return `must be a number, got ${JSON.stringify(value)}`;
  const low = slot.exclusive ? value > slot.min : value >= slot.min;
  if (!low) return `must be ${slot.exclusive ? ">" : "≥"} ${slot.min}, got ${value}`;
  const high = slot.maxExclusive === true ? value < slot.max : value <= slot.max;
  if (!high) return `must be ${slot.maxExclusive === true ? "<" : "≤"} ${slot.max}, got ${value}`;
  return undefined;
}

/** Dimensionless units: a ratio may be written "1" or left empty. */
const DIMENSIONLESS = new Set(["1", ""]);

/** Whether a parameter's unit is its slot's (values are never converted, so they must already be in it). */
function sameUnit(given: string, slotUnit: string): boolean {
  return given === slotUnit || (DIMENSIONLESS.has(given) && DIMENSIONLESS.has(slotUnit));
}

/** The message for a parameter in another unit, with the exact conversion when it is a length in feet. */
function unitMismatch(name: string, given: string, slotUnit: string): string {
  const shown = slotUnit === "" ? '"1" (dimensionless)' : JSON.stringify(slotUnit);
  const hint =
    slotUnit === "m" && /^(ft|foot|feet)$/i.test(given)
      ? "; give the range in metres (1 ft = 0.3048 m exactly)"
      : slotUnit === "1" && given === "%"
        ? "; give the ratio itself (e.g. 2.5, not 250 %)"
        : "";
  return `${name} is in ${shown}, got unit ${JSON.stringify(given)}: values are not converted${hint}`;
}

/** The zod schema of a scenario file (format version 1); see README "Scenario files". */
export const scenarioSchema = z
  .strictObject({
    kind: z.literal("floorcast.scenario"),
    formatVersion: z.literal(1),
    name: z.string().regex(/^[a-z0-9][a-z0-9-]*$/, "must be lower-case letters, digits and hyphens"),
    title: text,
    description: text,
    parameters: z.array(z.discriminatedUnion("kind", [continuous, integer, categorical])).min(1, "must hold at least one parameter"),
    fixed: z.record(z.string(), z.union([finite, z.boolean(), z.string()])).default({}),
  })
  .superRefine((s, ctx) => {
    const issue = (path: (string | number)[], message: string): void => {
      ctx.addIssue({ code: "custom", path, message });
    };
    const given = new Map<string, (string | number)[]>();
    s.parameters.forEach((p, i) => {
      const at = ["parameters", i];
      const slot = SCENARIO_SLOTS[p.name];
      if (slot === undefined) {
        issue([...at, "name"], `${JSON.stringify(p.name)} is not a massing slot; use one of ${Object.keys(SCENARIO_SLOTS).join(", ")}`);
      }
      if (given.has(p.name)) issue([...at, "name"], `parameter ${JSON.stringify(p.name)} is defined twice`);
      if (slot !== undefined && !sameUnit(p.unit, slot.unit)) issue([...at, "unit"], unitMismatch(p.name, p.unit, slot.unit));
      given.set(p.name, at);
      if (p.kind === "categorical") {
        const seen = new Set<string | number>();
        p.levels.forEach((l, k) => {
          if (seen.has(l)) issue([...at, "levels", k], `level ${JSON.stringify(l)} is listed twice`);
          seen.add(l);
          const bad = slot === undefined ? undefined : outside(l, slot);
          if (bad !== undefined) issue([...at, "levels", k], bad);
        });
        return;
      }
      if (p.kind === "continuous" && !(p.min < p.max)) issue([...at, "max"], `must be > min (${p.min}), got ${p.max}`);
      if (p.kind === "integer" && !(p.min <= p.max)) issue([...at, "max"], `must be ≥ min (${p.min}), got ${p.max}`);
      if (p.kind === "continuous" && p.log === true && !(p.min > 0)) issue([...at, "min"], `must be > 0 on a log scale, got ${p.min}`);
      if (slot === undefined) return;
      if (slot.choices !== undefined) {
        issue([...at, "kind"], `${p.name} takes one of ${slot.choices.join(", ")}: make it categorical or fix it`);
        return;
      }
      for (const bound of ["min", "max"] as const) {
        const bad = outside(p[bound], slot);
        if (bad !== undefined) issue([...at, bound], bad);
      }
    });
    for (const [name, value] of Object.entries(s.fixed)) {
      const slot = SCENARIO_SLOTS[name];
      if (slot === undefined) {
        issue(["fixed", name], `is not a massing slot; use one of ${Object.keys(SCENARIO_SLOTS).join(", ")}`);
        continue;
      }
      if (given.has(name)) issue(["fixed", name], `is also a parameter; give it one way only`);
      given.set(name, ["fixed", name]);
      const bad = outside(value, slot);
      if (bad !== undefined) issue(["fixed", name], bad);
    }
    for (const [name, slot] of Object.entries(SCENARIO_SLOTS)) {
      if (slot.required && !given.has(name)) issue(["fixed"], `${name} must be given, as a parameter or a fixed value`);
    }
    if (given.has("rearWidth") && given.has("rearRatio")) {
      issue(given.get("rearRatio")!, "give the rear lot line as rearWidth or as rearRatio, not both");
    }
    if (given.has("skyPlaneStart") !== given.has("skyPlaneRatio")) {
      issue(["fixed"], "skyPlaneStart and skyPlaneRatio go together: give both or neither");
    }
  });

/** A scenario file's contents as the schema accepts them. */
export type ScenarioFile = z.infer<typeof scenarioSchema>;
