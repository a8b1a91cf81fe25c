import { afterAll, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { expectCleanOutcome } from "./reliability-cli-run.js";
import { runCli } from "./run-cli.js";
import { HOSTILE_PROGRAM } from "../sampler/helpers/hostile-evaluator.js";

// `floorcast sample --evaluator-command`: a program that breaks the protocol is an input that failed (exit 1),
// named by its sample, never a usage error and never a dataset.
const dir = mkdtempSync(join(tmpdir(), "floorcast-cli-protocol-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const scenario = fileURLToPath(new URL("../../datasets/scenarios/larkspur-terraces.json", import.meta.url));
const program = join(dir, "hostile.mjs");
writeFileSync(program, HOSTILE_PROGRAM);
const cmd = (mode: string, at = -1) => `${JSON.stringify(process.execPath)} ${JSON.stringify(program)} ${mode} ${at}`;
const base = ["sample", "--scenario", scenario, "--n", "20", "--seed", "1", "--design", "lhs"];

describe("floorcast sample: the evaluator protocol", () => {
  it("extra, missing, reordered and garbage answers exit 1 naming the sample, and write no dataset", async () => {
    const cases: [string, number, RegExp][] = [
      ["extra", 3, /sample 4 was expected/],
      ["skip", 3, /sample 3 is missing or late/],
      ["swap", -1, /the answer for sample 1 came before the answer for sample 0/],
      ["garbage", 2, /for sample 2\) is not JSON/],
    ];
    for (const [mode, at, message] of cases) {
      const out = join(dir, `${mode}.csv`);
      const r = await runCli([...base, "--evaluator-command", cmd(mode, at), "--out", out]);
      expectCleanOutcome(r, [1], mode);
      expect(r.err, mode).toMatch(message);
      expect(r.err.trim().split("\n"), mode).toHaveLength(1);
      expect(existsSync(out), mode).toBe(false);
    }
  });
  it("--evaluator-protocol ordered runs a program without ids, and refuses an extra answer at close", async () => {
    const ok = await runCli([...base, "--evaluator-command", cmd("ordered-ok"), "--evaluator-protocol", "ordered", "--out", join(dir, "o.csv")]);
    expect(ok.code, ok.err).toBe(0);
    const extra = await runCli([...base, "--evaluator-command", cmd("ordered-extra", 5), "--evaluator-protocol", "ordered", "--out", join(dir, "oe.csv")]);
    expectCleanOutcome(extra, [1], "ordered-extra");
    expect(extra.err).toMatch(/answer lines for 20 samples|answer nobody asked for/);
    expect(existsSync(join(dir, "oe.csv"))).toBe(false);
    expect(existsSync(join(dir, "oe.csv.partial"))).toBe(false);
    const bad = await runCli([...base, "--evaluator-command", cmd("ok"), "--evaluator-protocol", "fifo", "--out", join(dir, "b.csv")]);
    expectCleanOutcome(bad, [2], "bad protocol");
  });
  it("a non-finite output value is an input that failed (exit 1), not a usage error", async () => {
    const nan = join(dir, "nan.mjs");
    writeFileSync(nan, `import { createInterface } from "node:readline";
for await (const line of createInterface({ input: process.stdin })) process.stdout.write('{"sample":' + JSON.parse(line).sample + ',"area":"x","v":1e999}\\n');`);
    const r = await runCli([...base, "--evaluator-command", `${JSON.stringify(process.execPath)} ${JSON.stringify(nan)}`, "--out", join(dir, "nan.csv")]);
    expectCleanOutcome(r, [1], "non-finite");
    expect(r.err).toMatch(/sample 0: output v must be a finite number/);
  });
});
