import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  checkSchemaMatch,
  checkSchemaRows,
  createVariableCodec,
  inputSchemaOf,
  mapUnitToSpace,
  variablesOfSchema,
} from "@floorcast/sampler";
import type { Parameter, Variable } from "@floorcast/sampler";

const far: Variable = { kind: "continuous", name: "maxFar", min: 0.5, max: 8, log: true };
const yard: Variable = { kind: "continuous", name: "yard", min: 0, max: 6, step: 0.5 };
const storeys: Variable = { kind: "integer", name: "storeys", min: 2, max: 6 };
const floorHeight: Variable = { kind: "categorical", name: "floorHeight", levels: [3.5, 3.9, 4.2] };
const use: Variable = { kind: "categorical", name: "use", levels: ["residential", "mixed", "office"] };
const variables = [far, yard, storeys, floorHeight, use];

describe("the one Variable contract: codec unit ↔ record ↔ model row", () => {
  const codec = createVariableCodec(variables);
  it("codes a numeric level as its own value and a string level as its position in model rows, both ways", () => {
    const record = { maxFar: 2, yard: 1.5, storeys: 4, floorHeight: 3.9, use: "office" };
    expect(codec.toRow(record)).toEqual([2, 1.5, 4, 3.9, 2]);
    expect(codec.fromRow("t", [2, 1.5, 4, 3.9, 2])).toEqual(record);
    expect(codec.toRow({ ...record, floorHeight: 1 })[3]).toBeNaN(); // an index is not a level
    expect(() => codec.fromRow("t", [2, 1.5, 4, 1, 2])).toThrow(/row\[3\] \(floorHeight\) 1 is not a level/);
    // the optimizers' coordinates keep the level index; a record maps back exactly
    expect(codec.fromDesign("t", record)).toEqual([2, 1.5, 4, 1, 2]);
    expect(codec.toDesign([2, 1.5, 4, 1, 2])).toEqual(record);
  });
  it("searches a log-scale variable uniformly in ln(value): the unit midpoint is the geometric mean, and unit ↔ value round-trips", () => {
    // √(0.5 · 8) = 2 (derived)
    expect(codec.fromUnit([0.5, 0.5, 0.5, 0.5, 0.5])[0]).toBeCloseTo(2, 12);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (u) => {
        const x = codec.fromUnit([u, 0, 0, 0, 0]);
        expect(codec.toUnit(x)[0]).toBeCloseTo(u, 10);
      }),
    );
  });
  it("gives the same value as mapUnitToSpace for a log-scale and a stepped parameter (one formula)", () => {
    const p = (v: Variable): Parameter => ({ ...v, unit: "", description: "." }) as Parameter;
    const rows = [[0.1, 0.1], [0.37, 0.15], [0.99, 0.93]];
    // rows whose stepped column is not Latin (two in the first third), so both use ⌊x·L⌋ of its 13 levels
    const mapped = mapUnitToSpace({ parameters: [p(far), p(yard)] }, rows);
    const pair = createVariableCodec([far, yard]);
    rows.forEach((r, i) => {
      const x = pair.fromUnit(r);
      expect(mapped[i]!.maxFar).toBeCloseTo(x[0]!, 12);
      expect(mapped[i]!.yard).toBe(x[1]);
    });
  });
  it("snaps a stepped variable to min + k·step", () => {
    expect(codec.snap(1, 1.26)).toBe(1.5);
    expect(codec.count[1]).toBe(13); // 0, 0.5, …, 6 (derived)
  });
});

describe("input schema", () => {
  it("round-trips variables, log scale and step included", () => {
    const schema = inputSchemaOf(variables);
    expect(schema[0]).toEqual({ name: "maxFar", kind: "continuous", min: 0.5, max: 8, scale: "log" });
    expect(schema[1]).toEqual({ name: "yard", kind: "continuous", min: 0, max: 6, scale: "linear", step: 0.5 });
    expect(variablesOfSchema(schema)).toEqual(variables);
  });
  it("accepts another order, refuses a missing column, a new level, a wider range or a kind clash, naming the column", () => {
    const schema = inputSchemaOf(variables);
    expect(() => checkSchemaMatch(schema, [...variables].reverse(), "f", "m.json")).not.toThrow();
    expect(() => checkSchemaMatch(schema, variables.slice(1), "f", "m.json")).toThrow(/column maxFar: m\.json needs it as an input, but it is missing/);
    expect(() => checkSchemaMatch(schema, [far, yard, storeys, { ...floorHeight, levels: [3.5, 4.5] }, use], "f", "m.json")).toThrow(/column floorHeight: level 4\.5/);
    expect(() => checkSchemaMatch(schema, [{ ...far, max: 9 }, yard, storeys, floorHeight, use], "f", "m.json")).toThrow(/column maxFar: range \[0\.5, 9\] is outside \[0\.5, 8\]/);
    expect(() => checkSchemaMatch(schema, [far, yard, { kind: "categorical", name: "storeys", levels: [2, 3] }, floorHeight, use], "f", "m.json")).not.toThrow();
    expect(() => checkSchemaMatch(schema, [far, yard, storeys, { kind: "continuous", name: "floorHeight", min: 3.5, max: 4.2 }, use], "f", "m.json")).toThrow(/column floorHeight: m\.json takes it as categorical/);
    expect(() => checkSchemaMatch(schema, [...variables, { kind: "integer", name: "extra", min: 0, max: 1 }], "f", "m.json")).toThrow(/column extra: m\.json has no such input/);
  });
  it("checks model rows: categorical values are level row values, integers whole", () => {
    const schema = inputSchemaOf(variables);
    expect(() => checkSchemaRows(schema, [[2, 1.5, 4, 3.9, 2]], "f", "a.csv")).not.toThrow();
    expect(() => checkSchemaRows(schema, [[2, 1.5, 4, 3.9, 2], [2, 1.5, 4, 2, 2]], "f", "a.csv")).toThrow(/a\.csv: column floorHeight, row 2: 2 is not one of the levels/);
    expect(() => checkSchemaRows(schema, [[2, 1.5, 4.5, 3.9, 2]], "f", "a.csv")).toThrow(/column storeys, row 1: 4\.5 is not a whole number/);
  });
});
