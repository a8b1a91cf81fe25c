/**
 * Start-up cost of the command line and the library subpaths: the CPU time (user + system, of the child process,
 * read from /proc/self/stat's cutime and cstime after each spawnSync) of `floorcast --help`, `floorcast fit --help`
 * and of importing `@floorcast/bench/optimizers` and the package root, side by side with a bare `node -e 0`, each
 * run RUNS times, median reported. A script, not a test: `npm run bench:cli` after `npm run build` (Linux only).
 * The numbers are estimates for early feasibility studies, not a zoning determination.
 */
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const RUNS = Number(process.env.FLOORCAST_BENCH_RUNS ?? "9");
const TICK = 0.01; // seconds per clock tick: USER_HZ is 100 on Linux (common practice)
const bin = fileURLToPath(new URL("../../bin/floorcast.js", import.meta.url));
const root = fileURLToPath(new URL("../../../../", import.meta.url));

/** CPU seconds of waited-for children so far: fields 16 and 17 of /proc/self/stat (proc(5)). */
function childrenCpu(): number {
  const stat = readFileSync("/proc/self/stat", "utf8");
  const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
  // fields[0] is field 3 (state), so field k is fields[k − 3]
  return (Number(fields[13]) + Number(fields[14])) * TICK;
}

function cpuOf(args: readonly string[]): number {
  const samples: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const before = childrenCpu();
    const r = spawnSync(process.execPath, args, { cwd: root, encoding: "utf8" });
    if (r.status !== 0) throw new Error(`${args.join(" ")} failed: ${r.stderr}`);
    samples.push(childrenCpu() - before);
  }
  samples.sort((a, b) => a - b);
  return samples[Math.floor(samples.length / 2)]!;
}

const cases: [string, string[]][] = [
  ["node -e 0 (baseline)", ["-e", "0"]],
  ["floorcast --help", [bin, "--help"]],
  ["floorcast fit --help", [bin, "fit", "--help"]],
  ["import @floorcast/bench/optimizers", ["--input-type=module", "-e", "await import('@floorcast/bench/optimizers')"]],
  ["import @floorcast/bench", ["--input-type=module", "-e", "await import('@floorcast/bench')"]],
];
const base = cpuOf(cases[0]![1]);
console.log(`CPU seconds (user + system), median of ${RUNS} runs, one process each; ratio to node -e 0`);
for (const [label, args] of cases) {
  const s = label.startsWith("node -e 0") ? base : cpuOf(args);
  console.log(`${label.padEnd(40)} ${s.toFixed(2)} s   ×${(s / Math.max(base, TICK)).toFixed(1)}`);
}
console.log(`\n${FLOORCAST_CAUTION}`);
