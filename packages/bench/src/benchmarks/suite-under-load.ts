/**
 * Runs the whole test suite several times in a row while busy loops keep cores occupied (as the
 * `stress` tool's CPU workers do), and reports each run's outcome and wall time, and the load
 * average, side by side. A script, not a test: `npm run build && npm run bench:stress -- [runs] [loops]`
 * (default 5 runs under 2 busy loops); it sets FLOORCAST_REQUIRE_REFERENCE=1 as CI does.
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { cpus, loadavg } from "node:os";
import { fileURLToPath } from "node:url";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const runs = Number(process.argv[2] ?? "5");
const loops = Number(process.argv[3] ?? "2");
if (!Number.isInteger(runs) || runs < 1 || !Number.isInteger(loops) || loops < 0) {
  console.error("usage: bench:stress -- [runs ≥ 1] [busy loops ≥ 0]");
  process.exit(2);
}

/** One busy loop: a child process spinning on one core until it is killed. */
function busyLoop(): ChildProcess {
  return spawn(process.execPath, ["-e", "for (;;) {}"], { stdio: "ignore" });
}

const busy = Array.from({ length: loops }, busyLoop);
const stop = (): void => {
  for (const b of busy) b.kill("SIGKILL");
};
process.on("exit", stop);
for (const s of ["SIGINT", "SIGTERM"] as const) process.on(s, () => process.exit(130));

console.log(`The full suite ${runs} times in a row under ${loops} busy loops (load average before: ${loadavg()[0]!.toFixed(1)})\n`);
console.log("| run | result | tests | failed tests | wall s | load average (1 min) at the end |");
console.log("|---|---|---|---|---|---|");
let passed = 0;
for (let k = 1; k <= runs; k++) {
  const t0 = performance.now();
  const r = spawnSync("npx", ["vitest", "run", "--config", "tests/vitest.config.ts"], {
    cwd: root,
    encoding: "utf8",
    env: { ...process.env, FLOORCAST_REQUIRE_REFERENCE: "1", NO_COLOR: "1", FORCE_COLOR: "0" },
    maxBuffer: 256 << 20,
  });
  const seconds = (performance.now() - t0) / 1000;
  const out = `${r.stdout}\n${r.stderr}`;
  const tests = /Tests\s+(.+?)\s*\(/.exec(out)?.[1] ?? "?";
  const failed = [...out.matchAll(/^\s*(?:×|FAIL)\s+(.+)$/gm)].map((m) => m[1]!.trim()).slice(0, 5);
  if (r.status === 0) passed++;
  console.log(`| ${k} | ${r.status === 0 ? "pass" : `fail (exit ${r.status})`} | ${tests} | ${failed.join("; ") || "—"} | ${seconds.toFixed(0)} | ${loadavg()[0]!.toFixed(1)} |`);
}
stop();
console.log(`\n${passed} of ${runs} runs passed under ${loops} busy loops on ${cpus().length} CPUs.`);
console.log(`\n${FLOORCAST_CAUTION}`);
process.exitCode = passed === runs ? 0 : 1;
