import { afterAll, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { commandEvaluator, type Evaluator } from "@floorcast/sampler";

/** Evaluates one input through the batch contract and returns its one answer (derived from the Evaluator contract). */
async function evaluateOne(e: Evaluator, input: Record<string, number | string | boolean>, sample?: number) {
  const answers = await e.evaluate([input], sample === undefined ? undefined : { samples: [sample] });
  expect(answers).toHaveLength(1);
  return answers[0]!;
}

// Tiny external programs stand in for a user's model. A program's start-up (a node child: about 0.2 s on a quiet
// machine, several seconds on a loaded one) counts towards the answer limit of its first line, so every limit that
// a passing program must meet is 3 s, and a program that must be seen stopping first answers one line (so it has
// surely started and recorded its pid) and goes silent after it: its limit then runs from that answer. The upper
// bounds on elapsed time below are behaviour (the run ends, it does not wait out the grace period), not speed
// measurements, and leave room for a loaded machine.
const dir = mkdtempSync(join(tmpdir(), "floorcast-eval-timeout-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const node = JSON.stringify(process.execPath);

/** Writes a program that records its pid in dir/pids/<pid> and then runs `body`. */
function program(name: string, body: string): string {
  const file = join(dir, name);
  writeFileSync(
    file,
    `import { createInterface } from "node:readline";
import { mkdirSync, writeFileSync } from "node:fs";

mkdirSync(${JSON.stringify(join(dir, "pids", name))}, { recursive: true });
writeFileSync(${JSON.stringify(join(dir, "pids", name))} + "/" + process.pid, "");
${body}
`,
  );
  return `${node} ${JSON.stringify(file)}`;
}
const pidsOf = (name: string): number[] => {
  const d = join(dir, "pids", name);
  return existsSync(d) ? readdirSync(d).map(Number) : [];
};
/** Whether a process still runs (a zombie, dead but not yet reaped, counts as gone). */
function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
  } catch {
    return false;
  }
  try {
    return !/^\d+ \(.*\) Z/.test(readFileSync(`/proc/${pid}/stat`, "utf8"));
  } catch {
    return false;
  }
}
async function eventually(check: () => boolean, ms = 1000): Promise<boolean> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (check()) return true;
    await new Promise((r) => setTimeout(r, 20));
  }
  return check();
}

/** Answers its first line, then reads lines and never answers; ignores SIGTERM, so only SIGKILL stops it. */
const silentBody = `process.on("SIGTERM", () => {});
let k = 0;
for await (const line of createInterface({ input: process.stdin })) {
  const x = JSON.parse(line);
  if (++k === 1) process.stdout.write(JSON.stringify({ sample: x.sample, twice: 2 * x.a }) + "\\n");
}
setInterval(() => {}, 1000);`;
/** Answers every line at once, then ignores the end of its input and SIGTERM. */
const stubbornBody = `process.on("SIGTERM", () => {});
for await (const line of createInterface({ input: process.stdin })) {
  const x = JSON.parse(line);
  process.stdout.write(JSON.stringify({ sample: x.sample, twice: 2 * x.a }) + "\\n");
}
setInterval(() => {}, 1000);`;
/** Answers one line at a time, each 1.2 s after the previous answer. */
const slowBody = `const lines = [];
let busy = false;
const next = () => {
  if (busy || lines.length === 0) return;
  busy = true;
  const x = JSON.parse(lines.shift());
  setTimeout(() => { process.stdout.write(JSON.stringify({ sample: x.sample, twice: 2 * x.a }) + "\\n"); busy = false; next(); }, 1200);
};
for await (const line of createInterface({ input: process.stdin })) { lines.push(line); next(); }`;
/** Answers the first 3 lines, then goes silent (still reading). */
const stallBody = `let k = 0;
for await (const line of createInterface({ input: process.stdin })) {
  if (++k <= 3) process.stdout.write(JSON.stringify({ sample: JSON.parse(line).sample, twice: 2 * JSON.parse(line).a }) + "\\n");
}
setInterval(() => {}, 1000);`;

describe("commandEvaluator answer timeout", () => {
  it("a program that stops answering fails the sample, naming the line and the limit, and is killed", async () => {
    const cmd = program("silent.mjs", silentBody);
    const e = commandEvaluator(cmd, { timeoutMs: 3000, graceMs: 200 });
    await expect(evaluateOne(e, { a: 1 })).resolves.toEqual({ twice: 2 });
    const t0 = Date.now();
    const second = evaluateOne(e, { a: 2 });
    const third = evaluateOne(e, { a: 3 });
    await expect(second).rejects.toThrow(/commandEvaluator: no answer for sample \d+ \(line 2\) within 3 s from .*silent\.mjs.* \(process 1 of 1\); the program was stopped/);
    await expect(third).rejects.toThrow(/no answer for sample \d+ \(line 2\) within 3 s/);
    expect(Date.now() - t0).toBeGreaterThanOrEqual(2990); // not before the limit (timer granularity ~ms)
    await expect(evaluateOne(e, { a: 4 })).rejects.toThrow(/no answer for sample \d+ \(line 2\)/); // later samples fail at once
    await e.close();
    expect(Date.now() - t0).toBeLessThan(30_000); // it ends: 3 s + SIGTERM grace 200 ms + SIGKILL
    const pids = pidsOf("silent.mjs");
    expect(pids).toHaveLength(1);
    expect(await eventually(() => !alive(pids[0]!))).toBe(true);
  });

  it("the limit runs from the previous answer: a slow but steady program with many lines in flight passes", async () => {
    const cmd = program("slow.mjs", slowBody);
    const e = commandEvaluator(cmd, { timeoutMs: 3000, window: 4 });
    try {
      // the 4th answer arrives ~4.8 s after it was sent (beyond the 3 s limit), but only 1.2 s after the 3rd
      const answers = await Promise.all(Array.from({ length: 4 }, (_, i) => evaluateOne(e, { a: i })));
      expect(answers.map((o) => o.twice)).toEqual([0, 2, 4, 6]);
    } finally {
      await e.close();
    }
  });

  it("timeoutMs: 0 waits as long as the program takes", async () => {
    const cmd = program("slow0.mjs", slowBody);
    const e = commandEvaluator(cmd, { timeoutMs: 0, graceMs: 500 });
    try {
      const answers = await Promise.all([1, 2].map((a) => evaluateOne(e, { a })));
      expect(answers.map((o) => o.twice)).toEqual([2, 4]);
    } finally {
      await e.close();
    }
  });

  it("with several processes, a stall in one stops every copy", async () => {
    const cmd = program("stall.mjs", stallBody);
    const e = commandEvaluator(cmd, { processes: 2, window: 4, timeoutMs: 3000, graceMs: 200 });
    const results = await Promise.allSettled(Array.from({ length: 8 }, (_, i) => evaluateOne(e, { a: i })));
    // each copy answered its first 3 lines; the 4th line of one copy timed out and failed the rest
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(6);
    const reasons = results.flatMap((r) => (r.status === "rejected" ? [String(r.reason)] : []));
    expect(reasons).toHaveLength(2);
    for (const m of reasons) expect(m).toMatch(/no answer for sample \d+ \(line 4\) within 3 s from .*\(process [12] of 2\)/);
    await e.close();
    const pids = pidsOf("stall.mjs");
    expect(pids).toHaveLength(2);
    expect(await eventually(() => pids.every((p) => !alive(p)))).toBe(true);
  });

  it("stops what the shell started too (a compound command line is not exec'd by the shell)", async () => {
    const cmd = `cd ${JSON.stringify(dir)} && ${program("nested.mjs", silentBody)}`;
    const e = commandEvaluator(cmd, { timeoutMs: 3000, graceMs: 200 });
    await expect(evaluateOne(e, { a: 1 })).resolves.toEqual({ twice: 2 });
    await expect(evaluateOne(e, { a: 2 })).rejects.toThrow(/no answer for sample \d+ \(line 2\) within 3 s/);
    await e.close();
    const pids = pidsOf("nested.mjs");
    expect(pids).toHaveLength(1);
    expect(await eventually(() => !alive(pids[0]!))).toBe(true);
  });
});

describe("commandEvaluator bounded close", () => {
  it("a program that answers, then ignores the end of its input and SIGTERM, is killed within the grace periods", async () => {
    const cmd = program("stubborn.mjs", stubbornBody);
    const e = commandEvaluator(cmd, { timeoutMs: 0, graceMs: 250 });
    await expect(evaluateOne(e, { a: 21 })).resolves.toEqual({ twice: 42 });
    const t0 = Date.now();
    await e.close();
    const took = Date.now() - t0;
    expect(took).toBeGreaterThanOrEqual(450); // waited 250 ms for an exit, then 250 ms after SIGTERM
    expect(took).toBeLessThan(20_000); // it ends
    const pids = pidsOf("stubborn.mjs");
    expect(await eventually(() => !alive(pids[0]!))).toBe(true);
  });

  it("a program that exits on the end of its input closes at once; close twice is harmless", async () => {
    const file = join(dir, "polite.mjs");
    writeFileSync(file, `process.stdin.resume(); process.stdin.on("end", () => process.exit(0));`);
    const e = commandEvaluator(`${node} ${JSON.stringify(file)}`, { timeoutMs: 300, graceMs: 40_000 });
    const t0 = Date.now();
    await e.close();
    await e.close();
    expect(Date.now() - t0).toBeLessThan(30_000); // did not wait out the 40 s grace period
  });
});

describe("commandEvaluator timeout options", () => {
  it("refuses bad limits with the field named", () => {
    expect(() => commandEvaluator("cat", { timeoutMs: -1 })).toThrow(/commandEvaluator: timeoutMs must be in \[0, 2147483647\] ms.*got -1/);
    expect(() => commandEvaluator("cat", { timeoutMs: Number.NaN })).toThrow(RangeError);
    expect(() => commandEvaluator("cat", { timeoutMs: Number.POSITIVE_INFINITY })).toThrow(RangeError);
    expect(() => commandEvaluator("cat", { timeoutMs: 2 ** 31 })).toThrow(RangeError);
    expect(() => commandEvaluator("cat", { timeoutMs: "300" as never })).toThrow(TypeError);
    expect(() => commandEvaluator("cat", { graceMs: 0 })).toThrow(/graceMs must be in \(0, 2147483647\] ms, got 0/);
    expect(() => commandEvaluator("cat", { graceMs: Number.NEGATIVE_INFINITY })).toThrow(RangeError);
    expect(() => commandEvaluator("cat", { graceMs: "1" as never })).toThrow(TypeError);
  });
});
