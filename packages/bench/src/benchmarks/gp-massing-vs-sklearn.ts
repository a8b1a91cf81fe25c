/**
 * Benchmark: `floorcast fit` (GP with the CLI's defaults: Matérn 5/2 ARD, 3 starts, hyperparameters on a maximin
 * subset of ≤ 600 rows polished on all rows, restarts on worker threads) against scikit-learn's
 * GaussianProcessRegressor (Debian python3-sklearn 1.2.1 through tests/reference/gp_sklearn.py: Matérn 5/2 ARD +
 * white noise, 3 starts, the same bounds and first start) on 8-input massing data of the invented Quillmere
 * "Midblock" zone (frontage, depth, rear ratio, skew, front, side and rear yards, FAR cap; target gfa), side by side
 * in one run at 500 and 2,000 training rows. Everything goes through the user's path: `floorcast sample` writes
 * the training and test CSVs (1,000 i.i.d. uniform test rows), `floorcast fit` writes the model file (timed as a
 * whole process, start-up included, once with `--threads 1` and once with the default), and the model file is
 * loaded to predict the test rows. scikit-learn's time is its `fit` call alone.
 * Run: `npm run build && npm run bench:gp-massing -- [n ...]` (default 500 2000).
 * Estimates for early feasibility studies only: not a zoning determination.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { cpus, tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { readTable } from "@floorcast/sampler";
import { loadSurrogate } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const cli = `${root}packages/bench/bin/floorcast.js`;
const script = `${root}tests/reference/gp_sklearn.py`;
const sizes = process.argv.slice(2).map(Number).filter((n) => Number.isInteger(n) && n > 0);
const ns = sizes.length ? sizes : [500, 2000];
const INPUTS = ["frontage", "depth", "rearRatio", "skew", "setbackFront", "setbackSide", "setbackRear", "maxFar"];

/** An invented Quillmere zone with the eight inputs varied. */
const SCENARIO = {
  kind: "floorcast.scenario",
  formatVersion: 1,
  name: "quillmere-midblock-8",
  title: "Quillmere Midblock (benchmark)",
  description: "Mid-rise blocks of the invented district of Quillmere: irregular lots, three yards and a FAR cap varied.",
  parameters: [
    { kind: "continuous", name: "frontage", min: 12, max: 40, unit: "m", description: "Width of the front lot line." },
    { kind: "continuous", name: "depth", min: 20, max: 50, unit: "m", description: "Lot depth." },
    { kind: "continuous", name: "rearRatio", min: 0.7, max: 1.3, unit: "1", description: "Rear lot line over frontage." },
    { kind: "continuous", name: "skew", min: -8, max: 8, unit: "°", description: "Skew of the side lot lines." },
    { kind: "continuous", name: "setbackFront", min: 0, max: 6, unit: "m", description: "Front yard depth." },
    { kind: "continuous", name: "setbackSide", min: 0, max: 4, unit: "m", description: "Side yard depth, each side." },
    { kind: "continuous", name: "setbackRear", min: 2, max: 9, unit: "m", description: "Rear yard depth." },
    { kind: "continuous", name: "maxFar", min: 1, max: 5, unit: "1", description: "Floor area ratio cap." },
  ],
  fixed: { maxHeight: 24, floorHeight: 3.3, maxCoverage: 0.7, minPlateWidth: 5, minPlateArea: 60 },
};

function floorcast(args: string[]): { seconds: number; stderr: string } {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, [cli, ...args], { encoding: "utf8" });
  const seconds = (performance.now() - t0) / 1000;
  if (r.status !== 0) throw new Error(`floorcast ${args[0]} failed (${r.status}): ${r.stderr}`);
  return { seconds, stderr: r.stderr };
}

const rmse = (pred: readonly number[], y: readonly number[]): number => Math.sqrt(pred.reduce((s, p, i) => s + (p - y[i]!) ** 2, 0) / pred.length);

async function run(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), "floorcast-gp-massing-"));
  try {
    const scenario = join(dir, "midblock.json");
    writeFileSync(scenario, `${JSON.stringify(SCENARIO, null, 2)}\n`);
    const test = join(dir, "test.csv");
    floorcast(["sample", "--scenario", scenario, "--n", "1000", "--seed", "999", "--design", "random", "--out", test]);
    const testTable = await readTable(test, { inputs: INPUTS, targets: ["gfa"] });
    const testY = testTable.y.map((r) => r[0]!);
    console.log(`GP fit on 8-input Quillmere massing data (${INPUTS.join(", ")}; target gfa), ${cpus().length} cores, machine shared with other jobs.`);
    console.log("floorcast: `floorcast fit` defaults, timed as a whole process; scikit-learn: GaussianProcessRegressor.fit alone. Test RMSE on 1,000 i.i.d. rows (m²).");
    console.log("n      floorcast 1 thread s   floorcast s   sklearn s   time ratio (ours/sk)   1-thread ratio   RMSE ours   RMSE sk   RMSE ratio");
    for (const n of ns) {
      const train = join(dir, `train-${n}.csv`);
      floorcast(["sample", "--scenario", scenario, "--n", String(n), "--seed", String(100 + n), "--out", train]);
      const fitArgs = ["fit", "--data", train, "--inputs", INPUTS.join(","), "--target", "gfa", "--seed", "1"];
      const serial = floorcast([...fitArgs, "--threads", "1", "--out", join(dir, `serial-${n}.json`)]);
      const threaded = floorcast([...fitArgs, "--out", join(dir, `model-${n}.json`)]);
      const model = loadSurrogate(readFileSync(join(dir, `model-${n}.json`), "utf8"));
      const serialModel = readFileSync(join(dir, `serial-${n}.json`), "utf8");
      const same = JSON.stringify(JSON.parse(serialModel).payload) === JSON.stringify(JSON.parse(readFileSync(join(dir, `model-${n}.json`), "utf8")).payload);
      const oursRmse = rmse(model.predict(testTable.x).mean.map((r) => r[0]!), testY);
      const table = await readTable(train, { inputs: INPUTS, targets: ["gfa"] });
      const lo = INPUTS.map((_, k) => Math.min(...table.x.map((r) => r[k]!)));
      const hi = INPUTS.map((_, k) => Math.max(...table.x.map((r) => r[k]!)));
      const unit = (rows: readonly (readonly number[])[]): number[][] => rows.map((r) => r.map((v, k) => (v - lo[k]!) / (hi[k]! - lo[k]!)));
      const r = spawnSync("/usr/bin/python3", [script], {
        input: JSON.stringify({
          mode: "fit",
          kernel: "matern52",
          x: unit(table.x),
          y: table.y.map((v) => v[0]),
          xTest: unit(testTable.x),
          start: { lengthscale: Math.sqrt(0.15), signalVariance: 1, noiseVariance: 1e-4 },
          bounds: { lengthscale: [1e-2, 1e3], signalVariance: [1e-3, 1e6], noiseVariance: [1e-6, 1] },
          restarts: 3,
          seed: 1,
        }),
        encoding: "utf8",
        maxBuffer: 256 * 1024 * 1024,
      });
      if (r.status !== 0) {
        console.log(`${n}: scikit-learn failed or is missing (${r.stderr.trim().split("\n").pop()}); floorcast ${threaded.seconds.toFixed(1)} s, RMSE ${oursRmse.toFixed(1)}`);
        continue;
      }
      const sk = JSON.parse(r.stdout) as { mean: number[]; fitSeconds: number };
      const skRmse = rmse(sk.mean, testY);
      console.log(
        `${String(n).padEnd(6)} ${serial.seconds.toFixed(1).padStart(20)}   ${threaded.seconds.toFixed(1).padStart(11)}   ${sk.fitSeconds.toFixed(1).padStart(9)}   ` +
          `${(threaded.seconds / sk.fitSeconds).toFixed(3).padStart(20)}   ${(serial.seconds / sk.fitSeconds).toFixed(3).padStart(14)}   ` +
          `${oursRmse.toFixed(1).padStart(9)}   ${skRmse.toFixed(1).padStart(7)}   ${(oursRmse / skRmse).toFixed(3).padStart(10)}` +
          (same ? "" : "   (threaded and 1-thread model files DIFFER)"),
      );
    }
    console.log("Aims: time ratio ≤ 0.5 at RMSE ratio ≤ 1.02.");
    console.log(`\n${FLOORCAST_CAUTION}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await run();
