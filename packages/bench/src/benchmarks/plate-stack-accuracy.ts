/**
 * Benchmark: the plate-stack surrogate against floorcast's GP and scikit-learn's GaussianProcessRegressor (Debian
 * python3-sklearn) on an 8-input dataset of Quillmere quad lots (Hollin Quads: frontage, depth, rear ratio, skew,
 * three yards and FAR; floor height 3.2 m, height cap 28 m, coverage 65%, least plate width 8 m), target gfa.
 * Everything floorcast does goes through the user's path — `floorcast sample --plate-profile` → CSV + manifest →
 * `floorcast fit` (gp; plate-stack, expected and plug-in point modes, with its default min-affine width trend and
 * with `--width-trend none`) → model file → `floorcast predict` — and the test RMSEs, median absolute errors, the
 * learned base-plate width's errors and plate-stack's 90% interval coverage are printed side by side in one run.
 * Run: `npm run bench:plate-stack -- [n]` (default n = 500 training rows; 1,000 random test rows).
 * Estimates for early feasibility studies only: not a zoning determination.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { readTable } from "@floorcast/sampler";
import { loadSurrogate, minAffineAt, type MinAffineTrend, type PlateStackSurrogate } from "@floorcast/surrogate";
import { main } from "../cli/main.js";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const scenario = `${root}datasets/scenarios/hollin-quads.json`;
const n = Number(process.argv[2] ?? 500);
const dir = mkdtempSync(join(tmpdir(), "floorcast-plate-bench-"));
const inputs = ["frontage", "depth", "rearRatio", "skew", "setbackFront", "setbackSide", "setbackRear", "maxFar"];
const p = (f: string): string => join(dir, f);

async function cli(args: string[]): Promise<void> {
  const code = await main(["node", "floorcast", ...args]);
  if (code !== 0) throw new Error(`floorcast ${args[0]} failed (${code})`);
}

const cpu = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};

async function predictions(model: string): Promise<{ mean: number[]; sd: number[] }> {
  await cli(["predict", "--model", p(model), "--data", p("test.csv"), "--out", p(`${model}.pred.csv`)]);
  const t = await readTable(p(`${model}.pred.csv`), { columns: ["gfa_mean"] });
  const lines = readFileSync(p(`${model}.pred.csv`), "utf8").trim().split("\n").slice(1);
  return { mean: t.rows.map((r) => r[0]!), sd: lines.map((l) => Number(l.split(",")[1] || NaN)) };
}

const rmse = (pred: readonly number[], y: readonly number[]): number => Math.sqrt(pred.reduce((s, v, i) => s + (v - y[i]!) ** 2, 0) / y.length);
const medianAbs = (pred: readonly number[], y: readonly number[]): number => {
  const a = pred.map((v, i) => Math.abs(v - y[i]!)).sort((x, z) => x - z);
  return a[Math.floor(a.length / 2)]!;
};

await cli(["sample", "--scenario", scenario, "--n", String(n), "--seed", "11", "--plate-profile", "--out", p("train.csv")]);
await cli(["sample", "--scenario", scenario, "--n", "1000", "--seed", "12", "--design", "random", "--plate-profile", "--out", p("test.csv")]);
const fits: [string, string[]][] = [
  ["gp.json", ["--model", "gp"]],
  ["plate-stack.json", ["--model", "plate-stack"]],
  ["plate-stack-plugin.json", ["--model", "plate-stack", "--point", "plugin"]],
  ["plate-stack-no-trend.json", ["--model", "plate-stack", "--width-trend", "none"]],
  ["plate-stack-no-trend-plugin.json", ["--model", "plate-stack", "--width-trend", "none", "--point", "plugin"]],
];
const seconds: Record<string, number> = {};
for (const [out, args] of fits) {
  const c0 = cpu();
  await cli(["fit", "--data", p("train.csv"), "--inputs", inputs.join(","), "--target", "gfa", ...args, "--seed", "1", "--out", p(out)]);
  seconds[out] = cpu() - c0;
}
const test = await readTable(p("test.csv"), { inputs, targets: ["gfa"] });
const y = test.y.map((r) => r[0]!);
const train = await readTable(p("train.csv"), { inputs, targets: ["gfa"] });
const lower = inputs.map((_, j) => Math.min(...train.x.map((r) => r[j]!)));
const upper = inputs.map((_, j) => Math.max(...train.x.map((r) => r[j]!)));
const unit = (rows: number[][]): number[][] => rows.map((r) => r.map((v, k) => (v - lower[k]!) / (upper[k]! - lower[k]!)));
const sk = spawnSync("/usr/bin/python3", [`${root}tests/reference/gp_sklearn.py`], {
  input: JSON.stringify({
    mode: "fit",
    kernel: "matern52",
    x: unit(train.x),
    y: train.y.map((v) => v[0]),
    xTest: unit(test.x),
    start: { lengthscale: Math.sqrt(0.15), signalVariance: 1, noiseVariance: 1e-4 },
    bounds: { lengthscale: [1e-2, 1e3], signalVariance: [1e-3, 1e6], noiseVariance: [1e-6, 1] },
    restarts: 3,
    seed: 1,
  }),
  encoding: "utf8",
  maxBuffer: 256 * 1024 * 1024,
});
const gp = await predictions("gp.json");
const ps = await predictions("plate-stack.json");
const plug = await predictions("plate-stack-plugin.json");
const noTrend = await predictions("plate-stack-no-trend.json");
const noTrendPlug = await predictions("plate-stack-no-trend-plugin.json");
const skMean = sk.status === 0 ? (JSON.parse(sk.stdout) as { mean: number[] }).mean : null;
const base = rmse(gp.mean, y);
console.log(`plate-stack vs GPs: Hollin Quads (8 inputs), n = ${n} training rows (lhs-maximin), 1,000 random test rows, target gfa (m²)`);
console.log("model                       test RMSE   ratio to floorcast GP   median |error|   fit CPU s");
const row = (name: string, pred: readonly number[], fit: number | undefined): void =>
  console.log(
    `${name.padEnd(27)} ${rmse(pred, y).toFixed(2).padStart(9)}   ${(rmse(pred, y) / base).toFixed(3).padStart(21)}   ${medianAbs(pred, y).toFixed(2).padStart(14)}   ${fit === undefined ? "-" : fit.toFixed(1)}`,
  );
row("floorcast gp", gp.mean, seconds["gp.json"]);
if (skMean) row("scikit-learn gp", skMean, undefined);
else console.log(`scikit-learn gp: not run (${sk.stderr.trim().split("\n").pop()})`);
row("plate-stack (expected)", ps.mean, seconds["plate-stack.json"]);
row("plate-stack (plugin)", plug.mean, seconds["plate-stack-plugin.json"]);
row("  no width trend (expected)", noTrend.mean, seconds["plate-stack-no-trend.json"]);
row("  no width trend (plugin)", noTrendPlug.mean, seconds["plate-stack-no-trend-plugin.json"]);
// the learned base-plate least width against the test rows' own (plateWidth_1), where the 8 m minimum decides
const widthTable = await readTable(p("test.csv"), { inputs, targets: ["plateWidth_1"] });
const width = widthTable.y.map((r) => r[0]!);
const near = width.flatMap((w, i) => (Math.abs(w - 8) < 1 ? [i] : []));
console.log("learned base-plate width on the test rows   RMSE (m)   RMSE where |w − 8 m| < 1 m   wrong side of 8 m (inner mean)");
for (const [label, model] of [["min-affine trend (default)", "plate-stack.json"], ["no trend", "plate-stack-no-trend.json"]] as const) {
  const ps = loadSurrogate(readFileSync(p(model), "utf8")) as PlateStackSurrogate;
  const file = ps.toJSON();
  const q = file.payload.quantities.baseWidth as { trend?: MinAffineTrend };
  const inner = ps.inner("baseWidth")!;
  const rows = widthTable.x.map((r) => inner.inputs.map((name) => r[inputs.indexOf(name)]!));
  const w = inner.predict(rows).mean.map((r, i) => r[0]! + (q.trend === undefined ? 0 : minAffineAt(q.trend, rows[i]!)));
  const wrong = w.filter((v, i) => v >= 8 !== width[i]! >= 8).length;
  console.log(
    `${label.padEnd(43)} ${rmse(w, width).toFixed(3).padStart(8)}   ${rmse(near.map((i) => w[i]!), near.map((i) => width[i]!)).toFixed(3).padStart(26)} (${near.length} rows)   ${wrong}`,
  );
}
const covered = ps.mean.filter((m, i) => Math.abs(y[i]! - m) <= 1.6448536269514722 * ps.sd[i]!).length / y.length;
console.log(`plate-stack 90% interval (mean ± 1.645 sd, Monte Carlo through the rule): covers ${(100 * covered).toFixed(1)}% of test rows`);
console.log(`\n${FLOORCAST_CAUTION}`);
