/**
 * Long runs in bounded memory, measured side by side in one run (a script, not a test: `npm run bench:long` after
 * a build). Each phase runs in its own child process, so its peak resident memory (process.resourceUsage().maxRSS,
 * plus process.memoryUsage().rss sampled every 20 ms) is its own:
 * - write: writeDataset streams a Ferrow Corner dataset with the default design of its size (defaultDesign: Sobol'
 *   above 1,000 rows, generated row by row) to CSV, at 10^5, 10^6 and 10^7 rows: peak RSS against n;
 * - read: openTableStream reads the files up to 10^6 rows back one row at a time;
 * - gp: a GP fitted on 1,000 rows predicts the mean and sd of 10,000 new points.
 * Reported: rows per second, the RSS at the phase's start and its peak, and the growth beside the size of the data
 * (CSV bytes; for the GP, 10,000 × 1,000 doubles: the query × training cross-kernel if it were held whole).
 * `FLOORCAST_LONG_ROWS` overrides the row counts (comma-separated).
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { createDesign, defaultDesign, loadScenario, openTableStream, writeDataset } from "@floorcast/sampler";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const SIZES = (process.env.FLOORCAST_LONG_ROWS ?? "100000,1000000,10000000").split(",").map(Number);
/** Files up to this many rows are also read back. */
const READ_MAX = 1_000_000;
const scenarioPath = fileURLToPath(new URL("../../../../datasets/scenarios/ferrow-corner.json", import.meta.url));

interface PhaseResult {
  phase: string;
  items: number;
  seconds: number;
  peakRssMb: number;
  sampledPeakRssMb: number;
  startRssMb: number;
  dataMb: number;
}

const mb = (bytes: number) => bytes / 2 ** 20;

/** Runs one phase in this process, sampling RSS, and prints its result as JSON on stdout. */
async function runPhase(phase: string, csv: string, rows: number): Promise<void> {
  const startRss = process.memoryUsage().rss;
  let sampled = startRss;
  const timer = setInterval(() => (sampled = Math.max(sampled, process.memoryUsage().rss)), 20);
  const t0 = performance.now();
  let items = 0;
  let dataBytes = 0;
  if (phase === "write") {
    const scenario = await loadScenario(scenarioPath);
    const design = defaultDesign(rows, scenario.parameters.length);
    await writeDataset(scenario, { out: csv, n: rows, design, seed: 11, force: true });
    phase = `write (${design})`;
    items = rows;
    dataBytes = statSync(csv).size;
  } else if (phase === "read") {
    for await (const row of await openTableStream(csv, { categorical: ["limitedBy"] })) {
      void row;
      items++;
    }
    dataBytes = statSync(csv).size;
  } else {
    const d = 6;
    const f = (r: number[]) => r.reduce((s, v, k) => s + Math.sin(3 * v + k) * (k + 1), 0);
    const x = createDesign({ n: 1000, dims: d, design: "lhs", seed: 1 });
    const gp = fitGaussianProcess({ inputs: ["a", "b", "c", "d", "e", "f"], targets: ["y"], x, y: x.map((r) => [f(r)]) }, { seed: 1, restarts: 1 });
    const q = createDesign({ n: 10_000, dims: d, design: "random", seed: 2 });
    const t1 = performance.now();
    const p = gp.predict(q);
    items = p.mean.length;
    if (!p.sd || p.sd.some((r) => !Number.isFinite(r[0]))) throw new Error("gp: non-finite sd");
    dataBytes = 8 * 10_000 * 1000;
    clearInterval(timer);
    const rss = Math.max(sampled, process.memoryUsage().rss);
    console.log(JSON.stringify({ phase: "gp predict", items, seconds: (performance.now() - t1) / 1000, peakRssMb: process.resourceUsage().maxRSS / 1024, sampledPeakRssMb: mb(rss), startRssMb: mb(startRss), dataMb: mb(dataBytes) }));
    return;
  }
  clearInterval(timer);
  const rss = Math.max(sampled, process.memoryUsage().rss);
  const result: PhaseResult = {
    phase,
    items,
    seconds: (performance.now() - t0) / 1000,
    peakRssMb: process.resourceUsage().maxRSS / 1024,
    sampledPeakRssMb: mb(rss),
    startRssMb: mb(startRss),
    dataMb: mb(dataBytes),
  };
  console.log(JSON.stringify(result));
}

if (process.argv[2] === "--phase") {
  await runPhase(process.argv[3]!, process.argv[4]!, Number(process.argv[5]));
} else {
  const dir = mkdtempSync(join(tmpdir(), "floorcast-long-"));
  const self = fileURLToPath(import.meta.url);
  try {
    console.log(`Long runs (each phase in its own process; peak RSS = process.resourceUsage().maxRSS)\n`);
    console.log("phase | items | items/s | seconds | start RSS (MB) | peak RSS (MB) | sampled peak (MB) | growth (MB) | data (MB) | growth ÷ data");
    const phases: [string, number][] = [];
    for (const n of SIZES) {
      phases.push(["write", n]);
      if (n <= READ_MAX) phases.push(["read", n]);
    }
    phases.push(["gp", 0]);
    for (const [phase, n] of phases) {
      const csv = join(dir, `long-${n}.csv`);
      const out = execFileSync(process.execPath, [self, "--phase", phase, csv, String(n)], { encoding: "utf8", maxBuffer: 1 << 20 });
      const r = JSON.parse(out.trim().split("\n").at(-1)!) as PhaseResult;
      if (phase === "read") rmSync(csv, { force: true });
      if (phase === "write" && n > READ_MAX) rmSync(csv, { force: true });
      console.log(
        [
          r.phase,
          r.items.toLocaleString("en"),
          Math.round(r.items / r.seconds).toLocaleString("en"),
          r.seconds.toFixed(1),
          r.startRssMb.toFixed(0),
          r.peakRssMb.toFixed(0),
          r.sampledPeakRssMb.toFixed(0),
          (r.peakRssMb - r.startRssMb).toFixed(0),
          r.dataMb.toFixed(0),
          ((r.peakRssMb - r.startRssMb) / r.dataMb).toFixed(2),
        ].join(" | "),
      );
    }
    console.log(`\n${FLOORCAST_CAUTION}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
