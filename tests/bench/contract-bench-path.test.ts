import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadProblem } from "@floorcast/bench";
import { sampleTrainingSet } from "../../packages/bench/src/harness/sample-training-set.js";
import { floorcastTrainer } from "../../packages/bench/src/harness/floorcast-trainer.js";
import { runCli } from "./run-cli.js";

// The benchmark measures the files a user holds: its training set is a dataset written by writeDataset (CSV and
// manifest), its model the file the one fit entry writes. A model written by the bench and one written by
// `floorcast fit` on the same rows with the same options are the same bytes.

const problems = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));
let dir = "";
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-bench-path-"));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("the bench trains through the user's path", () => {
  it("writes its training set as a dataset with a manifest and input schema", async () => {
    const problem = await loadProblem(join(problems, "core-tower-gfa.json"));
    const train = await sampleTrainingSet(problem, 24, "train-1", dir);
    const manifest = JSON.parse(readFileSync(train.csv.replace(/\.csv$/, ".manifest.json"), "utf8"));
    expect(manifest.design).toBe("lhs-maximin");
    expect(manifest.evaluator).toBe("massing-rule-v1+plate-profile"); // the profile plate-stack trains on
    expect(manifest.inputSchema.map((e: { name: string }) => e.name)).toEqual(["maxHeight", "maxCoverage", "floorHeight"]);
    expect(manifest.inputSchema[0]).toEqual({ name: "maxHeight", kind: "continuous", min: 25, max: 90, scale: "linear", step: 0.1 });
    // every categorical cell is a level value, as `sample` writes it
    expect(new Set(train.x.map((r) => r[2]))).toEqual(new Set([3.5, 3.9, 4.2]));
  }, 120_000);

  for (const [family, flags] of [
    ["gp", ["--restarts", "2"]],
    ["nn", ["--layers", "32,32", "--epochs", "150", "--batch-size", "16", "--learning-rate", "0.005"]],
  ] as const) {
    it(`${family}: the model file the bench writes is byte-identical to floorcast fit's on the same rows and options`, async () => {
      const problem = await loadProblem(join(problems, "standard-branin.json"));
      const train = await sampleTrainingSet(problem, 30, `train-${family}`, dir);
      const benchFile = join(dir, `bench-${family}.json`);
      const model = await floorcastTrainer(family, true).fit(train, 4, benchFile);
      const fitFile = join(dir, `fit-${family}.json`);
      const r = await runCli(["fit", "--data", train.csv, "--inputs", train.inputs.join(","), "--target", train.targets.join(","), "--model", family, "--seed", "4", ...flags, "--out", fitFile]);
      expect(r.code, r.err).toBe(0);
      const a = readFileSync(benchFile);
      const b = readFileSync(fitFile);
      expect(a.equals(b)).toBe(true);
      expect(JSON.parse(a.toString()).inputSchema).toEqual([
        { name: "x1", kind: "continuous", min: -5, max: 10, scale: "linear" },
        { name: "x2", kind: "continuous", min: 0, max: 15, scale: "linear" },
      ]);
      // and the bench measures the model loaded back from that file
      expect((model as { inputs: readonly string[] }).inputs).toEqual(["x1", "x2"]);
    }, 240_000);
  }
});
