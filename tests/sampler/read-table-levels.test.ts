import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createVariableCodec, readTable, schemaLevels } from "@floorcast/sampler";

// readTable's `levels`: categorical cells that are string levels read into model rows exactly as the codec codes
// them (a string level as its position, a number level as itself), so fit, predict and assess take the CSVs that
// `sample` writes for a scenario with string levels. The expected rows come from createVariableCodec (derived).
const dir = mkdtempSync(join(tmpdir(), "floorcast-levels-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const file = (name: string, text: string): string => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

describe("readTable levels", () => {
  const corner = { kind: "categorical" as const, name: "corner", levels: ["none", "left", 7] };
  const codec = createVariableCodec([corner, { kind: "continuous", name: "frontage", min: 10, max: 40 }]);

  it("codes string levels as their positions and number levels as themselves, matching the codec's model rows", async () => {
    const p = file("a.csv", "corner,frontage,gfa\nleft,20,500\nnone,30,600\n7,12.5,100\n");
    const t = await readTable(p, { inputs: ["corner", "frontage"], targets: ["gfa"], levels: schemaLevels([{ name: "corner", kind: "categorical", levels: corner.levels }]) });
    const expected = [{ corner: "left", frontage: 20 }, { corner: "none", frontage: 30 }, { corner: 7, frontage: 12.5 }].map((r) => codec.toRow(r));
    expect(t.x).toEqual(expected);
    expect(t.x).toEqual([[1, 20], [0, 30], [7, 12.5]]);
    expect(t.y).toEqual([[500], [600], [100]]);
  });
  it("refuses a cell that is not a level, naming row, line and column", async () => {
    const p = file("b.csv", "corner,frontage\nleft,20\nright,30\n");
    await expect(readTable(p, { inputs: ["corner", "frontage"], levels: { corner: corner.levels } })).rejects.toThrow(
      /readTable: b\.csv row 2 \(line 3\), column "corner": "right" is not one of the levels "none", "left", 7$/,
    );
    const q = file("c.csv", "corner,frontage\n8,20\n");
    await expect(readTable(q, { inputs: ["corner", "frontage"], levels: { corner: corner.levels } })).rejects.toThrow(/"8" is not one of the levels/);
  });
  it("leaves all-number levels to the numeric reader and checks the option's type", async () => {
    const p = file("d.csv", "floorHeight\n3.5\n4.2\n");
    expect((await readTable(p, { inputs: ["floorHeight"], levels: { floorHeight: [3.5, 3.9, 4.2] } })).x).toEqual([[3.5], [4.2]]);
    await expect(readTable(p, { inputs: ["floorHeight"], levels: { floorHeight: "3.5" as never } })).rejects.toThrow(TypeError);
    expect(schemaLevels(undefined)).toEqual({});
  });
});
