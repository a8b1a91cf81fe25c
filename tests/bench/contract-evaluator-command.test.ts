import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { loadProblem, runProblem } from "@floorcast/bench";
import { floorcastTrainer } from "../../packages/bench/src/harness/floorcast-trainer.js";
import { sampleTrainingSet } from "../../packages/bench/src/harness/sample-training-set.js";
import { runCli } from "./run-cli.js";

// A user's own evaluator as a problem: a problem file naming an external command (JSON Lines, as
// `sample --evaluator-command` speaks it) runs through optimize --exact, optimize --surrogate and the benchmark.
// The command here wraps the built-in massing rule, so every number must equal the scenario problem's.

const sampler = pathToFileURL(fileURLToPath(new URL("../../packages/sampler/dist/index.js", import.meta.url))).href;
const scenarioFile = fileURLToPath(new URL("../../datasets/scenarios/quillmere-core.json", import.meta.url));
const base = JSON.parse(readFileSync(fileURLToPath(new URL("../../datasets/problems/core-tower-gfa.json", import.meta.url)), "utf8"));
let dir = "";

const WRAPPER = `
import { createInterface } from "node:readline";
import { evaluateMassing, loadScenario, massingOutputs, scenarioToMassingInput } from ${JSON.stringify(sampler)};
const scenario = await loadScenario(${JSON.stringify(scenarioFile)});
const names = scenario.parameters.map((p) => p.name);
for await (const line of createInterface({ input: process.stdin })) {
  if (line.trim() === "") continue;
  const input = JSON.parse(line);
  const record = Object.fromEntries(names.map((n) => [n, input[n]]));
  // the answer echoes the request's sample id (the evaluator protocol)
  process.stdout.write(JSON.stringify({ sample: input.sample, ...massingOutputs(evaluateMassing(scenarioToMassingInput(scenario, record))) }) + "\\n");
}
`;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-command-problem-"));
  writeFileSync(join(dir, "rule.mjs"), WRAPPER);
  const exact = { gridPoints: 11, refineEvaluations: 20 };
  writeFileSync(join(dir, "scenario-problem.json"), JSON.stringify({ ...base, name: "tower-rule", scenario: scenarioFile, exact }));
  const { scenario: _s, ...rest } = base;
  writeFileSync(
    join(dir, "command-problem.json"),
    JSON.stringify({
      ...rest,
      name: "tower-command",
      evaluatorCommand: `${JSON.stringify(process.execPath)} rule.mjs`,
      variables: [
        { name: "maxHeight", kind: "continuous", min: 25, max: 90, step: 0.1 },
        { name: "maxCoverage", kind: "continuous", min: 0.4, max: 0.9 },
        { name: "floorHeight", kind: "categorical", levels: [3.5, 3.9, 4.2] },
      ],
      exact,
    }),
  );
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const optimum = (name: string) => JSON.parse(readFileSync(join(dir, name, "optimum.json"), "utf8")).optima[0];

describe("a problem file with an external evaluator command", () => {
  it("optimize --exact gives the built-in rule's optimum", async () => {
    for (const p of ["scenario", "command"]) {
      const r = await runCli(["optimize", "--problem", join(dir, `${p}-problem.json`), "--exact", "--seed", "3", "--budget", "300", "--out", join(dir, `exact-${p}`)]);
      expect(r.code, r.err).toBe(0);
    }
    const a = optimum("exact-scenario");
    const b = optimum("exact-command");
    expect(b.design).toEqual(a.design);
    expect(b.value).toBe(a.value);
  }, 240_000);

  it("optimize --surrogate on a model fitted to the command's dataset gives the same optimum as on the rule's", async () => {
    for (const p of ["scenario", "command"]) {
      const problem = await loadProblem(join(dir, `${p}-problem.json`));
      const train = await sampleTrainingSet(problem, 40, "train-1", dir);
      if (p === "command") expect(JSON.parse(readFileSync(train.csv.replace(/\.csv$/, ".manifest.json"), "utf8")).evaluator).toMatch(/^command: /);
      await floorcastTrainer("gp", true).fit(train, 1, join(dir, `${p}-gp.json`));
      const r = await runCli(["optimize", "--problem", join(dir, `${p}-problem.json`), "--surrogate", join(dir, `${p}-gp.json`), "--seed", "3", "--budget", "300", "--out", join(dir, `surrogate-${p}`)]);
      expect(r.code, r.err).toBe(0);
    }
    // the two datasets hold the same rows, so the two model files are the same bytes, and so are the optima
    expect(readFileSync(join(dir, "command-gp.json")).equals(readFileSync(join(dir, "scenario-gp.json")))).toBe(true);
    expect(optimum("surrogate-command").design).toEqual(optimum("surrogate-scenario").design);
    expect(optimum("surrogate-command").value).toBe(optimum("surrogate-scenario").value);
  }, 240_000);

  it("the benchmark measures the same exact optimum and the same gaps", async () => {
    const reports = [];
    for (const p of ["scenario", "command"]) {
      const problem = await loadProblem(join(dir, `${p}-problem.json`));
      try {
        reports.push(
          await runProblem(problem, {
            plans: [{ trainer: floorcastTrainer("gp", true), sampler: "lhs-maximin", sizes: [20], seeds: [1] }],
            testSize: 40,
            refineBudget: 5,
            targets: { search: 60, bo: 12, seeds: 1 },
            candidates: 256,
          }),
        );
      } finally {
        await problem.close?.();
      }
    }
    const [a, b] = reports;
    expect(b!.exactOptimum.value).toBe(a!.exactOptimum.value);
    expect(b!.surrogateOptimum.map((r) => r.gap)).toEqual(a!.surrogateOptimum.map((r) => r.gap));
    // bo-plate-stack needs an evaluator that reports plate profiles: the built-in rule does, this command does not
    const common = (r: typeof a) => r!.evaluationsToTarget.filter((e) => e.method !== "bo-plate-stack").map((e) => e.median);
    expect(common(b)).toEqual(common(a));
  }, 600_000);
});
