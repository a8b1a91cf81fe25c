import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { commandEvaluator, EvaluatorProtocolError, loadScenario, writeDataset, type Scenario } from "@floorcast/sampler";
import { HOSTILE_PROGRAM } from "./helpers/hostile-evaluator.js";

// Hostile external evaluators: every extra, missing, duplicate, out-of-order or garbage answer fails the run
// naming the sample, and no row ever pairs one design with another design's answer.
const dir = mkdtempSync(join(tmpdir(), "floorcast-protocol-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const scenarioPath = fileURLToPath(new URL("../../datasets/scenarios/larkspur-terraces.json", import.meta.url));
const node = JSON.stringify(process.execPath);

const program = join(dir, "hostile.mjs");
writeFileSync(program, HOSTILE_PROGRAM);
let scenario: Scenario;
beforeAll(async () => {
  scenario = await loadScenario(scenarioPath);
});
const N = 40;
let k = 0;

/** Every data row of a dataset CSV pairs its own design with its own answer (area = frontage × depth, derived). */
function aligned(file: string): number {
  const [head, ...rows] = readFileSync(file, "utf8").trimEnd().split("\n");
  const cols = head!.split(",");
  const [f, d, a] = ["frontage", "depth", "area"].map((c) => cols.indexOf(c));
  for (const r of rows) {
    const v = r.split(",").map(Number);
    expect(v[a!]).toBe(v[f!]! * v[d!]!);
  }
  return rows.length;
}

async function run(mode: string, at: number, protocol: "ids" | "ordered" = "ids") {
  const out = join(dir, `r${k++}.csv`);
  const evaluator = commandEvaluator(`${node} ${JSON.stringify(program)} ${mode} ${at}`, { protocol, timeoutMs: 60_000 });
  try {
    const result = await writeDataset(scenario, { out, n: N, design: "lhs", seed: 5, evaluator }).then(
      () => null,
      (e: unknown) => e,
    );
    return { out, error: result };
  } finally {
    await evaluator.close();
  }
}

describe("the id protocol", () => {
  it("a program that echoes the ids writes every row aligned", async () => {
    const r = await run("ok", -1);
    expect(r.error).toBeNull();
    expect(aligned(r.out)).toBe(N);
  });
  const faults: [string, number, RegExp, number][] = [
    ["extra", 6, /an answer for sample 6, which was not asked for or was already answered, came while sample 7 was expected/, 7],
    ["dup", 20, /an answer for sample 20, which was not asked for or was already answered, came while sample 21 was expected/, 21],
    ["skip", 6, /the answer for sample 7 came before the answer for sample 6 .*sample 6 is missing or late/, 6],
    ["swap", -1, /the answer for sample 1 came before the answer for sample 0/, 0],
    ["garbage", 9, /answer 10 \(for sample 9\) is not JSON: "oops"/, 9],
    ["noid", -1, /answer 1 has no "sample" id; sample 0 was expected/, 0],
    ["extra", N - 1, /wrote an answer nobody asked for .*sample 39/, 39],
  ];
  for (const [mode, at, message, sample] of faults) {
    it(`${mode}${at >= 0 ? ` at ${at}` : ""}: fails naming sample ${sample}; no final file; every kept row aligned`, async () => {
      const r = await run(mode, at);
      expect(r.error).toBeInstanceOf(EvaluatorProtocolError);
      expect((r.error as Error).message).toMatch(message);
      expect((r.error as EvaluatorProtocolError).sample).toBe(sample);
      expect(existsSync(r.out)).toBe(false);
      if (existsSync(`${r.out}.partial`)) expect(aligned(`${r.out}.partial`)).toBeLessThanOrEqual(sample + 1);
    });
  }
});

describe("closing", () => {
  it("close leaves no timer behind once the program has exited, so a finished run does not linger for the grace period", () => {
    // In a fresh Node process (no test-runner timers): answer one sample, close, list the active handles. Before
    // the fix the grace-period timer (5 s) stayed armed after the program exited and held the CLI open.
    const script = `
      import { commandEvaluator } from "@floorcast/sampler";
      const e = commandEvaluator(${JSON.stringify(`${node} ${JSON.stringify(program)} ok -1`)});
      await e.evaluate([{ frontage: 2, depth: 3 }], { samples: [0] });
      await e.finish();
      await e.close();
      console.log(JSON.stringify(process.getActiveResourcesInfo()));`;
    const out = execFileSync(process.execPath, ["--input-type=module", "-e", script], { cwd: fileURLToPath(new URL("../../", import.meta.url)), encoding: "utf8" });
    expect(JSON.parse(out) as string[]).not.toContain("Timeout");
  });
});

describe("the in-order compatibility protocol", () => {
  it("a program answering in order without ids works", async () => {
    const r = await run("ordered-ok", -1, "ordered");
    expect(r.error).toBeNull();
    expect(aligned(r.out)).toBe(N);
  });
  it("one extra answer is found when the program closes: the run fails and keeps no row for --resume", async () => {
    const r = await run("ordered-extra", 6, "ordered");
    expect(r.error).toBeInstanceOf(EvaluatorProtocolError);
    expect((r.error as Error).message).toMatch(/wrote 41 answer lines for 40 samples|answer nobody asked for/);
    expect((r.error as EvaluatorProtocolError).misaligned).toBe(true);
    expect(existsSync(r.out)).toBe(false);
    expect(existsSync(`${r.out}.partial`)).toBe(false);
  });
});

describe("--resume checks the kept rows' ids", () => {
  it("a partial file whose sample ids skip or repeat is refused, naming the line", async () => {
    const out = join(dir, "resume.csv");
    const evaluator = commandEvaluator(`${node} ${JSON.stringify(program)} ok -1`);
    try {
      await writeDataset(scenario, { out, n: N, design: "lhs", seed: 5, evaluator });
    } finally {
      await evaluator.close();
    }
    const rows = readFileSync(out, "utf8").split("\n");
    const settings = JSON.parse(readFileSync(out.replace(/\.csv$/, ".manifest.json"), "utf8"));
    // rebuild the interrupted state: the settings file and the first 10 rows with row 5 (sample 4) dropped
    const { kind: _k, formatVersion: _f, caution: _c, columns: _cols, inputSchema: _is, rows: _r, csv: _csv, ...saved } = settings;
    rmSync(out);
    rmSync(out.replace(/\.csv$/, ".manifest.json"));
    writeFileSync(`${out}.partial.json`, `${JSON.stringify(saved, null, 2)}\n`);
    writeFileSync(`${out}.partial`, [...rows.slice(0, 5), ...rows.slice(6, 11)].join("\n") + "\n");
    const again = commandEvaluator(`${node} ${JSON.stringify(program)} ok -1`);
    try {
      await expect(writeDataset(scenario, { out, n: N, design: "lhs", seed: 5, evaluator: again, resume: true })).rejects.toThrow(
        /line 6: the sample ids are not consecutive/,
      );
    } finally {
      await again.close();
    }
  });
});

describe("output names", () => {
  it("an output named __proto__ is refused, not dropped", async () => {
    const out = join(dir, "proto.csv");
    const evaluator = (x: Record<string, unknown>) => JSON.parse(`{"__proto__": ${Number(x["frontage"])}, "y": 1}`) as Record<string, number>;
    await expect(writeDataset(scenario, { out, n: 4, design: "lhs", seed: 5, evaluator })).rejects.toThrow(/output name "__proto__" is not allowed/);
  });
});
