// Child process of dataset-memory.test.ts: writes a 200,000-row dataset and reads it back, both streamed,
// measuring the live heap (after a forced GC) every 20,000 rows. Run with --expose-gc.
// Each phase's baseline is taken at its first checkpoint (row 20,000), once its buffers, parser and compiled code are
// in place (a baseline at row 1 missed those and, while the design was held whole, hid them behind the design's
// release); what a phase holding its rows would add from there on is 90% of the file, which the test bounds at 10%.
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
const write = { baseline: 0, peak: 0 };
const read = { baseline: 0, peak: 0 };
const check = (phase, done) => {
  if (done === 20000) phase.baseline = live();
  else if (done % 20000 === 0) phase.peak = Math.max(phase.peak, live());
};
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
  onProgress: (done) => check(write, done),
});
const t1 = performance.now();
let rows = 0;
let inOrder = true;
const s = await openTableStream(out);
for await (const r of s) {
  if (r.values[0] !== rows) inOrder = false;
  rows++;
  check(read, rows);
}
process.stdout.write(
  JSON.stringify({ rows, inOrder, manifestRows: manifest.rows, bytes: statSync(out).size, write, read, writeMs: t1 - t0, readMs: performance.now() - t1 }),
);
