import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadSurrogate, regressionMetrics, sealModelFile } from "@floorcast/surrogate";
import { loadProblem, surrogateEvaluator } from "@floorcast/bench";
import { readTable } from "@floorcast/sampler";
import { runCli } from "./run-cli.js";

// The user's path for a problem with a categorical input: `sample` writes floorHeight as its level value (3.5,
// 3.9, 4.2), `fit` trains on those values, and `optimize --surrogate` must feed the model the same coding.

const problems = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));
const core = JSON.parse(readFileSync(fileURLToPath(new URL("../../datasets/scenarios/quillmere-core.json", import.meta.url)), "utf8"));
let dir = "";

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-contract-"));
  // the scenario of core-tower-gfa: its three variables sampled, the problem's fixed values fixed (scenario order
  // maxHeight, floorHeight, maxCoverage differs from the problem's maxHeight, maxCoverage, floorHeight)
  const problem = JSON.parse(readFileSync(join(problems, "core-tower-gfa.json"), "utf8"));
  const keep = new Set(["maxHeight", "floorHeight", "maxCoverage"]);
  const scenario = {
    ...core,
    name: "core-tower-study",
    parameters: core.parameters.filter((p: { name: string }) => keep.has(p.name)),
    fixed: { ...core.fixed, ...problem.fixed },
  };
  writeFileSync(join(dir, "scenario.json"), JSON.stringify(scenario));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function ok(args: string[]): Promise<string> {
  const r = await runCli(args);
  expect(r.code, r.err).toBe(0);
  return r.err;
}

describe("sample → fit → optimize --surrogate on core-tower-gfa (a categorical input)", () => {
  it("records the input schema in the manifest and the model file", async () => {
    for (const [name, seed] of [["train", "11"], ["test", "12"]] as const) {
      await ok(["sample", "--scenario", join(dir, "scenario.json"), "--n", name === "train" ? "160" : "60", "--seed", seed, "--out", join(dir, `${name}.csv`)]);
    }
    const manifest = JSON.parse(readFileSync(join(dir, "train.manifest.json"), "utf8"));
    expect(manifest.inputSchema).toEqual([
      { name: "maxHeight", kind: "continuous", min: 25, max: 90, scale: "linear" },
      { name: "floorHeight", kind: "categorical", levels: [3.5, 3.9, 4.2] },
      { name: "maxCoverage", kind: "continuous", min: 0.4, max: 0.9, scale: "linear" },
    ]);
    // the CSV holds the level value, not its index
    const csv = await readTable(join(dir, "train.csv"), { inputs: ["floorHeight"], targets: [] });
    expect(new Set(csv.x.map((r) => r[0]))).toEqual(new Set([3.5, 3.9, 4.2]));
  });

  for (const family of ["gp", "nn"] as const) {
    it(`${family}: optimize's surrogate values equal model.predict on CSV-coded rows, and the optimum's exact value is within the model's test error`, async () => {
      const model = join(dir, `${family}.json`);
      await ok(["fit", "--data", join(dir, "train.csv"), "--inputs", "maxHeight,floorHeight,maxCoverage", "--target", "gfa,height,coverage", "--model", family, "--seed", "1", "--out", model]);
      const text = readFileSync(model, "utf8");
      expect(JSON.parse(text).inputSchema[1]).toEqual({ name: "floorHeight", kind: "categorical", levels: [3.5, 3.9, 4.2] });
      const m = loadSurrogate(text);
      const out = join(dir, `opt-${family}`);
      await ok(["optimize", "--problem", join(problems, "core-tower-gfa.json"), "--surrogate", model, "--seed", "2", "--budget", "600", "--out", out]);
      const o = JSON.parse(readFileSync(join(out, "optimum.json"), "utf8"));
      const problem = await loadProblem(join(problems, "core-tower-gfa.json"));
      // the evaluator optimize builds: variables in the model's input order
      const ev = surrogateEvaluator(m, m.inputs.map((n) => problem.trainingVariables.find((v) => v.name === n)!));
      // the test set's error of this model on gfa: the yardstick of "agrees with the exact value" (derived)
      const test = await readTable(join(dir, "test.csv"), { inputs: [...m.inputs], targets: ["gfa"] });
      const rmse = regressionMetrics(test.y.map((r) => r[0]!), m.predict(test.x).mean.map((r) => r[0]!)).rmse;
      const designs = [o.optima[0].design, { maxHeight: 45, maxCoverage: 0.6, floorHeight: 3.9 }];
      for (const d of designs) {
        const csvRow = m.inputs.map((n) => d[n] as number); // the CSV coding: floorHeight as 3.5/3.9/4.2
        const predicted = m.predict([csvRow]).mean[0]![0]!;
        const [viaOptimize] = await ev.evaluate([d]);
        expect(viaOptimize!.gfa).toBe(predicted);
        const exact = problem.evaluate(d).gfa!;
        // within 3 test-set RMSE of the exact GFA (the bug fed the level index and was off by ~35%: 18,309 vs 13,500)
        expect(Math.abs(predicted - exact), `${family} at ${JSON.stringify(d)}: predicted ${predicted}, exact ${exact}, rmse ${rmse}`).toBeLessThan(3 * rmse);
      }
      expect(o.optima[0].value).toBeCloseTo(problem.evaluate(o.optima[0].design).gfa!, 9);
    }, 240_000);
  }

  it("refuses a problem whose categorical level the model was not trained on, naming the column", async () => {
    const p = JSON.parse(readFileSync(join(problems, "core-tower-gfa.json"), "utf8"));
    p.scenario = join(fileURLToPath(new URL("../../datasets/scenarios/", import.meta.url)), "quillmere-core.json");
    p.variables = p.variables.map((v: { name: string }) => (v.name === "floorHeight" ? { ...v, levels: [3.5, 3.9, 4.2] } : v));
    writeFileSync(join(dir, "p.json"), JSON.stringify(p));
    const fh = JSON.parse(readFileSync(join(dir, "gp.json"), "utf8"));
    fh.inputSchema[1].levels = [3.5, 3.9];
    writeFileSync(join(dir, "narrow.json"), JSON.stringify(sealModelFile(fh)));
    const r = await runCli(["optimize", "--problem", join(dir, "p.json"), "--surrogate", join(dir, "narrow.json"), "--out", join(dir, "x")]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/column floorHeight: level 4\.2 is not one of the levels 3\.5, 3\.9/);
  });

  it("predict refuses a CSV whose categorical column holds a value that is not a level", async () => {
    const rows = readFileSync(join(dir, "test.csv"), "utf8").split("\n");
    const header = rows[0]!.split(",");
    const j = header.indexOf("floorHeight");
    const bad = rows[1]!.split(",");
    bad[j] = "1"; // a level index, as the old optimizer coding fed it
    writeFileSync(join(dir, "bad.csv"), `${rows[0]}\n${bad.join(",")}\n`);
    const r = await runCli(["predict", "--model", join(dir, "gp.json"), "--data", join(dir, "bad.csv"), "--out", join(dir, "p.csv")]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/column floorHeight, row 1: 1 is not one of the levels 3\.5, 3\.9, 4\.2/);
  });
});

describe("a log-scale parameter round-trips: scenario → manifest → model file → problem → optimize --surrogate", () => {
  it("keeps scale log at every step", async () => {
    const keep = new Set(["maxFar", "maxCoverage"]);
    const scenario = {
      ...core,
      name: "core-far-study",
      parameters: core.parameters.filter((p: { name: string }) => keep.has(p.name)).map((p: { name: string }) => (p.name === "maxFar" ? { ...p, log: true } : p)),
      fixed: { ...core.fixed, frontage: 40, depth: 45, rearRatio: 1, skew: 0, setbackRear: 3, maxHeight: 60, floorHeight: 3.9, minPlateArea: 200 },
    };
    writeFileSync(join(dir, "far.json"), JSON.stringify(scenario));
    await ok(["sample", "--scenario", join(dir, "far.json"), "--n", "40", "--seed", "3", "--out", join(dir, "far.csv")]);
    const manifest = JSON.parse(readFileSync(join(dir, "far.manifest.json"), "utf8"));
    expect(manifest.inputSchema[0]).toEqual({ name: "maxFar", kind: "continuous", min: 3, max: 12, scale: "log" });
    await ok(["fit", "--data", join(dir, "far.csv"), "--inputs", "maxFar,maxCoverage", "--target", "gfa", "--out", join(dir, "far-gp.json")]);
    expect(JSON.parse(readFileSync(join(dir, "far-gp.json"), "utf8")).inputSchema[0]).toEqual(manifest.inputSchema[0]);
    const problem = {
      kind: "floorcast.problem",
      formatVersion: 1,
      name: "far-study",
      title: "FAR study",
      description: "Most floor area over the FAR cap and the coverage cap.",
      suites: ["test"],
      scenario: join(dir, "far.json"),
      variables: [{ name: "maxFar" }, { name: "maxCoverage" }],
      objectives: [{ output: "gfa", sense: "maximise" }],
    };
    writeFileSync(join(dir, "far-problem.json"), JSON.stringify(problem));
    const loaded = await loadProblem(join(dir, "far-problem.json"));
    expect(loaded.optimization.variables[0]).toEqual({ kind: "continuous", name: "maxFar", min: 3, max: 12, log: true });
    await ok(["optimize", "--problem", join(dir, "far-problem.json"), "--surrogate", join(dir, "far-gp.json"), "--budget", "200", "--out", join(dir, "far-out")]);
  }, 120_000);
});
