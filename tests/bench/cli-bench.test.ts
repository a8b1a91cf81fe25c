import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { Writable } from "node:stream";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { main } from "../../packages/bench/dist/cli/main.js";
import { branin } from "../../packages/bench/src/problem/branin.js";

const bin = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));
const problems = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));
const run = (args: string[]) => spawnSync(process.execPath, [bin, ...args], { encoding: "utf8" });

let dir = "";
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-cli-bench-"));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Runs the CLI in this process (spawning costs seconds per call). */
async function inProcess(args: string[]): Promise<{ status: number; stdout: string; stderr: string }> {
  let stdout = "";
  let stderr = "";
  const sink = (add: (s: string) => void) => new Writable({ write(chunk, _enc, done) { add(String(chunk)); done(); } });
  const status = await main(["node", "floorcast", ...args], { stdout: sink((s) => (stdout += s)), stderr: sink((s) => (stderr += s)) });
  return { status, stdout, stderr };
}

/** A user's mistake: exit 2, one line on stderr, no stack trace. */
async function usage(args: string[], re: RegExp): Promise<void> {
  const r = await inProcess(args);
  expect(r.status).toBe(2);
  expect(r.stderr).toMatch(re);
  expect(r.stderr).not.toMatch(/\n\s+at /);
}

describe("floorcast bench / optimize: usage errors", () => {
  it("the commands are registered", async () => {
    const r = await inProcess(["--help"]);
    for (const c of ["bench", "optimize", "demo"]) expect(r.stdout).toMatch(new RegExp(`\\n\\s+${c}\\b`));
    const d = await inProcess(["demo", "--help"]);
    expect(d.stdout).toMatch(/--out <dir>/);
  });
  it("bench", async () => {
    await usage(["bench", "--suite", "nope", "--out", join(dir, "x")], /suite "nope"; suites: demo, quads, standard/);
    await usage(["bench", "--seeds", "abc", "--out", join(dir, "x")], /--seeds must be a whole number/);
    await usage(["bench", "--suite", "standard", "--problem", "nope", "--out", join(dir, "x")], /no problem "nope" in suite standard/);
    await usage(["bench", "--suite", "demo"], /required option '--out <dir>'/);
  });
  it("optimize", async () => {
    const f = join(problems, "standard-branin.json");
    await usage(["optimize", "--problem", f, "--out", dir], /exactly one of --surrogate FILE or --exact/);
    await usage(["optimize", "--problem", f, "--exact", "--optimizer", "simplex", "--out", dir], /--optimizer must be one of grid, random, lhs, gradient, pso, ga, nsga2, bo/);
    await usage(["optimize", "--problem", f, "--exact", "--optimizer", "nsga2", "--out", dir], /nsga2 is for two objectives/);
    await usage(["optimize", "--problem", join(problems, "larkspur-site-ranking.json"), "--exact", "--out", dir], /site-selection problem/);
    const bad = join(dir, "bad.json");
    writeFileSync(bad, JSON.stringify({ kind: "floorcast.problem", formatVersion: 1 }));
    await usage(["optimize", "--problem", bad, "--exact", "--out", dir], /bad\.json: name/);
    await usage(["optimize", "--problem", f, "--surrogate", join(dir, "missing.json"), "--out", dir], /cannot read .*missing\.json/);
  });
});

describe("floorcast optimize", () => {
  it("--exact with PSO reaches Branin's published minimum 0.397887 (VLSE)", () => {
    const out = join(dir, "exact");
    const r = run(["optimize", "--problem", join(problems, "standard-branin.json"), "--exact", "--optimizer", "pso", "--seed", "3", "--budget", "3000", "--out", out]);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/not a zoning determination/);
    const o = JSON.parse(readFileSync(join(out, "optimum.json"), "utf8"));
    // within 1e-3 of 5/(4π) = 0.397887 (VLSE): PSO with 3000 evaluations, tolerance common practice
    expect(Math.abs(o.optima[0].value - 0.39788735772973816)).toBeLessThan(1e-3);
    expect(o.exactEvaluations).toBe(o.evaluations);
  });
  it("--surrogate optimizes on a model file and reports the design's exact value", async () => {
    const x: number[][] = [];
    for (let i = 0; i <= 6; i++) for (let j = 0; j <= 6; j++) x.push([-5 + (15 * i) / 6, (15 * j) / 6]);
    const gp = fitGaussianProcess({ inputs: ["x1", "x2"], targets: ["f"], x, y: x.map((r) => [branin(r[0]!, r[1]!)]) }, { seed: 1 });
    const model = join(dir, "branin-gp.json");
    writeFileSync(model, JSON.stringify(gp.toJSON()));
    const out = join(dir, "surrogate");
    const r = run(["optimize", "--problem", join(problems, "standard-branin.json"), "--surrogate", model, "--optimizer", "ga", "--out", out]);
    expect(r.status).toBe(0);
    const o = JSON.parse(readFileSync(join(out, "optimum.json"), "utf8"));
    const d = o.optima[0].design;
    // the reported value is the exact Branin value at the design, not the surrogate's
    expect(o.optima[0].value).toBeCloseTo(branin(d.x1, d.x2), 12);
    // beside it, the surrogate's own prediction there (the model file's mean and sd at the design)
    // and exact − predicted
    const at = gp.predict([[d.x1, d.x2]]);
    expect(o.optima[0].surrogate.mean.f).toBeCloseTo(at.mean[0]![0]!, 9);
    expect(o.optima[0].surrogate.sd.f).toBeCloseTo(at.sd![0]![0]!, 9);
    expect(o.optima[0].surrogate.exact.f).toBe(o.optima[0].value);
    expect(o.optima[0].surrogate.difference.f).toBeCloseTo(branin(d.x1, d.x2) - at.mean[0]![0]!, 9);
    expect(r.stdout).toMatch(/surrogate f=\S+ ± \S+ \(exact \S+, exact − surrogate \S+\)/);
    expect(o.exactEvaluations).toBeGreaterThanOrEqual(1);
    const wrong = join(dir, "wrong.json");
    const gp1 = fitGaussianProcess({ inputs: ["a", "b"], targets: ["f"], x, y: x.map((q) => [q[0]!]) }, { seed: 1 });
    writeFileSync(wrong, JSON.stringify(gp1.toJSON()));
    await usage(["optimize", "--problem", join(problems, "standard-branin.json"), "--surrogate", wrong, "--out", `${out}-wrong`], /has inputs a, b; standard-branin needs x1, x2/);
  });
});

describe("floorcast bench: a quick end-to-end run of a tiny suite, then a resumed one", () => {
  it("runs, prints the headline table with the caution, and resumes", () => {
    const suite = join(dir, "suite");
    rmSync(suite, { recursive: true, force: true });
    const fo = JSON.parse(readFileSync(join(problems, "standard-forrester.json"), "utf8"));
    fo.exact = { gridPoints: 201, refineEvaluations: 40 };
    mkdirSync(suite);
    writeFileSync(join(suite, "forrester.json"), JSON.stringify(fo));
    const out = join(dir, "bench-out");
    const args = ["bench", "--suite", "standard", "--problems", suite, "--quick", "--seeds", "1", "--no-peers", "--out", out];
    const r = run(args);
    expect(r.status, r.stderr).toBe(0);
    // one training size for every row: said in the caption, the rows name problem and model
    expect(r.stdout).toMatch(/largest training size \(n = 80\)/);
    expect(r.stdout).toMatch(/standard-forrester\s+gp\s/);
    expect(r.stdout).toMatch(/standard-forrester\s+nn\s/);
    const table = r.stdout.split("\n").filter((l) => /^(problem |-{7}|standard-forrester )/.test(l));
    expect(table).toHaveLength(4);
    for (const line of table) expect(line.length, line).toBeLessThanOrEqual(100);
    expect(r.stdout).toMatch(/not a zoning determination/);
    expect(r.stdout).toMatch(/report: .*report\.html/);
    expect(r.stderr).toMatch(/problem 1\/1 standard-forrester: starting/);
    const report = JSON.parse(readFileSync(join(out, "report.json"), "utf8"));
    expect(report.problems[0].surrogateOptimum.length).toBe(6);
    // Forrester's exact optimum −6.0207400558 (VLSE), found by the 201-point grid plus refinement
    expect(report.problems[0].exactOptimum.value).toBeCloseTo(-6.0207400558, 6);
    // The finished report is kept unless --force (the same meaning as on every writing command).
    const refused = run(args);
    expect(refused.status).toBe(2);
    expect(refused.stderr).toMatch(/report\.json already exists; use --force/);
    const again = run([...args, "--force"]);
    expect(again.status).toBe(0);
    expect(again.stderr).toMatch(/standard-forrester: already finished, reusing its results/);
    expect(JSON.parse(readFileSync(join(out, "report.json"), "utf8")).problems).toEqual(report.problems);
  }, 180_000);
});
