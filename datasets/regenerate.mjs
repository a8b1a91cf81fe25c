#!/usr/bin/env node
// Regenerates the committed demo datasets listed in demo-datasets.json (`npm run datasets`).
// Usage: node datasets/regenerate.mjs [--out-dir DIR]   (default: this directory; existing files are replaced)
import { mkdirSync, readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadScenario, writeDataset } from "@floorcast/sampler";

const here = dirname(fileURLToPath(import.meta.url));
const at = process.argv.indexOf("--out-dir");
const outDir = at > 0 ? process.argv[at + 1] : here;
const { datasets } = JSON.parse(readFileSync(join(here, "demo-datasets.json"), "utf8"));
for (const d of datasets) {
  const scenario = await loadScenario(join(here, d.scenario));
  const out = join(outDir, d.out);
  mkdirSync(dirname(out), { recursive: true });
  const m = await writeDataset(scenario, { out, n: d.n, design: d.design, seed: d.seed, force: true });
  process.stdout.write(`${d.out}: ${m.rows} rows, sha256 ${m.csv.sha256}\n`);
}
