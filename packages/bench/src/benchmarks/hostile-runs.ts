/**
 * A randomised hostile run (default 200 cases from a fixed seed; FLOORCAST_HOSTILE_CASES, FLOORCAST_HOSTILE_SEED
 * to change): hostile external evaluators of every kind, concurrent writers, kills at random moments with
 * resumes, and predictions far outside a model's domain, each through the real `floorcast` command line.
 * Reports, per kind, the cases, misaligned rows, partial files under a final name, NaN outputs and unexpected
 * exit statuses (all should be 0), and the slowest cases. A script, not a test: `npm run bench:hostile` after a
 * build. Sizes are bounded (see drawHostileCase) and at most two cases run at once (FLOORCAST_HOSTILE_JOBS, 1 or
 * 2, default 2), so it completes on a loaded 2-core machine; the cases are drawn before any runs, so the set of
 * cases does not depend on the number of jobs.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import seedrandom from "seedrandom";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";
import { drawHostileCase, runHostileCase, type HostileCase, type HostileFindings } from "./hostile-case.js";

const CASES = Number(process.env.FLOORCAST_HOSTILE_CASES ?? "200");
const SEED = process.env.FLOORCAST_HOSTILE_SEED ?? "floorcast-hostile-runs";
const JOBS = Number(process.env.FLOORCAST_HOSTILE_JOBS ?? "2");
if (!Number.isInteger(CASES) || CASES < 1) throw new RangeError(`hostile-runs: FLOORCAST_HOSTILE_CASES must be a whole number ≥ 1, got ${CASES}`);
if (JOBS !== 1 && JOBS !== 2) throw new RangeError(`hostile-runs: FLOORCAST_HOSTILE_JOBS must be 1 or 2, got ${JOBS}`);

const dir = mkdtempSync(join(tmpdir(), "floorcast-hostile-"));
const rng = seedrandom(SEED);
const cases: HostileCase[] = Array.from({ length: CASES }, () => drawHostileCase(rng));
const labelOf = (c: HostileCase): string => (c.kind === "evaluator" ? `evaluator ${c.mode}${c.processes > 1 ? " ×2" : ""}` : c.kind);
const results: { findings: HostileFindings; seconds: number }[] = new Array(CASES);
const t0 = performance.now();
let next = 0;
let finished = 0;
/** One job: takes the next undrawn case until none is left. */
async function job(): Promise<void> {
  while (next < CASES) {
    const i = next++;
    const t = performance.now();
    const findings = await runHostileCase(cases[i]!, dir, `case-${i}`);
    results[i] = { findings, seconds: (performance.now() - t) / 1000 };
    if (findings.unexpected !== null) console.error(`\ncase ${i} (${labelOf(cases[i]!)}): ${findings.unexpected}`);
    process.stderr.write(`\r${++finished}/${CASES}`);
  }
}
try {
  await Promise.all(Array.from({ length: JOBS }, job));
  process.stderr.write("\n");
  const totals = new Map<string, { cases: number; misaligned: number; partial: number; nan: number; unexpected: number; seconds: number }>();
  cases.forEach((c, i) => {
    const { findings: f, seconds } = results[i]!;
    const t = totals.get(labelOf(c)) ?? { cases: 0, misaligned: 0, partial: 0, nan: 0, unexpected: 0, seconds: 0 };
    t.cases += 1;
    t.misaligned += f.misalignedRows;
    t.partial += f.partialFiles;
    t.nan += f.nanOutputs;
    t.unexpected += f.unexpected === null ? 0 : 1;
    t.seconds = Math.max(t.seconds, seconds);
    totals.set(labelOf(c), t);
  });
  const wall = (performance.now() - t0) / 1000;
  console.log(`Hostile runs: ${CASES} cases, seed ${JSON.stringify(SEED)}, ${JOBS} at a time, ${wall.toFixed(0)} s\n`);
  console.log("| case | runs | misaligned rows | partial files under a final name | NaN outputs | unexpected exit | slowest case (s) |");
  console.log("|---|---|---|---|---|---|---|");
  const sum = { cases: 0, misaligned: 0, partial: 0, nan: 0, unexpected: 0, seconds: 0 };
  for (const [label, t] of [...totals].sort(([a], [b]) => a.localeCompare(b))) {
    console.log(`| ${label} | ${t.cases} | ${t.misaligned} | ${t.partial} | ${t.nan} | ${t.unexpected} | ${t.seconds.toFixed(1)} |`);
    for (const k of ["cases", "misaligned", "partial", "nan", "unexpected"] as const) sum[k] += t[k];
    sum.seconds = Math.max(sum.seconds, t.seconds);
  }
  console.log(`| all | ${sum.cases} | ${sum.misaligned} | ${sum.partial} | ${sum.nan} | ${sum.unexpected} | ${sum.seconds.toFixed(1)} |`);
  console.log(`\n${FLOORCAST_CAUTION}`);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
