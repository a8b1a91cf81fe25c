import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { runCli } from "./run-cli.js";
import { loadSurrogate } from "@floorcast/surrogate";

const bin = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));
const run = (args: string[]) => spawnSync(process.execPath, [bin, ...args], { encoding: "utf8" });

/** The CLI in-process (faster than a process per case), capturing stderr. */
const runHere = async (args: string[]): Promise<{ status: number; stderr: string }> => {
  const r = await runCli(args);
  return { status: r.code, stderr: r.err };
};

let dir = "";
const p = (name: string): string => join(dir, name);
const readCsv = (file: string) => {
  const lines = readFileSync(file, "utf8").trim().split("\n");
  return { header: lines[0]!.split(","), rows: lines.slice(1).map((l) => l.split(",")) };
};

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-fit-nn-"));
  const rows = ["a,b,y,z"];
  // A smooth two-target map on a 10 × 8 grid (derived).
  for (let i = 0; i < 10; i++) for (let j = 0; j < 8; j++) rows.push(`${i},${j / 7},${Math.sin(i / 3) + j / 7},${i * (j / 7)}`);
  writeFileSync(p("train.csv"), `${rows.join("\n")}\n`);
  writeFileSync(p("query.csv"), "a,b\n4.5,0.5\n0,0\n9,1\n");
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("floorcast fit --model nn / predict", () => {
  it("fits an MLP without any tfjs banner and predicts what the library predicts", () => {
    const fit = run(["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y,z", "--model", "nn", "--layers", "8,8", "--epochs", "20", "--seed", "3", "--out", p("nn.json")]);
    expect(fit.status).toBe(0);
    expect(fit.stdout).toMatch(/not a zoning determination/);
    // Nothing but floorcast's own lines: tfjs would print "Hi, looks like you are running TensorFlow.js in Node.js".
    for (const line of `${fit.stdout}${fit.stderr}`.trim().split("\n")) expect(line).toMatch(/^(fit: |Estimates for early feasibility)/);
    expect(fit.stderr).toMatch(/fit: nn 8-8 on (wasm|cpu): \d+ epochs/);
    const pred = run(["predict", "--model", p("nn.json"), "--data", p("query.csv"), "--keep", "", "--out", p("nn.csv")]);
    expect(pred.status).toBe(0);
    expect(`${pred.stdout}${pred.stderr}`).not.toMatch(/TensorFlow|tfjs/);
    const out = readCsv(p("nn.csv"));
    expect(out.header).toEqual(["y_mean", "y_sd", "z_mean", "z_sd", "in_domain", "error"]);
    const lib = loadSurrogate(readFileSync(p("nn.json"), "utf8")).predict([[4.5, 0.5], [0, 0], [9, 1]]);
    out.rows.forEach((r, i) => {
      expect(Number(r[0])).toBe(lib.mean[i]![0]);
      expect(r[1]).toBe("");
      expect(Number(r[2])).toBe(lib.mean[i]![1]);
    });
  });

  it("--ensemble 2 --conformal 0.8 writes a nested file; predict adds <target>_lower/_upper around the mean", () => {
    const fit = run(["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y,z", "--model", "nn", "--layers", "4", "--epochs", "5", "--ensemble", "2", "--conformal", "0.8", "--backend", "cpu", "--out", p("nnc.json")]);
    expect(fit.status).toBe(0);
    expect(fit.stderr).toMatch(/fit: conformal 0.8 \(normalised scores, 20 held-out rows\)/);
    const file = JSON.parse(readFileSync(p("nnc.json"), "utf8"));
    expect(file.modelType).toBe("conformal");
    expect(file.payload.base.modelType).toBe("ensemble");
    expect(file.payload.base.payload.members.map((m: { modelType: string }) => m.modelType)).toEqual(["mlp", "mlp"]);
    expect(run(["predict", "--model", p("nnc.json"), "--data", p("query.csv"), "--keep", "", "--out", p("nnc.csv")]).status).toBe(0);
    const out = readCsv(p("nnc.csv"));
    expect(out.header).toEqual(["y_mean", "y_sd", "y_lower", "y_upper", "z_mean", "z_sd", "z_lower", "z_upper", "in_domain", "error"]);
    for (const r of out.rows) {
      const [m, sd, lo, hi] = r.slice(0, 4).map(Number);
      expect(sd).toBeGreaterThanOrEqual(0);
      expect(lo).toBeLessThanOrEqual(m!);
      expect(hi).toBeGreaterThanOrEqual(m!);
    }
  });

  it("user mistakes exit 2 with one line on stderr", async () => {
    for (const [flag, value, msg] of [
      ["--layers", "8,x", /--layers must be a whole number ≥ 1, got "x"/],
      ["--backend", "gpu", /--backend must be wasm, cpu or auto/],
      ["--ensemble", "1", /--ensemble must be a whole number ≥ 2, got "1"/],
      ["--conformal", "1.5", /--conformal must be a coverage in \(0, 1\)/],
      // 80 rows × 0.25 = 20 calibration rows; coverage 0.99 needs ⌈(n + 1)·0.99⌉ ≤ n, n ≥ 99 (Lei et al. 2018, §2.2; derived)
      ["--conformal", "0.99", /fitConformal: 20 calibration rows .* too few for coverage 0\.99: it needs at least 99/],
    ] as const) {
      const r = await runHere(["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y", "--model", "nn", "--epochs", "1", flag, value, "--out", p("bad.json")]);
      expect(r.status).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(msg);
    }
  });
});
