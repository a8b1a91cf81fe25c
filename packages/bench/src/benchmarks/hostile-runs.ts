/**
 * A randomised hostile run (default 200 cases from a fixed seed; FLOORCAST_HOSTILE_CASES, FLOORCAST_HOSTILE_SEED
 * to change): hostile external evaluators of every kind, concurrent writers, kills at random moments with
 * resumes, and predictions far outside a model's domain, each through the real `floorcast` command line.
 * Reports, per kind, the cases, misaligned rows, partial files under a final name, NaN outputs and unexpected
 * exit statuses (all should be 0). A script, not a test: `npm run bench:hostile` after a build.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import seedrandom from "seedrandom";
import { drawHostileCase, runHostileCase } from "./hostile-case.js";

const CASES = Number(process.env.FLOORCAST_HOSTILE_CASES ?? "200");
const SEED = process.env.FLOORCAST_HOSTILE_SEED ?? "floorcast-hostile-runs";
const dir = mkdtempSync(join(tmpdir(), "floorcast-hostile-"));
const rng = seedrandom(SEED);
const totals = new Map<string, { cases: number; misaligned: number; partial: number; nan: number; unexpected: number }>();
const t0 = performance.now();
try {
  for (let i = 0; i < CASES; i++) {
    const c = drawHostileCase(rng);
    const label = c.kind === "evaluator" ? `evaluator ${c.mode}${c.processes > 1 ? " ×2" : ""}` : c.kind;
    const f = await runHostileCase(c, dir, `case-${i}`);
    const t = totals.get(label) ?? { cases: 0, misaligned: 0, partial: 0, nan: 0, unexpected: 0 };
    t.cases += 1;
    t.misaligned += f.misalignedRows;
    t.partial += f.partialFiles;
    t.nan += f.nanOutputs;
    if (f.unexpected !== null) {
      t.unexpected += 1;
      console.error(`case ${i} (${label}): ${f.unexpected}`);
    }
    totals.set(label, t);
    process.stderr.write(`\r${i + 1}/${CASES}`);
  }
  process.stderr.write("\n");
  console.log(`Hostile runs: ${CASES} cases, seed ${JSON.stringify(SEED)}, ${((performance.now() - t0) / 1000).toFixed(0)} s\n`);
  console.log("| case | runs | misaligned rows | partial files under a final name | NaN outputs | unexpected exit |");
  console.log("|---|---|---|---|---|---|");
  const sum = { cases: 0, misaligned: 0, partial: 0, nan: 0, unexpected: 0 };
  for (const [label, t] of [...totals].sort(([a], [b]) => a.localeCompare(b))) {
    console.log(`| ${label} | ${t.cases} | ${t.misaligned} | ${t.partial} | ${t.nan} | ${t.unexpected} |`);
    for (const k of Object.keys(sum) as (keyof typeof sum)[]) sum[k] += t[k];
  }
  console.log(`| all | ${sum.cases} | ${sum.misaligned} | ${sum.partial} | ${sum.nan} | ${sum.unexpected} |`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
