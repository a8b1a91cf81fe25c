import type { MassingInput } from "./massing-types.js";

/** Largest coordinate magnitude of a parcel vertex, in metres. */
const MAX_COORDINATE = 1e9;

const FN = "evaluateMassing";
const LOT_LINE_KINDS = new Set(["front", "side", "rear", "street"]);
const INPUT_KEYS = new Set([
  "parcel",
  "setbacks",
  "floorHeight",
  "maxHeight",
  "maxFar",
  "maxCoverage",
  "skyPlane",
  "minPlateWidth",
  "minPlateArea",
]);
const PARCEL_KEYS = new Set(["vertices", "lotLines"]);
const SETBACK_KEYS = new Set(["front", "side", "rear", "street"]);
const SKY_KEYS = new Set(["startHeight", "ratio"]);

/**
 * Most vertices a parcel may have. The evaluator's work grows about quadratically with the vertex count
 * (measured: 100,000 vertices took about 100 s); this bound keeps one evaluation near a second at most.
 */
export const MAX_LOT_VERTICES = 10_000;

/** Most floors one input may ask for (maxHeight / floorHeight); bounds the work of one evaluation. */
export const MAX_FLOORS = 100_000;

function show(v: unknown): string {
  if (typeof v === "number" || typeof v === "boolean" || v === null || v === undefined) return String(v);
  if (typeof v === "string") return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
  return Array.isArray(v) ? "an array" : typeof v;
}

function typeError(field: string, want: string, got: unknown): TypeError {
  return new TypeError(`${FN}: ${field} must be ${want}, got ${show(got)}`);
}

function rangeError(field: string, problem: string): RangeError {
  return new RangeError(`${FN}: ${field} ${problem}`);
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

function checkKeys(obj: Record<string, unknown>, known: Set<string>, prefix: string): void {
  for (const key in obj) {
    if (!known.has(key)) throw rangeError(`${prefix}${key}`, "is not a known field");
  }
}

/** A finite number; `min` and `exclusive` give the lower bound, `max` an inclusive upper bound. */
function checkNumber(v: unknown, field: string, min: number, exclusive: boolean, max = Infinity): void {
  if (typeof v !== "number") throw typeError(field, "a number", v);
  if (!Number.isFinite(v)) throw rangeError(field, `must be finite, got ${v}`);
  if (exclusive ? !(v > min) : !(v >= min)) {
    throw rangeError(field, `must be ${exclusive ? ">" : "≥"} ${min}, got ${v}`);
  }
  if (v > max) throw rangeError(field, `must be ≤ ${max}, got ${v}`);
}

function checkOptionalNumber(v: unknown, field: string, min: number, exclusive: boolean, max = Infinity): void {
  if (v !== undefined) checkNumber(v, field, min, exclusive, max);
}

/**
 * Checks the types, values and parcel shape of a massing input (everything but convexity, which
 * the evaluator checks on its working copy of the vertices). Throws TypeError for a wrong type and
 * RangeError for a bad value; the message starts `evaluateMassing: <field path>`.
 * @param input - the value to check.
 * @returns nothing; narrows `input` to MassingInput.
 */
export function validateMassingInput(input: unknown): asserts input is MassingInput {
  if (!isObject(input)) throw typeError("input", "an object", input);
  checkKeys(input, INPUT_KEYS, "");
  const parcel = input.parcel;
  if (!isObject(parcel)) throw typeError("parcel", "an object", parcel);
  checkKeys(parcel, PARCEL_KEYS, "parcel.");
  const vertices = parcel.vertices;
  if (!Array.isArray(vertices)) throw typeError("parcel.vertices", "an array", vertices);
  const n = vertices.length;
  if (n < 3) throw rangeError("parcel.vertices", `must have at least 3 vertices, got ${n}`);
  if (n > MAX_LOT_VERTICES) throw rangeError("parcel.vertices", `must have at most ${MAX_LOT_VERTICES} vertices, got ${n}`);
  for (let i = 0; i < n; i++) {
    const v: unknown = vertices[i];
    if (!Array.isArray(v)) throw typeError(`parcel.vertices[${i}]`, "an [x, y] array", v);
    if (v.length !== 2) throw rangeError(`parcel.vertices[${i}]`, `must have 2 coordinates, got ${v.length}`);
    for (let j = 0; j < 2; j++) {
      const c: unknown = v[j];
      if (typeof c !== "number") throw typeError(`parcel.vertices[${i}][${j}]`, "a number", c);
      if (!Number.isFinite(c)) throw rangeError(`parcel.vertices[${i}][${j}]`, `must be finite, got ${c}`);
      // Beyond 1e9 m (25 times the Earth's circumference) products of coordinates lose the lot's area to
      // rounding and, near 1e154, overflow (derived); no parcel is that large.
      if (Math.abs(c) > MAX_COORDINATE) throw rangeError(`parcel.vertices[${i}][${j}]`, `must be within ±1e9 m, got ${c}`);
    }
  }
  const lotLines = parcel.lotLines;
  if (!Array.isArray(lotLines)) throw typeError("parcel.lotLines", "an array", lotLines);
  if (lotLines.length !== n) {
    throw rangeError("parcel.lotLines", `must have one entry per edge (${n}), got ${lotLines.length}`);
  }
  let fronts = 0;
  for (let i = 0; i < n; i++) {
    const k: unknown = lotLines[i];
    if (typeof k !== "string") throw typeError(`parcel.lotLines[${i}]`, "a string", k);
    if (!LOT_LINE_KINDS.has(k)) {
      throw rangeError(`parcel.lotLines[${i}]`, `must be "front", "side", "rear" or "street", got ${show(k)}`);
    }
    if (k === "front") fronts++;
  }
  if (fronts === 0) throw rangeError("parcel.lotLines", `must include at least one "front" line`);

  const setbacks = input.setbacks;
  if (!isObject(setbacks)) throw typeError("setbacks", "an object", setbacks);
  checkKeys(setbacks, SETBACK_KEYS, "setbacks.");
  checkNumber(setbacks.front, "setbacks.front", 0, false);
  checkNumber(setbacks.side, "setbacks.side", 0, false);
  checkNumber(setbacks.rear, "setbacks.rear", 0, false);
  checkOptionalNumber(setbacks.street, "setbacks.street", 0, false);

  checkNumber(input.floorHeight, "floorHeight", 0, true);
  checkNumber(input.maxHeight, "maxHeight", 0, true);
  if ((input.maxHeight as number) / (input.floorHeight as number) > MAX_FLOORS) {
    throw rangeError("maxHeight", `allows more than ${MAX_FLOORS} floors of floorHeight ${input.floorHeight as number}`);
  }
  checkOptionalNumber(input.maxFar, "maxFar", 0, true);
  checkOptionalNumber(input.maxCoverage, "maxCoverage", 0, true, 1);
  const sky = input.skyPlane;
  if (sky !== undefined) {
    if (!isObject(sky)) throw typeError("skyPlane", "an object", sky);
    checkKeys(sky, SKY_KEYS, "skyPlane.");
    checkNumber(sky.startHeight, "skyPlane.startHeight", 0, false);
    checkNumber(sky.ratio, "skyPlane.ratio", 0, true);
  }
  checkOptionalNumber(input.minPlateWidth, "minPlateWidth", 0, false);
  checkOptionalNumber(input.minPlateArea, "minPlateArea", 0, false);
}
