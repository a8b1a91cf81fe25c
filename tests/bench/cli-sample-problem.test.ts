import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { readTable } from "@floorcast/sampler";
import { loadSurrogate } from "@floorcast/surrogate";
import { loadProblem } from "@floorcast/bench";
import { sampleTrainingSet } from "../../packages/bench/src/harness/sample-training-set.js";
import { runCli } from "./run-cli.js";

// `floorcast sample --problem FILE` samples a problem's own variables with its fixed values, through the same
// problem.dataset path the benchmark trains on, so its CSV fits a model `optimize --surrogate` accepts for that
// problem; core-tower-gfa has a categorical variable (floorHeight, levels 3.5, 3.9, 4.2 m).
const problems = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));
const tower = join(problems, "core-tower-gfa.json");
const dir = mkdtempSync(join(tmpdir(), "floorcast-sample-problem-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const p = (name: string) => join(dir, name);

async function ok(args: string[]): Promise<void> {
  const r = await runCli(args);
  expect(r.code, r.err).toBe(0);
}

describe("sample --problem", () => {
  it("writes the benchmark's own training set byte for byte: the problem's variables, its fixed values, its evaluator", async () => {
    await ok(["sample", "--problem", tower, "--n", "30", "--seed", "5", "--design", "lhs-maximin", "--out", p("cli.csv")]);
    const problem = await loadProblem(tower);
    const bench = await sampleTrainingSet(problem, 30, 5, dir, undefined, "lhs-maximin");
    expect(readFileSync(p("cli.csv"), "utf8")).toBe(readFileSync(bench.csv, "utf8"));
    const manifest = JSON.parse(readFileSync(p("cli.manifest.json"), "utf8"));
    expect(manifest.scenario.name).toBe("core-tower-gfa");
    expect(manifest.inputSchema).toEqual([
      { name: "maxHeight", kind: "continuous", min: 25, max: 90, scale: "linear", step: 0.1 },
      { name: "maxCoverage", kind: "continuous", min: 0.4, max: 0.9, scale: "linear" },
      { name: "floorHeight", kind: "categorical", levels: [3.5, 3.9, 4.2] },
    ]);
    // only the variables are columns of inputs (the fixed lot is not), and every row's GFA is the exact rule's
    // with the problem's fixed values (derived: problem.evaluate fixes them the same way)
    const header = readFileSync(p("cli.csv"), "utf8").split("\n")[0]!.split(",");
    for (const fixed of ["frontage", "depth", "maxFar", "minPlateArea"]) expect(header).not.toContain(fixed);
    const t = await readTable(p("cli.csv"), { inputs: ["maxHeight", "maxCoverage", "floorHeight"], targets: ["gfa"] });
    for (const [i, [maxHeight, maxCoverage, floorHeight]] of t.x.entries()) {
      expect([3.5, 3.9, 4.2]).toContain(floorHeight);
      expect(t.y[i]![0]).toBe(problem.evaluate({ maxHeight: maxHeight!, maxCoverage: maxCoverage!, floorHeight: floorHeight! }).gfa);
    }
  });

  it("round trip: sample --problem → fit → optimize --surrogate with the same problem is accepted, the model fed the CSV's coding", async () => {
    await ok(["sample", "--problem", tower, "--n", "60", "--seed", "3", "--out", p("train.csv")]);
    await ok(["fit", "--data", p("train.csv"), "--inputs", "maxHeight,maxCoverage,floorHeight", "--target", "gfa,height,coverage", "--seed", "1", "--out", p("gp.json")]);
    const text = readFileSync(p("gp.json"), "utf8");
    expect(JSON.parse(text).inputSchema).toEqual(JSON.parse(readFileSync(p("train.manifest.json"), "utf8")).inputSchema);
    await ok(["optimize", "--problem", tower, "--surrogate", p("gp.json"), "--seed", "2", "--budget", "300", "--out", p("opt")]);
    const o = JSON.parse(readFileSync(p("opt/optimum.json"), "utf8"));
    const best = o.optima[0];
    expect([3.5, 3.9, 4.2]).toContain(best.design.floorHeight);
    // the surrogate's mean recorded at the optimum is the model's prediction on the design in the CSV's coding
    const m = loadSurrogate(text);
    const row = m.inputs.map((n) => best.design[n] as number);
    expect(best.surrogate.mean.gfa).toBe(m.predict([row]).mean[0]![m.targets.indexOf("gfa")]);
    // and the exact value beside it is the problem's own evaluation of that design
    expect(best.surrogate.exact.gfa).toBe((await loadProblem(tower)).evaluate(best.design).gfa);
  }, 240_000);

  it("a test-function problem (Branin) writes its variables and f", async () => {
    await ok(["sample", "--problem", join(problems, "standard-branin.json"), "--n", "5", "--seed", "1", "--out", p("branin.csv")]);
    const [head, first] = readFileSync(p("branin.csv"), "utf8").split("\n");
    expect(head).toBe("sample,x1,x2,f");
    const [, x1, x2, f] = first!.split(",").map(Number);
    // Branin–Hoo (Dixon & Szegő 1978; as given by Surjanovic & Bingham's Virtual Library of Simulation Experiments)
    const b = (x: number, y: number) => (y - (5.1 / (4 * Math.PI ** 2)) * x ** 2 + (5 / Math.PI) * x - 6) ** 2 + 10 * (1 - 1 / (8 * Math.PI)) * Math.cos(x) + 10;
    expect(f).toBeCloseTo(b(x1!, x2!), 9);
  });

  it("user mistakes: neither or both of --scenario/--problem, --problem with --evaluator-command or --plate-profile, a missing file: exit 2, one line", async () => {
    const scenario = fileURLToPath(new URL("../../datasets/scenarios/quillmere-core.json", import.meta.url));
    writeFileSync(p("not-a-problem.json"), "{}");
    const cases: [string[], RegExp][] = [
      [[], /give one of --scenario FILE and --problem FILE/],
      [["--scenario", scenario, "--problem", tower], /give one of --scenario FILE and --problem FILE/],
      [["--problem", tower, "--evaluator-command", "cat"], /--problem evaluates with the problem's own evaluator/],
      [["--problem", tower, "--plate-profile"], /drop --plate-profile/],
      [["--problem", p("missing.json")], /missing\.json/],
      [["--problem", p("not-a-problem.json")], /not-a-problem\.json/],
    ];
    for (const [args, message] of cases) {
      const r = await runCli(["sample", ...args, "--n", "4", "--seed", "1", "--out", p("x.csv")]);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.err.trim().split("\n"), args.join(" ")).toHaveLength(1);
      expect(r.err).toMatch(message);
    }
  });
});
