import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawn } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { runCli } from "./run-cli.js";

// External programs that hang, driven through `floorcast sample --evaluator-timeout 3`: the limit covers the
// program's start-up too (a node child, slower on a loaded machine), so programs that must pass get 3 s; the
// elapsed-time bounds check that a run ends, not how fast. Exit statuses per README "Exit codes" (1 = some inputs failed, 2 = usage error).
const scenario = fileURLToPath(new URL("../../datasets/scenarios/larkspur-terraces.json", import.meta.url));
const dir = mkdtempSync(join(tmpdir(), "floorcast-cli-sample-timeout-"));
const home = process.cwd();
beforeAll(() => process.chdir(dir));
afterAll(() => {
  process.chdir(home);
  rmSync(dir, { recursive: true, force: true });
});

async function floorcast(...args: string[]): Promise<{ status: number; stdout: string; stderr: string }> {
  const r = await runCli(args);
  return { status: r.code, stdout: r.out, stderr: r.err };
}
const base = ["sample", "--scenario", scenario, "--n", "30", "--seed", "3", "--design", "lhs"];
const stall = join(dir, "stall");

/** Answers with the lot area; while dir/stall exists it goes silent after 12 answers (and ignores SIGTERM). */
const model = join(dir, "model.mjs");
writeFileSync(
  model,
  `import { createInterface } from "node:readline";
import { existsSync } from "node:fs";
process.on("SIGTERM", () => {});
const stall = existsSync(${JSON.stringify(stall)});
let k = 0;
for await (const line of createInterface({ input: process.stdin })) {
  if (stall && ++k > 12) continue;
  const x = JSON.parse(line);
  process.stdout.write(JSON.stringify({ sample: x.sample, area: x.frontage * x.depth }) + "\\n");
}
if (process.argv[2] === "linger") setInterval(() => {}, 1000);
`,
);
const cmd = `${JSON.stringify(process.execPath)} ${JSON.stringify(model)}`;

describe("floorcast sample --evaluator-timeout", () => {
  it("a program that stops answering: exit 1, one line naming the line and the limit; rows kept; --resume finishes", async () => {
    const whole = await floorcast(...base, "--evaluator-command", cmd, "--out", "whole.csv");
    expect(whole.status).toBe(0);
    writeFileSync(stall, "");
    const t0 = Date.now();
    const hung = await floorcast(...base, "--evaluator-command", cmd, "--evaluator-timeout", "3", "--out", "t.csv");
    expect(Date.now() - t0).toBeLessThan(40_000); // it ends: limit 3 s, then SIGTERM, grace, SIGKILL
    expect(hung.status).toBe(1);
    const lines = hung.stderr.trim().split("\n");
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^floorcast: commandEvaluator: no answer for sample 12 \(line 13\) within 3 s from .*model\.mjs.*\(process 1 of 1\); the program was stopped/);
    expect(hung.stderr).not.toMatch(/\n\s+at /);
    expect(existsSync(join(dir, "t.csv"))).toBe(false);
    // the 12 answered samples are on disk (header + 12 rows) and equal the uninterrupted run's first rows
    const partial = readFileSync(join(dir, "t.csv.partial"), "utf8").trimEnd().split("\n");
    const full = readFileSync(join(dir, "whole.csv"), "utf8").split("\n");
    expect(partial).toEqual(full.slice(0, 13));
    rmSync(stall);
    const resumed = await floorcast(...base, "--evaluator-command", cmd, "--evaluator-timeout", "3", "--resume", "--out", "t.csv");
    expect(resumed.status).toBe(0);
    expect(readFileSync(join(dir, "t.csv")).equals(readFileSync(join(dir, "whole.csv")))).toBe(true);
  });

  it("a program that answers everything but never exits: the dataset is written and the run still ends", async () => {
    const t0 = Date.now();
    const r = await floorcast(...base, "--evaluator-command", `${cmd} linger`, "--evaluator-timeout", "3", "--out", "linger.csv");
    expect(Date.now() - t0).toBeLessThan(40_000); // it ends
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/wrote linger\.csv: 30 rows/);
    expect(readFileSync(join(dir, "linger.csv")).equals(readFileSync(join(dir, "whole.csv")))).toBe(true); // same rows
  });

  it("Ctrl-C (SIGINT) on floorcast also stops the program, which runs in its own process group", async () => {
    const pidFile = join(dir, "silent.pid");
    const silent = join(dir, "silent.mjs");
    writeFileSync(silent, `import { writeFileSync } from "node:fs";
writeFileSync(${JSON.stringify(pidFile)}, String(process.pid));
process.stdin.resume();
setInterval(() => {}, 1000);`);
    const bin = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));
    const args = [...base, "--evaluator-command", `${JSON.stringify(process.execPath)} ${JSON.stringify(silent)}`];
    const child = spawn(process.execPath, [bin, ...args, "--evaluator-timeout", "0", "--out", "int.csv"], { cwd: dir });
    const ended = new Promise<string | null>((resolve) => child.on("exit", (_code, sig) => resolve(sig)));
    const gone = (pid: number): boolean => {
      try {
        process.kill(pid, 0);
        return /^\d+ \(.*\) Z/.test(readFileSync(`/proc/${pid}/stat`, "utf8"));
      } catch {
        return true;
      }
    };
    const until = Date.now() + 30_000; // floorcast and the program start (slower on a loaded machine)
    while (!existsSync(pidFile) && Date.now() < until) await new Promise((r) => setTimeout(r, 20));
    const pid = Number(readFileSync(pidFile, "utf8"));
    expect(gone(pid)).toBe(false);
    child.kill("SIGINT");
    expect(await ended).toBe("SIGINT"); // floorcast dies of the signal, as without the forwarding
    const stopBy = Date.now() + 20_000;
    while (!gone(pid) && Date.now() < stopBy) await new Promise((r) => setTimeout(r, 20));
    expect(gone(pid)).toBe(true);
  });

  it("bad --evaluator-timeout values exit 2 with one line", async () => {
    for (const v of ["-1", "abc", "1e3", "", "9999999", "0.000001", "0.0015"]) {
      const r = await floorcast(...base, "--evaluator-command", cmd, "--evaluator-timeout", v, "--out", "bad.csv");
      expect(r.status, v).toBe(2);
      expect(r.stderr.trim().split("\n"), v).toHaveLength(1);
      expect(r.stderr).toMatch(/--evaluator-timeout must be 0 \(no limit\) or whole milliseconds in \[0\.001, 2147483\.647\] seconds/);
    }
    expect(existsSync(join(dir, "bad.csv"))).toBe(false);
  });
});
