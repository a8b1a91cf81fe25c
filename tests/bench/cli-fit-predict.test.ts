import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { runCli } from "./run-cli.js";
import { loadSurrogate } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "@floorcast/bench";
import { expectOnlyCaution } from "./helpers/only-caution.js";

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
    // the model file carries the one caution constant, sealed under its checksum (loadSurrogate below verifies it)
    expect((JSON.parse(readFileSync(p("m.json"), "utf8")) as { caution?: string }).caution).toBe(FLOORCAST_CAUTION);
    expectOnlyCaution(readFileSync(p("m.json"), "utf8"), "model file");
    const pred = run(["predict", "--model", p("m.json"), "--data", p("query.csv"), "--out", p("pred.csv")]);
    expect(pred.status).toBe(0);
    const out = readCsv(p("pred.csv"));
    // the data's own columns first (here the input x), then the predictions
    expect(out.header).toEqual(["x", "y_mean", "y_sd", "z_mean", "z_sd", "in_domain", "error"]);
    const model = loadSurrogate(readFileSync(p("m.json"), "utf8"));
    const q = [[0.9], [0.7572487585], [0.1], [0.5]];
    const lib = model.predict(q);
    q.forEach((row, i) => {
      expect(out.rows[i]![0]).toBe(row[0]);
      // CSV numbers are written as shortest round-trip text, so they read back bit for bit (sampler's CSV contract).
      expect(out.rows[i]![1]).toBe(lib.mean[i]![0]);
      expect(out.rows[i]![2]).toBe(lib.sd![i]![0]);
      expect(out.rows[i]![3]).toBe(lib.mean[i]![1]);
    });
    // 12 evenly spaced points: the GP's mean at the published minimiser lies within 3 of its own sd of −6.0207401.
    expect(Math.abs(out.rows[1]![1]! - -6.0207400558)).toBeLessThan(3 * out.rows[1]![2]!);
  });

  it("predict keeps the data's columns verbatim (or the --keep list) and reads stdin / writes stdout with -", async () => {
    expect(run(["fit", "--data", p("train.csv"), "--inputs", "x", "--target", "y", "--seed", "4", "--out", p("k.json")]).status).toBe(0);
    const data = "id,x,label\nlot-7,0.90,\"corner, north\"\nlot-2,0.1,plain\n";
    writeFileSync(p("keyed.csv"), data);
    const lib = loadSurrogate(readFileSync(p("k.json"), "utf8")).predict([[0.9], [0.1]]);
    const byFile = await runHere(["predict", "--model", p("k.json"), "--data", p("keyed.csv"), "--out", p("keyed-pred.csv")]);
    expect(byFile.status, byFile.stderr).toBe(0);
    const lines = readFileSync(p("keyed-pred.csv"), "utf8").trim().split("\n");
    expect(lines[0]).toBe("id,x,label,y_mean,y_sd,in_domain,error");
    // text columns are copied as they were (quoted again where RFC 4180 needs it); the input as the number it is
    expect(lines[1]).toBe(`lot-7,0.9,"corner, north",${lib.mean[0]![0]},${lib.sd![0]![0]},1,`);
    expect(lines[2]).toBe(`lot-2,0.1,plain,${lib.mean[1]![0]},${lib.sd![1]![0]},1,`);
    // --keep chooses the copied columns, in its order; "" copies none
    const keep = await runHere(["predict", "--model", p("k.json"), "--data", p("keyed.csv"), "--keep", "label,id", "--out", p("keep.csv")]);
    expect(keep.status, keep.stderr).toBe(0);
    expect(readFileSync(p("keep.csv"), "utf8").split("\n")[0]).toBe("label,id,y_mean,y_sd,in_domain,error");
    expect((await runHere(["predict", "--model", p("k.json"), "--data", p("keyed.csv"), "--keep", "", "--out", p("none.csv")])).status).toBe(0);
    expect(readFileSync(p("none.csv"), "utf8").split("\n")[0]).toBe("y_mean,y_sd,in_domain,error");
    // - : the same bytes through stdin and stdout; the summary and the caution go to stderr
    const piped = await runCli(["predict", "--model", p("k.json"), "--data", "-", "--out", "-"], data);
    expect(piped.code, piped.err).toBe(0);
    expect(piped.out).toBe(readFileSync(p("keyed-pred.csv"), "utf8"));
    expect(piped.err).toMatch(/predict: 2 rows of stdin → stdout/);
    expect(piped.err).toMatch(/not a zoning determination/);
    // fit reads stdin too
    const fitPiped = await runCli(["fit", "--data", "-", "--inputs", "x", "--target", "y", "--seed", "4", "--out", p("k2.json")], readFileSync(p("train.csv"), "utf8"));
    expect(fitPiped.code, fitPiped.err).toBe(0);
    expect(JSON.parse(readFileSync(p("k2.json"), "utf8")).payload).toEqual(JSON.parse(readFileSync(p("k.json"), "utf8")).payload);
    // a kept column may not take a prediction column's name; stdin cannot be read twice
    writeFileSync(p("clash.csv"), "x,y_mean\n0.5,1\n");
    const clash = await runHere(["predict", "--model", p("k.json"), "--data", p("clash.csv"), "--out", p("clash-pred.csv")]);
    expect(clash.status).toBe(2);
    expect(clash.stderr).toMatch(/kept column y_mean has the name of a prediction column/);
    const twice = await runHere(["predict", "--model", p("k.json"), "--data", "-", "--train", "-", "--out", p("t.csv")]);
    expect(twice.status).toBe(2);
    expect(twice.stderr).toMatch(/only one of --data and --train can read stdin/);
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
