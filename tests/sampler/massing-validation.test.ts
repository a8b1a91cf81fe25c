import { describe, expect, it } from "vitest";
import { evaluateMassing } from "@floorcast/sampler";

// Bad input as the README's massing input table allows it ("Allowed" column); conventions (TypeError for a wrong type, RangeError for a
// bad value, message `evaluateMassing: <field path> …`) from DEVELOPERS.md.
const good = {
  parcel: { vertices: [[0, 0], [20, 0], [20, 30], [0, 30]], lotLines: ["front", "side", "rear", "side"] },
  setbacks: { front: 5, side: 3, rear: 6 },
  floorHeight: 3.5,
  maxHeight: 24,
};

/** `good` with the value at a dotted path replaced (or deleted when value is the DELETE marker). */
const DELETE = Symbol("delete");
function withField(path: string, value: unknown): unknown {
  const copy = structuredClone(good) as Record<string, unknown>;
  const keys = path.split(".");
  let obj = copy;
  for (const k of keys.slice(0, -1)) {
    obj[k] ??= {};
    obj = obj[k] as Record<string, unknown>;
  }
  if (value === DELETE) delete obj[keys.at(-1)!];
  else obj[keys.at(-1)!] = value;
  return copy;
}
const parcel = (vertices: unknown, lotLines?: unknown): unknown => ({
  ...good,
  parcel: { vertices, lotLines: lotLines ?? (vertices as unknown[]).map((_, i) => (i === 0 ? "front" : "side")) },
});

function expectError(input: unknown, kind: typeof TypeError | typeof RangeError, field: string): void {
  let error: unknown;
  try {
    evaluateMassing(input as never);
  } catch (e) {
    error = e;
  }
  expect(error).toBeInstanceOf(kind);
  expect((error as Error).message.startsWith(`evaluateMassing: ${field} `), (error as Error).message).toBe(true);
}

describe("evaluateMassing rejects bad input with a clear error, never a number", () => {
  it("accepts the good input", () => {
    expect(evaluateMassing(good as never).floors).toBe(6);
  });

  it.each([
    ["input null", null, "input"],
    ["input a number", 3, "input"],
    ["input an array", [], "input"],
    ["no parcel", withField("parcel", DELETE), "parcel"],
    ["vertices not an array", withField("parcel.vertices", "square"), "parcel.vertices"],
    ["a vertex not an array", parcel([[0, 0], [1, 0], { x: 1, y: 1 }]), "parcel.vertices[2]"],
    ["a coordinate a string", parcel([[0, 0], [1, "0"], [1, 1]]), "parcel.vertices[1][1]"],
    ["lotLines not an array", withField("parcel.lotLines", "front"), "parcel.lotLines"],
    ["a lot line not a string", withField("parcel.lotLines", ["front", 1, "rear", "side"]), "parcel.lotLines[1]"],
    ["no setbacks", withField("setbacks", DELETE), "setbacks"],
    ["setbacks.front missing", withField("setbacks.front", DELETE), "setbacks.front"],
    ["setbacks.side a string", withField("setbacks.side", "3"), "setbacks.side"],
    ["setbacks.street null", withField("setbacks.street", null), "setbacks.street"],
    ["floorHeight a string", withField("floorHeight", "3.5"), "floorHeight"],
    ["maxHeight missing", withField("maxHeight", DELETE), "maxHeight"],
    ["maxFar a boolean", withField("maxFar", true), "maxFar"],
    ["skyPlane a number", withField("skyPlane", 2.7), "skyPlane"],
    ["skyPlane.ratio missing", withField("skyPlane", { startHeight: 10 }), "skyPlane.ratio"],
    ["minPlateArea a string", withField("minPlateArea", "100"), "minPlateArea"],
  ])("TypeError: %s", (_name, input, field) => expectError(input, TypeError, field));

  it.each([
    ["no vertices (empty)", parcel([]), "parcel.vertices"],
    ["two vertices", parcel([[0, 0], [1, 0]]), "parcel.vertices"],
    ["three vertices, two distinct", parcel([[0, 0], [1, 0], [0, 0]]), "parcel.vertices"],
    ["a vertex with 3 coordinates", parcel([[0, 0], [1, 0, 0], [1, 1]]), "parcel.vertices[1]"],
    ["a zero-length edge", parcel([[0, 0], [1, 0], [1, 0], [1, 1]]), "parcel.vertices"],
    ["all vertices on one line", parcel([[0, 0], [1, 0], [2, 0]]), "parcel.vertices"],
    ["touching itself at a vertex", parcel([[0, 0], [2, 0], [1, 1], [2, 2], [0, 2], [1, 1]]), "parcel.vertices"],
    ["doubling back on an edge", parcel([[0, 0], [2, 0], [2, 2], [2, 1], [0, 2]]), "parcel.vertices"],
    ["self-intersecting bow tie", parcel([[0, 0], [1, 1], [1, 0], [0, 1]]), "parcel.vertices"],
    ["self-intersecting star", parcel([0, 2, 4, 1, 3].map((k) => [Math.cos(1.2566 * k), Math.sin(1.2566 * k)])), "parcel.vertices"],
    ["NaN coordinate", parcel([[0, 0], [NaN, 0], [1, 1]]), "parcel.vertices[1][0]"],
    ["Infinity coordinate", parcel([[0, 0], [1, 0], [1, Infinity]]), "parcel.vertices[2][1]"],
    ["lotLines too short", withField("parcel.lotLines", ["front", "side", "rear"]), "parcel.lotLines"],
    ["lotLines too long", withField("parcel.lotLines", ["front", "side", "rear", "side", "side"]), "parcel.lotLines"],
    ["unknown lot line kind", withField("parcel.lotLines", ["front", "side", "back", "side"]), "parcel.lotLines[2]"],
    ["no front line", withField("parcel.lotLines", ["street", "side", "rear", "side"]), "parcel.lotLines"],
    ["negative front setback", withField("setbacks.front", -1), "setbacks.front"],
    ["negative side setback", withField("setbacks.side", -0.01), "setbacks.side"],
    ["negative rear setback", withField("setbacks.rear", -5), "setbacks.rear"],
    ["negative street setback", withField("setbacks.street", -2), "setbacks.street"],
    ["NaN setback", withField("setbacks.rear", NaN), "setbacks.rear"],
    ["Infinity setback", withField("setbacks.front", Infinity), "setbacks.front"],
    ["floorHeight 0", withField("floorHeight", 0), "floorHeight"],
    ["floorHeight negative", withField("floorHeight", -3), "floorHeight"],
    ["floorHeight NaN", withField("floorHeight", NaN), "floorHeight"],
    ["maxHeight 0", withField("maxHeight", 0), "maxHeight"],
    ["maxHeight Infinity", withField("maxHeight", Infinity), "maxHeight"],
    ["maxHeight −Infinity", withField("maxHeight", -Infinity), "maxHeight"],
    ["more than 100000 floors", { ...good, floorHeight: 1e-4, maxHeight: 100 }, "maxHeight"],
    ["maxFar 0", withField("maxFar", 0), "maxFar"],
    ["maxFar NaN", withField("maxFar", NaN), "maxFar"],
    ["maxCoverage 0", withField("maxCoverage", 0), "maxCoverage"],
    ["maxCoverage above 1", withField("maxCoverage", 1.01), "maxCoverage"],
    ["maxCoverage negative", withField("maxCoverage", -0.5), "maxCoverage"],
    ["maxCoverage NaN", withField("maxCoverage", NaN), "maxCoverage"],
    ["skyPlane.startHeight negative", withField("skyPlane", { startHeight: -1, ratio: 2 }), "skyPlane.startHeight"],
    ["skyPlane.ratio 0", withField("skyPlane", { startHeight: 10, ratio: 0 }), "skyPlane.ratio"],
    ["skyPlane.ratio Infinity", withField("skyPlane", { startHeight: 10, ratio: Infinity }), "skyPlane.ratio"],
    ["minPlateWidth negative", withField("minPlateWidth", -1), "minPlateWidth"],
    ["minPlateArea NaN", withField("minPlateArea", NaN), "minPlateArea"],
    ["a misspelt field", withField("maxFAR", 2), "maxFAR"],
    ["a misspelt setback", withField("setbacks.sides", 2), "setbacks.sides"],
  ])("RangeError: %s", (_name, input, field) => expectError(input, RangeError, field));

  it("names the value in the message", () => {
    expect(() => evaluateMassing(withField("setbacks.front", -1) as never)).toThrow(
      "evaluateMassing: setbacks.front must be ≥ 0, got -1",
    );
    expect(() => evaluateMassing(withField("maxCoverage", 1.5) as never)).toThrow("maxCoverage must be ≤ 1, got 1.5");
  });

  it("options must be an object with a boolean plates", () => {
    expect(() => evaluateMassing(good as never, 1 as never)).toThrow(TypeError);
    expect(() => evaluateMassing(good as never, { plates: "yes" } as never)).toThrow(/evaluateMassing: options.plates/);
    expect(evaluateMassing(good as never, {}).floors).toBe(6);
  });

  it("accepts boundary values: zero setbacks, maxCoverage 1, startHeight 0, zero plate limits", () => {
    const r = evaluateMassing({
      ...(good as never as object),
      setbacks: { front: 0, side: 0, rear: 0, street: 0 },
      maxCoverage: 1,
      skyPlane: { startHeight: 0, ratio: 1e6 },
      minPlateWidth: 0,
      minPlateArea: 0,
    } as never);
    expect(r.coverageCapped).toBe(false);
    expect(r.footprintArea).toBeCloseTo(600 - 20 * (3.5 / 1e6), 6);
  });
});
