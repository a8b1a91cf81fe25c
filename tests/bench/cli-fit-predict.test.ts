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
/** The same CLI in-process (much faster than a process per case), capturing stdout and stderr. */
const runHere = async (args: string[]): Promise<{ status: number; stdout: string; stderr: string }> => {
  const r = await runCli(args);
  return { status: r.code, stdout: r.out, stderr: r.err };
};
// Forrester et al. (2008), f(x) = (6x − 2)² sin(12x − 4); minimum −6.0207400558 at 0.7572487585 (VLSE).
const forrester = (x: number): number => (6 * x - 2) ** 2 * Math.sin(12 * x - 4);

let dir = "";
const p = (name: string): string => join(dir, name);
const readCsv = (file: string): { header: string[]; rows: number[][] } => {
  const lines = readFileSync(file, "utf8").trim().split("\n");
  return { header: lines[0]!.split(","), rows: lines.slice(1).map((l) => l.split(",").map(Number)) };
};

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-fit-"));
  const train = ["x,noise,y,z"];
  for (let i = 0; i < 12; i++) {
    const x = (i + 0.5) / 12;
    train.push(`${x},${(i * 7) % 5},${forrester(x)},${x * x}`);
  }
  writeFileSync(p("train.csv"), `${train.join("\n")}\n`);
  // Query rows deliberately out of order, including the published minimiser.
  writeFileSync(p("query.csv"), "x\n0.9\n0.7572487585\n0.1\n0.5\n");
  writeFileSync(p("bad.csv"), "x,y\n0.1,1\n0.2,oops\n");
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("floorcast fit / predict", () => {
  it("fits a GP, predicts in the rows' order with <target>_mean and <target>_sd, identical to the library", () => {
    const fit = run(["fit", "--data", p("train.csv"), "--inputs", "x", "--target", "y,z", "--model", "gp", "--kernel", "matern52", "--seed", "4", "--out", p("m.json")]);
    expect(fit.status).toBe(0);
    expect(fit.stdout).toMatch(/not a zoning determination/);
    const pred = run(["predict", "--model", p("m.json"), "--data", p("query.csv"), "--out", p("pred.csv")]);
    expect(pred.status).toBe(0);
    const out = readCsv(p("pred.csv"));
    expect(out.header).toEqual(["y_mean", "y_sd", "z_mean", "z_sd", "in_domain", "error"]);
    const model = loadSurrogate(readFileSync(p("m.json"), "utf8"));
    const q = [[0.9], [0.7572487585], [0.1], [0.5]];
    const lib = model.predict(q);
    q.forEach((_, i) => {
      // CSV numbers are written as shortest round-trip text, so they read back bit for bit (sampler's CSV contract).
      expect(out.rows[i]![0]).toBe(lib.mean[i]![0]);
      expect(out.rows[i]![1]).toBe(lib.sd![i]![0]);
      expect(out.rows[i]![2]).toBe(lib.mean[i]![1]);
    });
    // 12 evenly spaced points: the GP's mean at the published minimiser lies within 3 of its own sd of −6.0207401.
    expect(Math.abs(out.rows[1]![0]! - -6.0207400558)).toBeLessThan(3 * out.rows[1]![1]!);
  });

  it("--kernel se / --shared-lengthscale / --noise reach the model file", () => {
    const r = run(["fit", "--data", p("train.csv"), "--inputs", "x,noise", "--target", "y", "--kernel", "se", "--shared-lengthscale", "--noise", "0.001", "--out", p("se.json")]);
    expect(r.status).toBe(0);
    const file = JSON.parse(readFileSync(p("se.json"), "utf8"));
    expect(file.payload.kernel).toBe("se");
    expect(file.payload.ard).toBe(false);
    expect(file.payload.components[0].noiseVariance).toBe(0.001);
    const ls = file.payload.components[0].lengthscales;
    expect(ls[0]).toBe(ls[1]);
  });

  it("user mistakes exit 2 with one line on stderr and no stack trace", async () => {
    const cases = [
      ["fit", "--data", p("train.csv"), "--inputs", "x,missing", "--target", "y", "--out", p("m2.json")],
      ["fit", "--data", p("train.csv"), "--inputs", "x", "--target", "y", "--kernel", "cubic", "--out", p("m2.json")],
      ["fit", "--data", p("train.csv"), "--inputs", "x", "--target", "y", "--model", "forest", "--out", p("m2.json")],
      ["fit", "--data", p("bad.csv"), "--inputs", "x", "--target", "y", "--out", p("m2.json")],
      ["fit", "--data", p("train.csv"), "--inputs", "x", "--target", "x", "--out", p("m2.json")],
      ["fit", "--data", p("nope.csv"), "--inputs", "x", "--target", "y", "--out", p("m2.json")],
      ["predict", "--model", p("nope.json"), "--data", p("query.csv"), "--out", p("o.csv")],
      ["predict", "--model", p("train.csv"), "--data", p("query.csv"), "--out", p("o.csv")],
      ["predict", "--model", p("se.json"), "--data", p("query.csv"), "--out", p("o.csv")],
    ];
    for (const args of cases) {
      const r = await runHere(args);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.stderr.trim().split("\n").filter((l) => l.startsWith("floorcast:"))).toHaveLength(1);
      expect(r.stderr).not.toMatch(/\n\s+at /);
    }
    expect((await runHere(cases[3]!)).stderr).toMatch(/row 2|oops/);
  });
});
