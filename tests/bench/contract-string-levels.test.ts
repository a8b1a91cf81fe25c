import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadSurrogate } from "@floorcast/surrogate";
import { createVariableCodec, readTable, type Variable } from "@floorcast/sampler";
import { runCli } from "./run-cli.js";

// A categorical input with string levels (which side line of a corner lot faces the street: "left" or "right")
// on the user's path: `sample` writes the level's text, `fit` codes it as the codec codes model rows (the level's
// position), the model file records the levels, `predict` and `assess` read the text back the same way, and a
// level the model was not trained on is refused naming the column. The exact reference is the codec's model row
// (createVariableCodec, the one contract) fed to loadSurrogate's predict (derived).
const ferrow = JSON.parse(readFileSync(fileURLToPath(new URL("../../datasets/scenarios/ferrow-corner.json", import.meta.url)), "utf8"));
let dir = "";
const inputs = ["corner", "frontage", "depth", "setbackFront", "setbackStreet"];

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-string-levels-"));
  const { corner: _c, ...fixed } = ferrow.fixed;
  const scenario = {
    ...ferrow,
    name: "ferrow-corner-sides",
    parameters: [{ kind: "categorical", name: "corner", levels: ["left", "right"], unit: "", description: "Which side line faces a street." }, ...ferrow.parameters],
    fixed,
  };
  writeFileSync(join(dir, "scenario.json"), JSON.stringify(scenario));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function ok(args: string[]): Promise<string> {
  const r = await runCli(args);
  expect(r.code, r.err).toBe(0);
  return r.err;
}

describe("string levels: sample → fit → predict → assess", () => {
  it("fits on the level text, records the levels and predicts the same values as the model on codec rows", async () => {
    await ok(["sample", "--scenario", join(dir, "scenario.json"), "--n", "80", "--seed", "3", "--out", join(dir, "train.csv")]);
    await ok(["sample", "--scenario", join(dir, "scenario.json"), "--n", "30", "--seed", "4", "--design", "random", "--out", join(dir, "test.csv")]);
    const text = await readTable(join(dir, "test.csv"), { columns: inputs.slice(1), categorical: ["corner"] });
    expect(new Set(text.categorical["corner"])).toEqual(new Set(["left", "right"]));
    const model = join(dir, "gp.json");
    await ok(["fit", "--data", join(dir, "train.csv"), "--inputs", inputs.join(","), "--target", "gfa", "--seed", "1", "--out", model]);
    const file = JSON.parse(readFileSync(model, "utf8"));
    expect(file.inputSchema[0]).toEqual({ name: "corner", kind: "categorical", levels: ["left", "right"] });
    await ok(["predict", "--model", model, "--data", join(dir, "test.csv"), "--keep", "sample,corner", "--out", join(dir, "pred.csv")]);
    const pred = await readTable(join(dir, "pred.csv"), { columns: ["gfa_mean"], categorical: ["corner"] });
    expect(pred.categorical["corner"]).toEqual(text.categorical["corner"]); // kept as the level text
    const variables: Variable[] = [{ kind: "categorical", name: "corner", levels: ["left", "right"] }, ...inputs.slice(1).map((name) => ({ kind: "continuous" as const, name, min: -1e9, max: 1e9 }))];
    const codec = createVariableCodec(variables);
    const rows = text.rows.map((r, i) => codec.toRow({ corner: text.categorical["corner"]![i]!, ...Object.fromEntries(inputs.slice(1).map((n, k) => [n, r[k]!])) }));
    expect(rows.some((r) => r[0] === 1) && rows.some((r) => r[0] === 0)).toBe(true);
    const mean = loadSurrogate(readFileSync(model, "utf8")).predict(rows).mean.map((r) => r[0]!);
    pred.rows.forEach((r, i) => expect(r[0]).toBeCloseTo(mean[i]!, 9));
    await ok(["assess", "--model", model, "--data", join(dir, "test.csv"), "--target", "gfa", "--out", join(dir, "report")]);
    expect(JSON.parse(readFileSync(join(dir, "report", "report.json"), "utf8"))).toBeTruthy();
  });
  it("refuses a level the model was not trained on, naming the column", async () => {
    const csv = readFileSync(join(dir, "test.csv"), "utf8").replace(/,right,/, ",both,");
    writeFileSync(join(dir, "bad.csv"), csv);
    const r = await runCli(["predict", "--model", join(dir, "gp.json"), "--data", join(dir, "bad.csv"), "--out", join(dir, "bad-pred.csv")]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/column "corner": "both" is not one of the levels "left", "right"/);
  });
});
