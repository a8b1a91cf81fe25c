/**
 * Throughput of dataset generation on the three Quillmere demo scenarios (n = 20,000, random design), side by
 * side in one run: the exact massing rule alone, generateDataset (rule + design + row building), writeDataset
 * (plus streamed CSV, SHA-256 and manifest) and openTableStream (reading the CSV back). Rows per CPU-second of
 * this process and the ratio to the rule alone. Then an external JSON Lines program (a tiny node script) with
 * 1 and 2 processes, wall-clock rows per second. A script, not a test: `npm run bench:datasets` after a build.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import {
  commandEvaluator,
  createDesign,
  evaluateMassing,
  generateDataset,
  loadScenario,
  mapUnitToSpace,
  openTableStream,
  scenarioToMassingInput,
  writeDataset,
} from "@floorcast/sampler";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const N = Number(process.env.FLOORCAST_BENCH_ROWS ?? "20000");
const scenariosDir = fileURLToPath(new URL("../../../../datasets/scenarios/", import.meta.url));
const dir = mkdtempSync(join(tmpdir(), "floorcast-bench-ds-"));

async function cpu(work: () => Promise<void> | void): Promise<number> {
  const start = process.cpuUsage();
  await work();
  const used = process.cpuUsage(start);
  return (used.user + used.system) / 1e6;
}

const rate = (seconds: number): string => `${Math.round(N / seconds).toLocaleString("en")}/s`;
try {
  console.log(`Dataset throughput, n = ${N} rows per scenario (rows per CPU-second; ratio to the rule alone)\n`);
  console.log(["scenario", "rule alone", "generateDataset", "writeDataset (CSV)", "read back"].join(" | "));
  for (const name of ["larkspur-terraces", "ferrow-corner", "quillmere-core"]) {
    const s = await loadScenario(join(scenariosDir, `${name}.json`));
    const records = mapUnitToSpace({ parameters: s.parameters }, createDesign({ n: N, dims: s.parameters.length, design: "random", seed: 1 }));
    const rule = await cpu(() => {
      for (const r of records) evaluateMassing(scenarioToMassingInput(s, r));
    });
    const gen = await cpu(async () => {
      for await (const row of generateDataset(s, { n: N, design: "random", seed: 1 })) void row;
    });
    const out = join(dir, `${name}.csv`);
    const write = await cpu(async () => {
      await writeDataset(s, { out, n: N, design: "random", seed: 1, force: true });
    });
    const read = await cpu(async () => {
      for await (const row of await openTableStream(out, { categorical: ["limitedBy"] })) void row;
    });
    const cell = (t: number): string => `${rate(t)} (${(rule / t).toFixed(2)}×)`;
    console.log([name, rate(rule), cell(gen), cell(write), cell(read)].join(" | "));
  }
  const program = join(dir, "area.mjs");
  writeFileSync(
    program,
    `import { createInterface } from "node:readline";
for await (const line of createInterface({ input: process.stdin })) {
  const x = JSON.parse(line); let s = 0; for (let i = 0; i < 2000; i++) s += Math.sqrt(i + x.frontage);
  process.stdout.write(JSON.stringify({ sample: x.sample, area: x.frontage * x.depth, s }) + "\\n");
}`,
  );
  const s = await loadScenario(join(scenariosDir, "larkspur-terraces.json"));
  const walls: number[] = [];
  for (const processes of [1, 2]) {
    const e = commandEvaluator(`${JSON.stringify(process.execPath)} ${JSON.stringify(program)}`, { processes });
    const t0 = performance.now();
    for await (const row of generateDataset(s, { n: N, design: "random", seed: 1, evaluator: e })) void row;
    walls.push((performance.now() - t0) / 1000);
    await e.close();
  }
  console.log(
    `\nExternal JSON Lines program (wall clock): 1 process ${rate(walls[0]!)}, 2 processes ${rate(walls[1]!)} ` +
      `(${(walls[0]! / walls[1]!).toFixed(2)}× faster)`,
  );
} finally {
  rmSync(dir, { recursive: true, force: true });
}
console.log(`\n${FLOORCAST_CAUTION}`);
