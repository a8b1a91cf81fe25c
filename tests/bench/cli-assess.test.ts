import { beforeAll, describe, expect, it } from "vitest";
import { existsSync } from "node:fs";
import { mkdtemp, readFile, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import seedrandom from "seedrandom";
import { runCli } from "./run-cli.js";
import { fitGaussianProcess, loadSurrogate, regressionMetrics } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "@floorcast/bench";
import { expectOnlyCaution } from "./helpers/only-caution.js";

// A toy floor-area-like response with a regime switch (FAR binds above frontage 50): invented, derived.
const gfa = (a: number, b: number) => Math.min(2 * a * b, 2000 + 10 * b);
const regime = (a: number, b: number) => (2 * a * b <= 2000 + 10 * b ? "height" : "far");

let dir = "";
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "floorcast-assess-"));
  const rng = seedrandom("cli-assess");
  const rows = (n: number) => Array.from({ length: n }, () => [20 + rng() * 40, 10 + rng() * 20]);
  const csv = (xs: number[][]) => "frontage,depth,gfa,limitedBy\n" + xs.map(([a, b]) => `${a},${b},${gfa(a!, b!)},${regime(a!, b!)}`).join("\n") + "\n";
  const train = rows(60);
  const test = rows(40);
  await writeFile(join(dir, "train.csv"), csv(train));
  await writeFile(join(dir, "test.csv"), csv(test));
  await writeFile(join(dir, "outside.csv"), csv([...test.slice(0, 5), [150, 20]]));
  await writeFile(join(dir, "no-depth.csv"), "frontage,gfa\n1,2\n");
  const gp = fitGaussianProcess({ inputs: ["frontage", "depth"], targets: ["gfa"], x: train, y: train.map(([a, b]) => [gfa(a!, b!)]) }, { seed: 3 });
  await writeFile(join(dir, "model.json"), JSON.stringify(gp.toJSON()));
});

describe("floorcast assess", () => {
  it("writes report.json/md/html with metrics, regimes, k-fold CV and a learning curve", async () => {
    const out = join(dir, "full");
    const r = await runCli(["assess", "--model", join(dir, "model.json"), "--data", join(dir, "test.csv"), "--target", "gfa", "--by", "limitedBy", "--train", join(dir, "train.csv"), "--folds", "3", "--learning-curve", "--sizes", "20,40", "--out", out]);
    expect(r.err).toBe("");
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/assessed gfa on 40 test rows: RMSE/);
    expect(r.out.trimEnd().split("\n").at(-1)).toBe(FLOORCAST_CAUTION); // the CLI's one caution constant
    const report = JSON.parse(await readFile(join(out, "report.json"), "utf8"));
    expect(report.kind).toBe("floorcast.trust-report");
    expect(report.formatVersion).toBe(1);
    // The metrics are those of the loaded model's predictions on the test CSV (recomputed here).
    const model = loadSurrogate(JSON.parse(await readFile(join(dir, "model.json"), "utf8")));
    const testCsv = (await readFile(join(dir, "test.csv"), "utf8")).trim().split("\n").slice(1).map((l) => l.split(","));
    const pred = model.predict(testCsv.map((c) => [Number(c[0]), Number(c[1])])).mean.map((m) => m[0]!);
    const expected = regressionMetrics(testCsv.map((c) => Number(c[2])), pred);
    expect(report.metrics.rmse).toBeCloseTo(expected.rmse, 9);
    expect(report.metrics.maxAbsError).toBeCloseTo(expected.maxAbsError, 9);
    expect(Object.keys(report.byRegime).sort()).toEqual(["far", "height"]);
    expect(report.crossValidation.method).toBe("k-fold");
    expect(report.crossValidation.folds).toBe(3);
    expect(report.learningCurve.points.map((p: { size: number }) => p.size)).toEqual([20, 40, 60]);
    expect(report.calibration.coverage).toHaveLength(3);
    expect(report.domain.nOutside).toBeGreaterThanOrEqual(0);
    expect(report.diagnostics.design.minDistance).toBeGreaterThan(0);
    expect(report.diagnostics.conditionNumber.length).toBe(1);
    const html = await readFile(join(out, "report.html"), "utf8");
    expect(html.match(/<figure>/g)).toHaveLength(6);
    const md = await readFile(join(out, "report.md"), "utf8");
    // every kind of the report carries the one caution word for word, and no other caution wording
    expect(report.caution).toBe(FLOORCAST_CAUTION);
    for (const [kind, text] of [["report.json", await readFile(join(out, "report.json"), "utf8")], ["report.md", md], ["report.html", html]]) expectOnlyCaution(text!, kind!);
  });

  it("uses the GP's closed-form leave-one-out when --train is its training data, and its stored inputs for the domain", async () => {
    const out = join(dir, "loo");
    const r = await runCli(["assess", "--model", join(dir, "model.json"), "--data", join(dir, "outside.csv"), "--target", "gfa", "--train", join(dir, "train.csv"), "--out", out]);
    expect(r.code).toBe(0);
    const report = JSON.parse(await readFile(join(out, "report.json"), "utf8"));
    expect(report.crossValidation.method).toBe("leave-one-out");
    expect(report.crossValidation.folds).toBe(60);
    expect(report.crossValidation.metrics.q2).toBeLessThanOrEqual(1);
    expect(report.domain.outsideRows).toContain(5); // frontage 150 is far outside the training range 20–60
    const noTrain = join(dir, "no-train");
    expect((await runCli(["assess", "--model", join(dir, "model.json"), "--data", join(dir, "outside.csv"), "--target", "gfa", "--out", noTrain])).code).toBe(0);
    const r2 = JSON.parse(await readFile(join(noTrain, "report.json"), "utf8"));
    expect(r2.domain.outsideRows).toContain(5);
    expect(r2.crossValidation).toBeNull();
    expect(r2.notes.join(" ")).toMatch(/Cross-validation not run/);
    // A --train file that is not the GP's own training data: LOO is skipped with a note.
    const other = join(dir, "other-train");
    expect((await runCli(["assess", "--model", join(dir, "model.json"), "--data", join(dir, "outside.csv"), "--target", "gfa", "--train", join(dir, "test.csv"), "--out", other])).code).toBe(0);
    const r3 = JSON.parse(await readFile(join(other, "report.json"), "utf8"));
    expect(r3.crossValidation).toBeNull();
    expect(r3.notes.join(" ")).toMatch(/Leave-one-out skipped: test\.csv is not the model's own training data/);
  });

  it("--strict refuses test rows outside the domain, naming them (exit 2, one line, no stack trace)", async () => {
    const out = join(dir, "strict");
    const r = await runCli(["assess", "--model", join(dir, "model.json"), "--data", join(dir, "outside.csv"), "--target", "gfa", "--strict", "--out", out]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^floorcast: assess: --strict: data rows 6 of outside\.csv \(1 in all\) are outside the model's domain of validity\n$/);
    expect(existsSync(join(out, "report.json"))).toBe(false);
    // The training rows themselves are inside by construction (NN distance 0, within the bounds).
    expect((await runCli(["assess", "--model", join(dir, "model.json"), "--data", join(dir, "train.csv"), "--target", "gfa", "--strict", "--out", out])).code).toBe(0);
  });

  it("user mistakes exit 2 with one line on stderr", async () => {
    const base = ["assess", "--model", join(dir, "model.json"), "--data", join(dir, "test.csv"), "--out", join(dir, "err")];
    const cases: [string[], RegExp][] = [
      [[...base, "--target", "floors"], /--target floors is not a target of the model \(gfa\)/],
      [[...base, "--target", "gfa", "--folds", "3"], /--folds and --learning-curve need the training data/],
      [[...base, "--target", "gfa", "--folds", "1", "--train", join(dir, "train.csv")], /--folds must be a whole number ≥ 2, got "1"/],
      [["assess", "--model", join(dir, "missing.json"), "--data", join(dir, "test.csv"), "--target", "gfa", "--out", dir], /cannot read model file/],
      [["assess", "--model", join(dir, "test.csv"), "--data", join(dir, "test.csv"), "--target", "gfa", "--out", dir], /test\.csv is not JSON/],
      [["assess", "--model", join(dir, "model.json"), "--data", join(dir, "no-depth.csv"), "--target", "gfa", "--out", dir], /depth/],
      [[...base, "--target", "gfa", "--by", "zone"], /zone/],
    ];
    for (const [args, re] of cases) {
      const r = await runCli(args);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.err).toMatch(re);
      expect(r.err.trim().split("\n")).toHaveLength(1);
      expect(r.err).not.toMatch(/\bat .*\.js:\d+/);
    }
    const missing = await runCli(["assess", "--data", join(dir, "test.csv")]);
    expect(missing.code).toBe(2);
  });
});

describe("floorcast assess refits ensembles and conformal wrappers", () => {
  it("k-fold cross-validation of a conformal GP file (fitted by floorcast fit) reports interval coverage", async () => {
    const model = join(dir, "conformal.json");
    const fit = await runCli(["fit", "--data", join(dir, "train.csv"), "--inputs", "frontage,depth", "--target", "gfa", "--conformal", "0.9", "--out", model]);
    expect(fit.code, fit.err).toBe(0);
    const out = join(dir, "conformal-report");
    const r = await runCli(["assess", "--model", model, "--data", join(dir, "test.csv"), "--target", "gfa", "--train", join(dir, "train.csv"), "--folds", "3", "--out", out]);
    expect(r.code, r.err).toBe(0);
    const report = JSON.parse(await readFile(join(out, "report.json"), "utf8"));
    expect(report.model.kind).toBe("conformal");
    expect(report.crossValidation.method).toBe("k-fold");
    expect(report.intervalCoverage.nominal).toBe(0.9);
    expect(report.intervalCoverage.n).toBe(40);
  });

  it("k-fold cross-validation of an MLP file (refitted per fold); the early-stopping epoch reaches the diagnostics", async () => {
    const model = join(dir, "mlp.json");
    const fit = await runCli(["fit", "--data", join(dir, "train.csv"), "--inputs", "frontage,depth", "--target", "gfa", "--model", "nn", "--epochs", "20", "--out", model]);
    expect(fit.code, fit.err).toBe(0);
    const out = join(dir, "mlp-report");
    const r = await runCli(["assess", "--model", model, "--data", join(dir, "test.csv"), "--target", "gfa", "--train", join(dir, "train.csv"), "--folds", "2", "--out", out]);
    expect(r.code, r.err).toBe(0);
    const report = JSON.parse(await readFile(join(out, "report.json"), "utf8"));
    expect(report.crossValidation.folds).toBe(2);
    expect(report.calibration).toBeNull(); // a single MLP gives no sd
    expect(report.diagnostics.earlyStoppingEpoch).toEqual([{ path: "training.bestEpoch", value: expect.any(Number) }]);
  });
});
