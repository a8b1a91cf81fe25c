import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";
import { expect } from "vitest";

const BIN = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));

/**
 * Spawns the real `floorcast` process, killed after `timeoutMs` (a hang fails the test, never blocks it).
 * @returns exit status (null when killed), stdout, stderr.
 */
export function spawnCli(args: string[], stdin = "", timeoutMs = 120_000): Promise<{ code: number | null; out: string; err: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [BIN, ...args], { stdio: ["pipe", "pipe", "pipe"], timeout: timeoutMs, killSignal: "SIGKILL" });
    let out = "";
    let err = "";
    child.stdout.on("data", (c: Buffer) => (out += c.toString()));
    child.stderr.on("data", (c: Buffer) => (err += c.toString()));
    child.on("close", (code) => resolve({ code, out, err }));
    child.stdin.on("error", () => undefined);
    child.stdin.end(stdin);
  });
}

/**
 * Spawns the real `floorcast` process and SIGKILLs it as soon as `killNow(elapsedMs)` says so (polled every 5 ms),
 * or after 120 s in any case.
 * @returns exit status, the signal that ended it (SIGKILL when killed) and stderr.
 */
export function spawnUntil(args: string[], killNow: (elapsedMs: number) => boolean): Promise<{ code: number | null; signal: NodeJS.Signals | null; err: string }> {
  return new Promise((resolve) => {
    const t0 = Date.now();
    const child = spawn(process.execPath, [BIN, ...args], { stdio: ["ignore", "ignore", "pipe"] });
    let err = "";
    child.stderr.on("data", (c: Buffer) => (err += c.toString()));
    const timer = setInterval(() => {
      const t = Date.now() - t0;
      if (t > 120_000 || killNow(t)) child.kill("SIGKILL");
    }, 5);
    child.on("close", (code, signal) => {
      clearInterval(timer);
      resolve({ code, signal, err });
    });
  });
}

/**
 * The shared contract of every command's outcome: the exit status is one of `allowed` (0 success, 1 some
 * inputs failed, 2 usage error), no stack-trace frame ("    at ") anywhere, and a usage error says what is
 * wrong in one line on stderr ("floorcast: …" or commander's "error: …").
 */
export function expectCleanOutcome(r: { code: number | null; out: string; err: string }, allowed: readonly number[], label = ""): void {
  expect(allowed, `${label} exit ${r.code}: ${r.err.slice(0, 300)}`).toContain(r.code);
  expect(r.err, label).not.toMatch(/^\s{4}at /m);
  expect(r.out, label).not.toMatch(/^\s{4}at /m);
  if (r.code === 2) expect(r.err, label).toMatch(/^(floorcast: \S|error: \S)/m);
}
