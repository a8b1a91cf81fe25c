import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { evaluateMassing, quadParcel, readManifest, readTable } from "@floorcast/sampler";
import { loadSurrogate } from "@floorcast/surrogate";
import { loadPredictor } from "@floorcast/surrogate/predict";
import { refitTrainer } from "../../packages/bench/dist/cli/assess/refit-trainer.js";
import { runCli } from "./run-cli.js";

let dir = "";
const p = (name: string): string => join(dir, name);
const scenario = {
  kind: "floorcast.scenario",
  formatVersion: 1,
  name: "plate-cli",
  title: "Plate CLI lots, Quillmere",
  description: "Test scenario of the invented district of Quillmere.",
  parameters: [
    { kind: "continuous", name: "frontage", min: 14, max: 30, unit: "m", description: "f" },
    { kind: "continuous", name: "setbackSide", min: 0, max: 4, unit: "m", description: "s" },
    { kind: "continuous", name: "maxFar", min: 1, max: 4, unit: "1", description: "FAR" },
  ],
  fixed: { depth: 32, setbackFront: 3, setbackRear: 6, floorHeight: 3.2, maxHeight: 20, maxCoverage: 0.6, minPlateWidth: 8 },
};

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-plate-"));
  writeFileSync(p("s.json"), JSON.stringify(scenario));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("sample --plate-profile → fit --model plate-stack → predict", () => {
  it("writes the profile columns and says so in the manifest", async () => {
    const r = await runCli(["sample", "--scenario", p("s.json"), "--n", "24", "--seed", "3", "--plate-profile", "--out", p("train.csv")]);
    expect(r.code, r.err).toBe(0);
    const header = readFileSync(p("train.csv"), "utf8").split("\n")[0]!.split(",");
    // ⌊20 / 3.2⌋ = 6 storeys (derived)
    expect(header).toContain("plateArea_6");
    expect(header).not.toContain("plateArea_7");
    expect(header).toEqual(expect.arrayContaining(["rule_floorHeight", "rule_maxHeight", "rule_maxFar", "rule_maxCoverage", "rule_minPlateWidth"]));
    const m = await readManifest(p("train.csv"), "test");
    expect(m.evaluator).toBe("massing-rule-v1+plate-profile");
    expect(m.plateProfile?.storeys).toBe(6);
    expect(m.plateProfile?.naming).toMatch(/plateArea_<k>/);
  });
  it("fits, writes a plate-stack model file and predicts from the input columns alone", async () => {
    const fit = await runCli([
      "fit", "--data", p("train.csv"), "--inputs", "frontage,setbackSide,maxFar", "--target", "gfa,floors",
      "--model", "plate-stack", "--out", p("m.json"),
    ]);
    expect(fit.code, fit.err).toBe(0);
    const file = JSON.parse(readFileSync(p("m.json"), "utf8"));
    expect(file.modelType).toBe("plate-stack");
    expect(file.payload.geometryInputs).toEqual(["frontage", "setbackSide"]);
    expect(file.payload.ruleValues.maxFar).toEqual({ input: "maxFar" });
    // query rows: the exact values from the massing rule for comparison (derived)
    const query = [
      [22, 1.5, 2.5],
      [16, 3.5, 1.2],
    ];
    writeFileSync(p("q.csv"), `frontage,setbackSide,maxFar\n${query.map((q) => q.join(",")).join("\n")}\n`);
    const pr = await runCli(["predict", "--model", p("m.json"), "--data", p("q.csv"), "--keep", "", "--out", p("pred.csv")]);
    expect(pr.code, pr.err).toBe(0);
    const lines = readFileSync(p("pred.csv"), "utf8").trim().split("\n");
    expect(lines[0]).toBe("gfa_mean,gfa_sd,floors_mean,floors_sd,in_domain,error");
    lines.slice(1).forEach((line, i) => {
      const [f, s, far] = query[i]!;
      const exact = evaluateMassing({
        parcel: quadParcel({ frontage: f!, depth: 32 }),
        setbacks: { front: 3, side: s!, rear: 6 },
        floorHeight: 3.2,
        maxHeight: 20,
        maxFar: far!,
        maxCoverage: 0.6,
        minPlateWidth: 8,
      });
      const gfa = Number(line.split(",")[0]);
      // 24 training rows of a smooth two-input geometry: within 3% of the exact gross floor area
      expect(Math.abs(gfa - exact.gfa)).toBeLessThanOrEqual(0.03 * exact.gfa);
    });
  }, 600_000);
  it("names the missing plate-profile columns (exit 2) and refuses --plate-profile with an external evaluator", async () => {
    const plain = await runCli(["sample", "--scenario", p("s.json"), "--n", "6", "--seed", "1", "--out", p("plain.csv")]);
    expect(plain.code, plain.err).toBe(0);
    const r = await runCli(["fit", "--data", p("plain.csv"), "--inputs", "frontage,setbackSide,maxFar", "--target", "gfa", "--model", "plate-stack", "--out", p("x.json")]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/plate-stack needs the plate-profile columns; .*lacks rule_floorHeight, rule_maxHeight, plateArea_1, plateWidth_1/);
    expect(r.err.trim().split("\n")).toHaveLength(1);
    const e = await runCli(["sample", "--scenario", p("s.json"), "--n", "6", "--seed", "1", "--plate-profile", "--evaluator-command", "cat", "--out", p("e.csv")]);
    expect(e.code).toBe(2);
    expect(e.err).toMatch(/--plate-profile is for the built-in massing rule/);
    const t = await runCli(["fit", "--data", p("train.csv"), "--inputs", "frontage,setbackSide,maxFar", "--target", "facadeLength", "--model", "plate-stack", "--out", p("x.json")]);
    expect(t.code).toBe(2);
    expect(t.err).toMatch(/facadeLength is not one of them/);
  });
});

describe("fit --model plate-stack --inner nn; assess --folds refits a plate stack", () => {
  const inputs = "frontage,setbackSide,maxFar";
  const query = [
    [22, 1.5, 2.5],
    [16, 3.5, 1.2],
    [29, 0.5, 3.8],
  ];
  it("--inner nn fits MLP inner models; the file loads with loadSurrogate and loadPredictor, which agree", async () => {
    const fit = await runCli([
      "fit", "--data", p("train.csv"), "--inputs", inputs, "--target", "gfa,floors", "--model", "plate-stack",
      "--inner", "nn", "--layers", "4", "--epochs", "5", "--backend", "cpu", "--seed", "2", "--out", p("nn.json"),
    ]);
    expect(fit.code, fit.err).toBe(0);
    const text = readFileSync(p("nn.json"), "utf8");
    const file = JSON.parse(text);
    expect(file.payload.quantities.lotArea.model.modelType).toBe("mlp");
    expect(file.payload.quantities.baseWidth.model.modelType).toBe("mlp");
    // an MLP gives no sd: no draws, the plug-in point (README "Plate-stack surrogate")
    expect(file.payload.draws).toEqual([]);
    expect(file.payload.pointMode).toBe("plugin");
    const a = loadSurrogate(text).predict(query);
    const b = loadPredictor(text).predict(query);
    // both evaluate the inner MLPs with the predictor's float64 forward pass and the same rule: identical numbers
    expect(b.mean).toEqual(a.mean);
    for (const row of a.mean) {
      expect(Number.isFinite(row[0])).toBe(true);
      expect(Number.isInteger(row[1])).toBe(true); // whole floors from the rule at the inner means
    }
  }, 600_000);

  it("the refit of a plate-stack file on its own rows and seed reproduces the file (settings carried over)", async () => {
    const fit = await runCli([
      "fit", "--data", p("train.csv"), "--inputs", inputs, "--target", "gfa", "--model", "plate-stack",
      "--point", "plugin", "--draws", "16", "--width-trend", "none", "--seed", "4", "--out", p("ps.json"),
    ]);
    expect(fit.code, fit.err).toBe(0);
    const file = JSON.parse(readFileSync(p("ps.json"), "utf8"));
    expect("trend" in file.payload.quantities.baseWidth).toBe(false);
    const t = await readTable(p("train.csv"), { inputs: inputs.split(","), targets: ["gfa"] });
    const again = await refitTrainer(file, "ps.json", p("train.csv"))({ inputs: inputs.split(","), targets: ["gfa"], x: t.x, y: t.y }, 4);
    const refit = again.toJSON() as { payload: unknown };
    expect(refit.payload).toEqual(file.payload);
  }, 600_000);

  it("assess --folds 3 refits the plate stack per fold from --train's plate profile; a CSV without one is named", async () => {
    const fit = await runCli(["fit", "--data", p("train.csv"), "--inputs", inputs, "--target", "gfa", "--model", "plate-stack", "--draws", "16", "--out", p("cv.json")]);
    expect(fit.code, fit.err).toBe(0);
    const out = p("cv-report");
    const r = await runCli(["assess", "--model", p("cv.json"), "--data", p("train.csv"), "--target", "gfa", "--train", p("train.csv"), "--folds", "3", "--out", out]);
    expect(r.code, r.err).toBe(0);
    const report = JSON.parse(readFileSync(join(out, "report.json"), "utf8"));
    expect(report.crossValidation.method).toBe("k-fold");
    expect(report.crossValidation.folds).toBe(3);
    expect(report.crossValidation.metrics.n).toBe(24);
    // out-of-fold predictions of rows away from a step are the exact rule on near-exact geometry, so at least half
    // are within 0.1% (derived; the in-sample check above allows 3%); a misplaced step costs a whole floor
    expect(report.crossValidation.metrics.medianRelError).toBeLessThan(1e-3);
    const plain = await runCli(["assess", "--model", p("cv.json"), "--data", p("plain.csv"), "--target", "gfa", "--train", p("plain.csv"), "--folds", "2", "--out", p("cv-plain")]);
    expect(plain.code).toBe(2);
    expect(plain.err).toMatch(/assess: --model plate-stack needs the plate-profile columns; .*plain\.csv lacks rule_floorHeight/);
  }, 600_000);
});
