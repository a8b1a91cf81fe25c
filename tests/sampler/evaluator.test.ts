import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { PassThrough } from "node:stream";
import {
  commandEvaluator,
  createProgressBar,
  functionEvaluator,
  generateDataset,
  loadScenario,
  massingEvaluator,
  workerPoolEvaluator,
  type DatasetRow,
  type Evaluator,
} from "@floorcast/sampler";

/** Evaluates one input through the batch contract and returns its one answer (derived from the Evaluator contract). */
async function evaluateOne(e: Evaluator, input: Record<string, number | string | boolean>, sample?: number) {
  const answers = await e.evaluate([input], sample === undefined ? undefined : { samples: [sample] });
  expect(answers).toHaveLength(1);
  return answers[0]!;
}


const dir = mkdtempSync(join(tmpdir(), "floorcast-eval-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const scenarioPath = fileURLToPath(new URL("../../datasets/scenarios/larkspur-terraces.json", import.meta.url));
const node = JSON.stringify(process.execPath);

/** A tiny "external program": reads JSON Lines, answers each with lot area and perimeter, in order. */
const program = join(dir, "model.mjs");
writeFileSync(
  program,
  `import { createInterface } from "node:readline";
const rl = createInterface({ input: process.stdin });
for await (const line of rl) {
  const x = JSON.parse(line);
  if (x.frontage < 0) { process.stderr.write("negative frontage\\n"); process.exit(3); }
  process.stdout.write(JSON.stringify({ sample: x.sample, area: x.frontage * x.depth, perimeter: 2 * (x.frontage + x.depth) }) + "\\n");
}
`,
);
async function collect(it: AsyncIterable<DatasetRow>): Promise<DatasetRow[]> {
  const rows: DatasetRow[] = [];
  for await (const r of it) rows.push(r);
  return rows;
}

describe("functionEvaluator and massingEvaluator", () => {
  it("wraps sync and async functions", async () => {
    const e = functionEvaluator((x) => ({ y: (x.a as number) + 1 }), { name: "plus-one" });
    expect(await evaluateOne(e, { a: 1 })).toEqual({ y: 2 });
    expect(e.name).toBe("plus-one");
    const a = functionEvaluator(async (x) => ({ y: (x.a as number) * 2 }), { concurrency: 4 });
    expect(await evaluateOne(a, { a: 3 })).toEqual({ y: 6 });
    expect(a.concurrency).toBe(4);
    expect(() => functionEvaluator(3 as never)).toThrow(TypeError);
    expect(() => functionEvaluator(() => ({}), { concurrency: 0 })).toThrow(RangeError);
  });
  it("answers a batch in order: synchronously for sync functions and the massing rule, by a promise for async ones", async () => {
    const e = functionEvaluator((x) => ({ y: (x.a as number) + 1 }));
    const sync = e.evaluate([{ a: 1 }, { a: 5 }, { a: -2 }]);
    expect(Array.isArray(sync)).toBe(true); // no promise per batch for in-process functions
    expect(sync).toEqual([{ y: 2 }, { y: 6 }, { y: -1 }]);
    expect(e.evaluate([])).toEqual([]);
    const a = functionEvaluator(async (x) => ({ y: (x.a as number) * 2 }));
    const later = a.evaluate([{ a: 1 }, { a: 2 }]);
    expect(later).toBeInstanceOf(Promise);
    expect(await later).toEqual([{ y: 2 }, { y: 4 }]);
    const s = await loadScenario(scenarioPath);
    const m = massingEvaluator(s);
    const recs = [10, 14, 18].map((frontage) => ({ ...s.fixed, frontage, depth: 30, setbackFront: 3, setbackSide: 1, setbackRear: 5, maxHeight: 9, floorHeight: 3, maxFar: 1.2 }));
    const batch = m.evaluate(recs) as readonly Record<string, unknown>[];
    // (f − 2)(30 − 3 − 5) buildable per design, in the order asked (derived, as below)
    expect(batch.map((o) => o["buildableArea"])).toEqual([176, 264, 352].map((v) => expect.closeTo(v, 9)));
  });
  it("commandEvaluator refuses sample ids that do not match the batch", async () => {
    const e = commandEvaluator(`${node} ${JSON.stringify(program)}`);
    try {
      expect(() => e.evaluate([{ frontage: 1, depth: 2 }], { samples: [1, 2] })).toThrow(/context\.samples must give one id per input \(1\), got 2/);
      expect(await e.evaluate([{ frontage: 2, depth: 3 }, { frontage: 4, depth: 5 }], { samples: [10, 11] })).toEqual([
        { area: 6, perimeter: 10 },
        { area: 20, perimeter: 18 },
      ]);
    } finally {
      await e.close();
    }
  });
  it("the massing evaluator ignores fixed values passed along and refuses booleans", async () => {
    const s = await loadScenario(scenarioPath);
    const e = massingEvaluator(s);
    const rec = { frontage: 10, depth: 30, setbackFront: 3, setbackSide: 1, setbackRear: 5, maxHeight: 9, floorHeight: 3, maxFar: 1.2 };
    const out = await evaluateOne(e, { ...s.fixed, ...rec });
    // (10 − 2)(30 − 3 − 5) = 176 m² buildable (yards per Woodway WA 14.08.350, derived); 0.5 × 300 = 150 m² coverage cap
    expect(out.buildableArea).toBeCloseTo(176, 9);
    expect(out.footprintArea).toBeCloseTo(150, 6);
    expect(out.coverageCapped).toBe(1);
    await expect(async () => evaluateOne(e, { ...rec, depth: true })).rejects.toThrow(TypeError);
  });
});

describe("commandEvaluator (JSON Lines to an external program)", () => {
  it("streams samples to the program and reads its answers in order", async () => {
    const s = await loadScenario(scenarioPath);
    const e = commandEvaluator(`${node} ${JSON.stringify(program)}`);
    try {
      const rows = await collect(generateDataset(s, { n: 50, design: "random", seed: 4, evaluator: e }));
      expect(rows).toHaveLength(50);
      for (const r of rows) {
        expect(r.area).toBe((r.frontage as number) * (r.depth as number));
        expect(r.perimeter).toBe(2 * ((r.frontage as number) + (r.depth as number)));
      }
      expect(rows.map((r) => r.sample)).toEqual(Array.from({ length: 50 }, (_, i) => i));
      expect(e.name).toBe(`command: ${node} ${JSON.stringify(program)}`);
    } finally {
      await e.close();
    }
  });
  it("processes: N runs N copies; the dataset does not depend on N", async () => {
    const s = await loadScenario(scenarioPath);
    const pidProgram = join(dir, "pid-model.mjs");
    writeFileSync(
      pidProgram,
      `import { createInterface } from "node:readline";
for await (const line of createInterface({ input: process.stdin })) {
  const x = JSON.parse(line);
  process.stdout.write(JSON.stringify({ sample: x.sample, area: x.frontage * x.depth, pid: process.pid }) + "\\n");
}`,
    );
    const one = commandEvaluator(`${node} ${JSON.stringify(pidProgram)}`);
    const three = commandEvaluator(`${node} ${JSON.stringify(pidProgram)}`, { processes: 3, window: 4 });
    try {
      const a = await collect(generateDataset(s, { n: 60, design: "random", seed: 4, evaluator: one }));
      const b = await collect(generateDataset(s, { n: 60, design: "random", seed: 4, evaluator: three }));
      expect(b.map((r) => r.area)).toEqual(a.map((r) => r.area));
      expect(new Set(a.map((r) => r.pid)).size).toBe(1);
      expect(new Set(b.map((r) => r.pid)).size).toBe(3);
      expect(three.concurrency).toBe(12);
    } finally {
      await one.close();
      await three.close();
    }
    expect(() => commandEvaluator("cat", { processes: 0 })).toThrow(/processes must be an integer ≥ 1/);
  });
  it("reports a program that dies, quoting its status and stderr", async () => {
    const e = commandEvaluator(`${node} ${JSON.stringify(program)}`);
    await expect(evaluateOne(e, { frontage: 2, depth: 3 })).resolves.toEqual({ area: 6, perimeter: 10 });
    await expect(evaluateOne(e, { frontage: -1, depth: 3 })).rejects.toThrow(/exited \(status 3\) after 1 answers; sample \d+ unanswered: negative frontage/);
    await expect(evaluateOne(e, { frontage: 1, depth: 1 })).rejects.toThrow(/exited/);
    await e.close();
  });
  it("an answer that is not a JSON object fails that sample", async () => {
    const liar = join(dir, "liar.mjs");
    writeFileSync(
      liar,
      `import { createInterface } from "node:readline";
let k = 0;
for await (const line of createInterface({ input: process.stdin })) process.stdout.write(++k === 1 ? "hello\\n" : "[1]\\n");`,
    );
    const e = commandEvaluator(`${node} ${JSON.stringify(liar)}`);
    await expect(evaluateOne(e, { a: 1 })).rejects.toThrow(/answer 1 \(for sample 0\) is not JSON: "hello"/);
    await expect(evaluateOne(e, { a: 1 })).rejects.toThrow(/is not JSON/); // the program is stopped: no answer can be trusted
    await e.close();
    const array = join(dir, "array.mjs");
    writeFileSync(array, `import { createInterface } from "node:readline";
for await (const line of createInterface({ input: process.stdin })) process.stdout.write("[1]\\n");`);
    const f = commandEvaluator(`${node} ${JSON.stringify(array)}`);
    await expect(evaluateOne(f, { a: 1 }, 7)).rejects.toThrow(/answer 1 \(for sample 7\) must be a JSON object/);
    await f.close();
  });
  it("a command that cannot be found fails every evaluation; bad arguments are refused", async () => {
    const e = commandEvaluator("floorcast-no-such-program-xyz");
    await expect(evaluateOne(e, { a: 1 })).rejects.toThrow(/exited \(status 127\)/);
    await e.close();
    expect(() => commandEvaluator("  ")).toThrow(TypeError);
    expect(() => commandEvaluator("cat", { window: 0 })).toThrow(RangeError);
  });
});

describe("workerPoolEvaluator (piscina)", () => {
  it("spreads evaluations over worker threads and keeps the order", async () => {
    const worker = join(dir, "worker.mjs");
    writeFileSync(
      worker,
      `import { threadId } from "node:worker_threads";
export function evaluate(x) { let s = 0; for (let i = 0; i < 2e5; i++) s += Math.sqrt(i); return { twice: 2 * x.frontage, thread: threadId, busy: s > 0 ? 1 : 0 }; }`,
    );
    const s = await loadScenario(scenarioPath);
    const e = workerPoolEvaluator({ filename: worker, exportName: "evaluate", threads: 2 });
    try {
      const rows = await collect(generateDataset(s, { n: 40, design: "random", seed: 8, evaluator: e }));
      expect(rows.map((r) => r.twice)).toEqual(rows.map((r) => 2 * (r.frontage as number)));
      expect(rows.map((r) => r.sample)).toEqual(Array.from({ length: 40 }, (_, i) => i));
      expect(new Set(rows.map((r) => r.thread)).size).toBe(2);
    } finally {
      await e.close();
    }
  });
  it("refuses a relative filename or a bad thread count", () => {
    expect(() => workerPoolEvaluator({ filename: "worker.mjs" })).toThrow(/absolute path/);
    expect(() => workerPoolEvaluator({ filename: "/x.mjs", threads: 0 })).toThrow(RangeError);
    expect(() => workerPoolEvaluator(null as never)).toThrow(TypeError);
  });
});

describe("createProgressBar", () => {
  it("is silent when the stream is not a terminal", () => {
    const s = new PassThrough();
    const chunks: Buffer[] = [];
    s.on("data", (c: Buffer) => chunks.push(c));
    const bar = createProgressBar(s, 10, "x");
    bar.update(5);
    bar.stop();
    expect(Buffer.concat(chunks).length).toBe(0);
  });
  it("draws a bar on a terminal", () => {
    const s = Object.assign(new PassThrough(), { isTTY: true, columns: 80, cursorTo() {}, clearLine() {}, moveCursor() {} });
    const chunks: Buffer[] = [];
    s.on("data", (c: Buffer) => chunks.push(c));
    const bar = createProgressBar(s, 10, "sample");
    bar.update(10);
    bar.stop();
    expect(Buffer.concat(chunks).toString()).toMatch(/sample .*10\/10 rows/);
  });
});
