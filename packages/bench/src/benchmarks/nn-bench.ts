/**
 * Benchmark: floorcast's MLP (tfjs, WebAssembly and plain-CPU backends) against scikit-learn's MLPRegressor
 * (Debian python3-sklearn 1.2.1, tests/reference/mlp_sklearn.py) on the Quillmere Core demo scenario
 * (10 parameters, exact massing by @floorcast/sampler's generateDataset; targets gfa, far, floors), same
 * 64-64 ReLU network, Adam, batch 64, early stopping; training time and test RMSE on 2,000 independent
 * Latin-hypercube rows, side by side in one run. Then the throughput of the dependency-free predictor
 * (@floorcast/surrogate/predict) for the 64-64 network in batches, against tfjs predict and the exact evaluator.
 * Run: `npm run bench:nn -- [n ...]` (default 500 2000 10000).
 * Estimates for early feasibility studies only: not a zoning determination.
 */
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { evaluateMassing, generateDataset, loadScenario, scenarioToMassingInput } from "@floorcast/sampler";
import type { Scenario } from "@floorcast/sampler";
import { fitMlp, useNnBackend, type MlpSurrogate } from "@floorcast/surrogate/nn";
import { createMlpPredictor } from "@floorcast/surrogate/predict";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const script = `${root}tests/reference/mlp_sklearn.py`;
const sizes = process.argv.slice(2).map(Number).filter((n) => Number.isInteger(n) && n > 0);
const ns = sizes.length ? sizes : [500, 2000, 10000];
const TEST_N = 2000;
const TARGETS = ["gfa", "far", "floors"] as const;
const SETTINGS = { layers: [64, 64], batchSize: 64, epochs: 200, patience: 20, learningRate: 0.003, l2: 1e-4 };

interface Sample {
  readonly x: number[][];
  readonly y: number[][];
  readonly records: Record<string, number | string>[];
}

async function sample(sc: Scenario, n: number, seed: number, names: string[]): Promise<Sample> {
  const x: number[][] = [];
  const y: number[][] = [];
  const records: Record<string, number | string>[] = [];
  for await (const row of generateDataset(sc, { n, design: "lhs", seed })) {
    const r = row as Record<string, number | string>;
    x.push(names.map((k) => Number(r[k])));
    y.push(TARGETS.map((t) => Number(r[t])));
    records.push(Object.fromEntries(names.map((k) => [k, r[k]!])));
  }
  return { x, y, records };
}

const rmse = (p: number[][], y: number[][]): number[] =>
  TARGETS.map((_, j) => Math.sqrt(p.reduce((s, r, i) => s + (r[j]! - y[i]![j]!) ** 2, 0) / p.length));
const fmt = (v: number[]): string => v.map((e) => e.toPrecision(4).padStart(9)).join(" ");

/** CPU seconds (user + system) this process spent in `f`: a per-core measure that a busy machine distorts less than wall time. */
function cpuSeconds(f: () => void): number {
  const c0 = process.cpuUsage();
  f();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1e6;
}

/** Best rate (items per CPU second) of `reps` runs of `f` over `items` items, after one warm-up run. */
function rate(items: number, reps: number, f: () => void): number {
  f();
  let best = Infinity;
  for (let r = 0; r < reps; r++) best = Math.min(best, cpuSeconds(f));
  return items / best;
}

async function train(names: string[], s: Sample, backend: "wasm" | "cpu"): Promise<{ m: MlpSurrogate; seconds: number; cpu: number }> {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const m = await fitMlp({ inputs: names, targets: [...TARGETS], x: s.x, y: s.y }, { ...SETTINGS, backend, seed: 1 });
  const c = process.cpuUsage(c0);
  return { m, seconds: (performance.now() - t0) / 1000, cpu: (c.user + c.system) / 1e6 };
}

async function run(): Promise<void> {
  const sc = await loadScenario(`${root}datasets/scenarios/quillmere-core.json`);
  const names = sc.parameters.map((p) => p.name);
  const test = await sample(sc, TEST_N, 999, names);
  console.log(`MLP benchmark: Quillmere Core (${names.length} parameters, exact massing via generateDataset), targets ${TARGETS.join(", ")}; 64-64 ReLU, Adam, batch 64, ≤ ${SETTINGS.epochs} epochs, early stopping; test RMSE on ${TEST_N} LHS rows.`);
  console.log(`${FLOORCAST_CAUTION}\n`);
  console.log(`n      model                wall s   CPU s   epochs   RMSE ${TARGETS.map((t) => t.padStart(9)).join(" ")}   RMSE ratio vs sklearn`);
  let last: MlpSurrogate | undefined;
  for (const n of ns) {
    const s = await sample(sc, n, 100 + n, names);
    const r = spawnSync("/usr/bin/python3", [script], {
      input: JSON.stringify({ xTrain: s.x, yTrain: s.y, xTest: test.x, yTest: test.y, hidden: SETTINGS.layers, activation: "relu", alpha: SETTINGS.l2, learningRate: SETTINGS.learningRate, batchSize: SETTINGS.batchSize, maxIter: SETTINGS.epochs, patience: SETTINGS.patience, validationFraction: 0.15, seed: 1 }),
      encoding: "utf8",
      maxBuffer: 256 * 1024 * 1024,
      // One BLAS thread, so both sides train on one core.
      env: { ...process.env, OPENBLAS_NUM_THREADS: "1", OMP_NUM_THREADS: "1", MKL_NUM_THREADS: "1" },
    });
    const sk = r.status === 0 ? (JSON.parse(r.stdout) as { rmse: number[]; fitSeconds: number; fitCpuSeconds: number; nIter: number; sklearn: string }) : null;
    const rows: [string, number, number, number, number[]][] = [];
    for (const backend of ["wasm", "cpu"] as const) {
      const { m, seconds, cpu } = await train(names, s, backend);
      const t = m.toJSON().training as { epochsRun: number };
      rows.push([`floorcast tfjs-${backend}`, seconds, cpu, t.epochsRun, rmse(m.predict(test.x).mean, test.y)]);
      last = m;
    }
    if (sk) rows.push([`sklearn ${sk.sklearn}`, sk.fitSeconds, sk.fitCpuSeconds, sk.nIter, sk.rmse]);
    else console.log(`(scikit-learn unavailable: ${r.stderr.trim().split("\n").pop()})`);
    for (const [name, sec, cpu, ep, e] of rows) {
      const ratio = sk ? e.map((v, j) => (v / sk.rmse[j]!).toFixed(2)).join(" / ") : "n/a";
      console.log(`${String(n).padEnd(6)} ${name.padEnd(20)} ${sec.toFixed(1).padStart(7)} ${cpu.toFixed(1).padStart(7)} ${String(ep).padStart(8)}   ${fmt(e)}   ${ratio}`);
    }
    if (sk) {
      const [w, c] = rows;
      console.log(`${"".padEnd(6)} CPU-time ratio: tfjs-wasm / sklearn ${(w![2] / sk.fitCpuSeconds).toFixed(2)}, tfjs-cpu / sklearn ${(c![2] / sk.fitCpuSeconds).toFixed(2)}, cpu / wasm ${(c![2] / w![2]).toFixed(2)}`);
    }
  }
  if (!last) return;

  // Prediction throughput of the 64-64 network (the last one fitted), batches of 10,000 rows.
  const N = 10_000;
  const qx = Array.from({ length: N }, (_, i) => test.x[i % TEST_N]!);
  const flat = Float64Array.from(qx.flat());
  const out = new Float64Array(N * TARGETS.length);
  const predictor = createMlpPredictor(last.toJSON());
  const plainInto = rate(N, 10, () => predictor.predictInto(flat, N, out));
  const plainRows = rate(N, 10, () => predictor.predict(qx));
  await useNnBackend("wasm");
  const tfWasm = rate(N, 5, () => last!.predict(qx));
  await useNnBackend("cpu");
  const tfCpu = rate(N, 3, () => last!.predict(qx));
  const inputs = test.records.map((rec) => scenarioToMassingInput(sc, rec));
  const exact = rate(TEST_N, 3, () => {
    for (const inp of inputs) evaluateMassing(inp);
  });
  console.log(`\nPrediction throughput, 64-64 network, ${names.length} inputs → ${TARGETS.length} targets, batches of ${N} rows, per CPU second on one core (best of several runs):`);
  const line = (name: string, v: number) => console.log(`  ${name.padEnd(44)} ${Math.round(v).toLocaleString("en").padStart(12)} predictions/CPU-s   predictInto is × ${(plainInto / v).toFixed(2)} this`);
  line("floorcast/predict predictInto (Float64Array)", plainInto);
  line("floorcast/predict predict (number[][])", plainRows);
  line("tfjs predict, wasm backend", tfWasm);
  line("tfjs predict, cpu backend", tfCpu);
  line("exact evaluateMassing (MassingInput prebuilt)", exact);
  // Small batches, as an optimizer asks for them: per-call overhead dominates.
  for (const b of [1, 16]) {
    const calls = b === 1 ? 2000 : 500;
    const few = qx.slice(0, b);
    const mine = rate(calls * b, 3, () => {
      for (let c = 0; c < calls; c++) predictor.predict(few);
    });
    await useNnBackend("wasm");
    const theirs = rate(calls * b, 3, () => {
      for (let c = 0; c < calls; c++) last!.predict(few);
    });
    console.log(`  batches of ${String(b).padEnd(2)} rows: floorcast/predict ${Math.round(mine).toLocaleString("en")} /CPU-s, tfjs-wasm ${Math.round(theirs).toLocaleString("en")} /CPU-s (predictor × ${(mine / theirs).toFixed(1)})`);
  }
  console.log(`  speed-up of the dependency-free predictor: × ${(plainInto / tfWasm).toFixed(1)} over tfjs-wasm, × ${(plainInto / tfCpu).toFixed(1)} over tfjs-cpu, × ${(plainInto / exact).toFixed(1)} over the exact evaluator`);
}

await run();
