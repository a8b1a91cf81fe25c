// Child process of dataset-memory.test.ts: writes a 200,000-row dataset and reads it back, both streamed,
// measuring the live heap (after a forced GC) every 20,000 rows. Run with --expose-gc.
// Usage: node --expose-gc stream-200k.mjs OUT.csv N
import { statSync } from "node:fs";
import { openTableStream, parseScenario, writeDataset } from "@floorcast/sampler";

const [out, nText] = process.argv.slice(2);
const n = Number(nText);
const scenario = parseScenario(
  {
    kind: "floorcast.scenario",
    formatVersion: 1,
    name: "memory-check",
    title: "Memory check",
    description: "Two parameters, four outputs.",
    parameters: [
      { kind: "continuous", name: "frontage", min: 5, max: 50, unit: "m", description: "f" },
      { kind: "continuous", name: "depth", min: 5, max: 50, unit: "m", description: "d" },
    ],
    fixed: { setbackFront: 0, setbackSide: 0, setbackRear: 0, floorHeight: 3, maxHeight: 30 },
  },
  "memory-check.json",
);
const live = () => {
  globalThis.gc();
  return process.memoryUsage().heapUsed;
};
let baseline = 0;
let peak = 0;
const t0 = performance.now();
const manifest = await writeDataset(scenario, {
  out,
  n,
  design: "random",
  seed: 9,
  evaluator: (x) => {
    const a = x.frontage * x.depth;
    return { a, b: Math.sqrt(a), c: x.frontage / x.depth, d: x.depth - x.frontage };
  },
  onProgress: (done) => {
    if (done === 1) baseline = live(); // the whole design is in memory by now (it is global)
    else if (done % 20000 === 0) peak = Math.max(peak, live());
  },
});
const t1 = performance.now();
let rows = 0;
let inOrder = true;
const s = await openTableStream(out);
for await (const r of s) {
  if (r.values[0] !== rows) inOrder = false;
  rows++;
  if (rows % 20000 === 0) peak = Math.max(peak, live());
}
process.stdout.write(
  JSON.stringify({ rows, inOrder, manifestRows: manifest.rows, bytes: statSync(out).size, baseline, peak, writeMs: t1 - t0, readMs: performance.now() - t1 }),
);
