import { afterAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { evaluateMassing, loadScenario, parseScenario, scenarioToMassingInput, SCENARIO_SLOTS } from "@floorcast/sampler";

const scenariosDir = fileURLToPath(new URL("../../datasets/scenarios/", import.meta.url));
const dir = mkdtempSync(join(tmpdir(), "floorcast-scn-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A minimal valid scenario; tests change one thing at a time. */
function base(): Record<string, unknown> {
  return {
    kind: "floorcast.scenario",
    formatVersion: 1,
    name: "test-zone",
    title: "Test zone",
    description: "A zone for tests.",
    parameters: [
      { kind: "continuous", name: "frontage", min: 8, max: 20, unit: "m", description: "Frontage." },
      { kind: "integer", name: "minPlateArea", min: 10, max: 40, unit: "m²", description: "Least plate." },
      { kind: "categorical", name: "floorHeight", levels: [3, 3.5], unit: "m", description: "Floor height." },
    ],
    fixed: { depth: 30, setbackFront: 3, setbackSide: 1, setbackRear: 5, maxHeight: 12 },
  };
}
function withChange(change: (s: Record<string, any>) => void): string {
  const s = base() as Record<string, any>;
  change(s);
  return JSON.stringify(s);
}

describe("the Quillmere demo scenarios", () => {
  for (const name of ["larkspur-terraces", "ferrow-corner", "quillmere-core", "hollin-quads"]) {
    it(`${name} loads; its sha256 is that of the file's bytes`, async () => {
      const path = join(scenariosDir, `${name}.json`);
      const s = await loadScenario(path);
      expect(s.name).toBe(name);
      expect(s.fileName).toBe(`${name}.json`);
      expect(s.sha256).toBe(createHash("sha256").update(readFileSync(path)).digest("hex"));
      expect(s.title).toMatch(/Quillmere/);
      for (const p of s.parameters) expect(SCENARIO_SLOTS[p.name]).toBeDefined();
    });
  }
  it("ferrow-corner is a corner lot with a sky plane; quillmere-core caps FAR and coverage", async () => {
    const f = await loadScenario(join(scenariosDir, "ferrow-corner.json"));
    expect(f.fixed.corner).toBe("right");
    expect(f.parameters.map((p) => p.name)).toEqual(expect.arrayContaining(["skyPlaneStart", "skyPlaneRatio"]));
    const c = await loadScenario(join(scenariosDir, "quillmere-core.json"));
    expect(c.parameters.map((p) => p.name)).toEqual(expect.arrayContaining(["maxFar", "maxCoverage"]));
  });
});

describe("the README's scenario example", () => {
  it("is a valid scenario", () => {
    const readme = readFileSync(fileURLToPath(new URL("../../README.md", import.meta.url)), "utf8");
    const section = readme.slice(readme.indexOf("## Scenario files"));
    const json = /```json\n([\s\S]*?)```/.exec(section)![1]!;
    expect(parseScenario(json, "README.md").parameters.map((p) => p.kind)).toEqual(["continuous", "continuous", "integer", "categorical"]);
  });
});

describe("parseScenario errors name the file, the path and the problem", () => {
  const cases: [string, (s: Record<string, any>) => void, RegExp][] = [
    ["wrong kind", (s) => (s.kind = "other"), /bad\.json: kind: /],
    ["wrong format version", (s) => (s.formatVersion = 2), /bad\.json: formatVersion: /],
    ["bad name", (s) => (s.name = "Test Zone"), /bad\.json: name: must be lower-case/],
    ["unknown top-level key", (s) => (s.extra = 1), /bad\.json: \(top level\): .*extra/],
    ["empty parameters", (s) => (s.parameters = []), /parameters: must hold at least one parameter/],
    ["unknown parameter kind", (s) => (s.parameters[0].kind = "ordinal"), /parameters\[0\]\.kind: /],
    ["parameter not a slot", (s) => (s.parameters[0].name = "frontgae"), /parameters\[0\]\.name: "frontgae" is not a massing slot/],
    ["min ≥ max", (s) => (s.parameters[0].max = 8), /parameters\[0\]\.max: must be > min \(8\), got 8/],
    ["log with min ≤ 0 (and below the slot's bound)", (s) => Object.assign(s.parameters[0], { min: 0, log: true }), /parameters\[0\]\.min: must be > 0 on a log scale/],
    ["non-integer integer bound", (s) => (s.parameters[1].min = 10.5), /parameters\[1\]\.min: must be an integer/],
    ["integer min > max", (s) => (s.parameters[1].max = 5), /parameters\[1\]\.max: must be ≥ min \(10\), got 5/],
    ["duplicate level", (s) => (s.parameters[2].levels = [3, 3]), /parameters\[2\]\.levels\[1\]: level 3 is listed twice/],
    ["level outside the slot", (s) => (s.parameters[2].levels = [3, -1]), /parameters\[2\]\.levels\[1\]: must be > 0, got -1/],
    ["no levels", (s) => (s.parameters[2].levels = []), /parameters\[2\]\.levels: must hold at least one level/],
    ["missing description", (s) => delete s.parameters[0].description, /parameters\[0\]\.description: /],
    ["parameter defined twice", (s) => s.parameters.push({ ...s.parameters[0] }), /parameters\[3\]\.name: parameter "frontage" is defined twice/],
    ["NaN-like bound", (s) => (s.parameters[0].min = "8"), /parameters\[0\]\.min: /],
    ["unknown fixed slot", (s) => (s.fixed.colour = 1), /fixed\.colour: is not a massing slot/],
    ["fixed also a parameter", (s) => (s.fixed.frontage = 10), /fixed\.frontage: is also a parameter/],
    ["required slot missing", (s) => delete s.fixed.maxHeight, /fixed: maxHeight must be given/],
    ["coverage above 1", (s) => (s.fixed.maxCoverage = 1.2), /fixed\.maxCoverage: must be ≤ 1, got 1\.2/],
    ["negative setback", (s) => (s.fixed.setbackSide = -1), /fixed\.setbackSide: must be ≥ 0, got -1/],
    ["skew of 90°", (s) => (s.fixed.skew = 90), /fixed\.skew: must be < 90, got 90/],
    ["bad corner", (s) => (s.fixed.corner = "north"), /fixed\.corner: must be one of "none", "left", "right"/],
    ["rear given twice", (s) => Object.assign(s.fixed, { rearWidth: 8, rearRatio: 0.8 }), /fixed\.rearRatio: give the rear lot line as rearWidth or as rearRatio/],
    ["half a sky plane", (s) => (s.fixed.skyPlaneStart = 10), /skyPlaneStart and skyPlaneRatio go together/],
    // Units are checked, never converted: a frontage in feet or a FAR in per cent is refused, naming the field.
    ["a length in feet", (s) => (s.parameters[0].unit = "ft"), /parameters\[0\]\.unit: frontage is in "m", got unit "ft": values are not converted; give the range in metres \(1 ft = 0\.3048 m exactly\)/],
    ["a ratio in per cent", (s) => s.parameters.push({ kind: "continuous", name: "maxFar", min: 100, max: 300, unit: "%", description: "FAR" }), /parameters\[3\]\.unit: maxFar is in "1", got unit "%".*not 250 %/],
    ["a length in another unit", (s) => (s.parameters[0].unit = "m²"), /parameters\[0\]\.unit: frontage is in "m", got unit "m²"/],
    ["a line break in a level", (s) => (s.parameters[2] = { ...s.parameters[2], name: "corner", levels: ["none", "le\nft"] }), /parameters\[2\]\.levels\[1\]: must not contain a line break/],
  ];
  for (const [what, change, message] of cases) {
    it(what, () => {
      expect(() => parseScenario(withChange(change), "bad.json")).toThrow(RangeError);
      expect(() => parseScenario(withChange(change), "bad.json")).toThrow(message);
    });
  }
  it("every problem is listed, not just the first", () => {
    const text = withChange((s) => {
      s.fixed.maxCoverage = 2;
      s.parameters[0].max = 1;
    });
    expect(() => parseScenario(text, "bad.json")).toThrow(/parameters\[0\]\.max: .*; fixed\.maxCoverage: /);
  });
  it("text that is not JSON", () => {
    expect(() => parseScenario("{ nope", "bad.json")).toThrow(/parseScenario: bad\.json: not valid JSON/);
  });
  it("a parsed object is accepted too, and a bad fileName is a TypeError", () => {
    expect(parseScenario(base(), "obj.json").name).toBe("test-zone");
    expect(() => parseScenario(base(), 3 as unknown as string)).toThrow(TypeError);
  });
  it("loadScenario names the path of a missing file and the file of a bad one", async () => {
    await expect(loadScenario(join(dir, "none.json"))).rejects.toThrow(/loadScenario: cannot read .*none\.json: ENOENT/);
    const p = join(dir, "broken.json");
    writeFileSync(p, withChange((s) => (s.fixed.maxHeight = 0)));
    await expect(loadScenario(p)).rejects.toThrow(/^loadScenario: broken\.json: fixed\.maxHeight: must be > 0, got 0/);
    await expect(loadScenario("")).rejects.toThrow(TypeError);
  });
});

describe("scenarioToMassingInput", () => {
  const s = parseScenario(
    withChange((x) => {
      x.parameters.push({ kind: "continuous", name: "rearRatio", min: 0.5, max: 1.5, unit: "1", description: "Rear ratio." });
      Object.assign(x.fixed, { skew: 0, corner: "left", skyPlaneStart: 9, skyPlaneRatio: 2, maxFar: 2 });
    }),
    "t.json",
  );
  it("maps slots onto the quad parcel and the rule's fields; rearRatio × frontage is the rear width", () => {
    const input = scenarioToMassingInput(s, { frontage: 10, minPlateArea: 20, floorHeight: 3, rearRatio: 0.8 });
    expect(input.parcel.vertices).toEqual([[0, 0], [10, 0], [9, 30], [1, 30]]);
    expect(input.parcel.lotLines).toEqual(["front", "side", "rear", "street"]);
    expect(input.setbacks).toEqual({ front: 3, side: 1, rear: 5 });
    expect(input.skyPlane).toEqual({ startHeight: 9, ratio: 2 });
    expect(input).toMatchObject({ floorHeight: 3, maxHeight: 12, maxFar: 2, minPlateArea: 20 });
    expect(input.maxCoverage).toBeUndefined();
  });
  it("a rectangle with yards has the footprint (W − 2s)(D − f − r) (yards per Woodway WA 14.08.350, derived)", () => {
    const r = parseScenario(base(), "r.json");
    const out = evaluateMassing(scenarioToMassingInput(r, { frontage: 10, minPlateArea: 10, floorHeight: 3 }));
    expect(out.footprintArea).toBeCloseTo((10 - 2) * (30 - 3 - 5), 9);
    expect(out.floors).toBe(4); // ⌊12 / 3⌋ floors under the height limit
  });
  it("a 50 ft × 100 ft lot at FAR 2.0 allows 10,000 sq ft (metaglossary.com, 'floor area ratio')", () => {
    const far = parseScenario(
      withChange((x) => {
        x.parameters = [{ kind: "continuous", name: "maxFar", min: 1, max: 3, unit: "1", description: "FAR." }];
        x.fixed = { frontage: 15.24, depth: 30.48, setbackFront: 0, setbackSide: 0, setbackRear: 0, floorHeight: 3, maxHeight: 60 };
      }),
      "far.json",
    );
    const out = evaluateMassing(scenarioToMassingInput(far, { maxFar: 2 }));
    // 1 ft = 0.3048 m exactly, so 10,000 sq ft = 929.0304 m²; full-lot floors reach the cap in exactly 2 floors
    expect(out.gfa).toBeCloseTo(929.0304, 6);
    expect(out.limitedBy).toBe("far");
  });
  it("rejects missing, unknown and wrongly typed values", () => {
    expect(() => scenarioToMassingInput(s, { frontage: 10, minPlateArea: 20, floorHeight: 3 })).toThrow(/record\.rearRatio is missing/);
    expect(() => scenarioToMassingInput(s, { frontage: 10, minPlateArea: 20, floorHeight: 3, rearRatio: 1, x: 1 })).toThrow(
      /record\.x is not a parameter/,
    );
    expect(() => scenarioToMassingInput(s, { frontage: "10", minPlateArea: 20, floorHeight: 3, rearRatio: 1 })).toThrow(TypeError);
    expect(() => scenarioToMassingInput(null as never, {})).toThrow(TypeError);
    expect(() => scenarioToMassingInput(s, { frontage: NaN, minPlateArea: 20, floorHeight: 3, rearRatio: 1 })).toThrow(
      /frontage must be finite/,
    );
  });
});
