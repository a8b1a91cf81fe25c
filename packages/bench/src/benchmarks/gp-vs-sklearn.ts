/**
 * Benchmark: floorcast's GP against scikit-learn's GaussianProcessRegressor (Debian python3-sklearn 1.2.1) on
 * the same 12-parameter massing samples — Ferrow Corner (Quillmere) with its interior side yard and floor-to-floor
 * height also varied — target gfa; Matérn 5/2 ARD, 3 starts, same bounds and first start; fit time and test RMSE
 * on 1,000 independent Latin-hypercube rows, side by side in one run.
 * Run: `npm run bench:gp -- [n ...]` (default 300 1000; 2000 takes scikit-learn about 9 minutes here).
 * Estimates for early feasibility studies only: not a zoning determination.
 */
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { generateDataset, parseScenario } from "@floorcast/sampler";
import type { Scenario } from "@floorcast/sampler";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const script = `${root}tests/reference/gp_sklearn.py`;
const args = process.argv.slice(2);
const noSubset = args.includes("--no-subset");
const sizes = args.map(Number).filter((n) => Number.isInteger(n) && n > 0);
const ns = sizes.length ? sizes : [300, 1000];
const TEST_N = 1000;

function scenario(): Scenario {
  const raw = JSON.parse(readFileSync(`${root}datasets/scenarios/ferrow-corner.json`, "utf8"));
  const { setbackSide: _s, floorHeight: _f, ...fixed } = raw.fixed;
  raw.name = "ferrow-corner-12";
  raw.fixed = fixed;
  raw.parameters.push({ kind: "continuous", name: "setbackSide", min: 0, max: 3, unit: "m", description: "Interior side yard depth." });
  raw.parameters.push({ kind: "continuous", name: "floorHeight", min: 3, max: 4.2, unit: "m", description: "Floor-to-floor height." });
  return parseScenario(raw, "ferrow-corner-12 (benchmark)");
}

async function sample(sc: Scenario, n: number, seed: number, names: string[]): Promise<{ x: number[][]; y: number[][] }> {
  const x: number[][] = [];
  const y: number[][] = [];
  for await (const row of generateDataset(sc, { n, design: "lhs", seed })) {
    const r = row as Record<string, unknown>;
    x.push(names.map((k) => Number(r[k])));
    y.push([Number(r.gfa)]);
  }
  return { x, y };
}

const rmse = (pred: number[], y: number[][]): number => Math.sqrt(pred.reduce((s, p, i) => s + (p - y[i]![0]!) ** 2, 0) / pred.length);

async function run(): Promise<void> {
  const sc = scenario();
  const names = sc.parameters.map((p) => p.name);
  const lower = sc.parameters.map((p) => (p.kind === "continuous" ? p.min : 0));
  const upper = sc.parameters.map((p) => (p.kind === "continuous" ? p.max : 1));
  const unit = (rows: number[][]): number[][] => rows.map((r) => r.map((v, k) => (v - lower[k]!) / (upper[k]! - lower[k]!)));
  const test = await sample(sc, TEST_N, 999, names);
  console.log(`GP vs scikit-learn: ${names.length}-parameter Ferrow Corner massing sample, target gfa, Matérn 5/2 ARD, 3 starts; test RMSE on ${TEST_N} rows (m²).`);
  console.log(`floorcast hyperparameters: ${noSubset ? "fitted on all rows" : "fitted on a greedy maximin subset of ≤ 600 rows, polished by ≤ 10 iterations on all rows (n ≤ 2,000), then conditioned on all rows"}.`);
  console.log("n      floorcast s   sklearn s   time ratio (ours/sk)   RMSE ours   RMSE sk   RMSE ratio   LML ours (on fit rows)   LML sk");
  for (const n of ns) {
    const train = await sample(sc, n, 100 + n, names);
    const t0 = performance.now();
    const gp = fitGaussianProcess(
      { inputs: names, targets: ["gfa"], x: train.x, y: train.y },
      { restarts: 3, seed: 1, inputBounds: { lower, upper }, hyperparameterSubset: noSubset ? false : 600 },
    );
    const ours = (performance.now() - t0) / 1000;
    const oursRmse = rmse(gp.predict(test.x).mean.map((r) => r[0]!), test.y);
    const r = spawnSync("/usr/bin/python3", [script], {
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
    if (r.status !== 0) {
      console.log(`${n}: scikit-learn failed or is missing (${r.stderr.trim().split("\n").pop()}); floorcast ${ours.toFixed(1)} s, RMSE ${oursRmse.toFixed(2)}`);
      continue;
    }
    const sk = JSON.parse(r.stdout) as { lml: number; mean: number[]; fitSeconds: number };
    const skRmse = rmse(sk.mean, test.y);
    console.log(
      `${String(n).padEnd(6)} ${ours.toFixed(1).padStart(11)}   ${sk.fitSeconds.toFixed(1).padStart(9)}   ${(ours / sk.fitSeconds).toFixed(3).padStart(20)}   ` +
        `${oursRmse.toFixed(2).padStart(9)}   ${skRmse.toFixed(2).padStart(7)}   ${(oursRmse / skRmse).toFixed(3).padStart(10)}   ` +
        `${gp.logMarginalLikelihood()[0]!.toFixed(2).padStart(22)}   ${sk.lml.toFixed(2)}`,
    );
  }
  console.log("LML: ours is the log marginal likelihood of all n rows at the chosen hyperparameters; sklearn's of all n rows at its optimum.");
  console.log(`\n${FLOORCAST_CAUTION}`);
}

await run();
