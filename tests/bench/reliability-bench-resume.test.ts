import { afterAll, describe, expect, it } from "vitest";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { spawnUntil } from "./reliability-cli-run.js";

// tests/bench/cli-bench.test.ts re-runs a finished bench and checks it reuses the results; this one kills a run
// with SIGKILL between its problems, the way a power cut or an out-of-memory kill would stop it.
const dir = mkdtempSync(join(tmpdir(), "floorcast-rel-bench-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const problems = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));

describe("floorcast bench killed with SIGKILL after its first problem", () => {
  it("resumes from the finished problem and measures only the other one", async () => {
    const suite = join(dir, "suite");
    mkdirSync(suite);
    for (const name of ["standard-forrester", "standard-branin"]) {
      const p = JSON.parse(readFileSync(join(problems, `${name}.json`), "utf8"));
      p.exact = { gridPoints: 41, refineEvaluations: 20 }; // small budgets: the test is about resuming, not accuracy
      writeFileSync(join(suite, `${name}.json`), JSON.stringify(p));
    }
    const out = join(dir, "out");
    const args = ["bench", "--suite", "standard", "--problems", suite, "--quick", "--seeds", "1", "--no-peers", "--out", out];
    const finished = () => (existsSync(join(out, "problems")) ? readdirSync(join(out, "problems")).filter((f) => f.endsWith(".json")) : []);
    const killed = await spawnUntil(args, () => finished().length >= 1);
    expect(killed.signal).toBe("SIGKILL");
    const done = finished();
    expect(done).toHaveLength(1); // killed between the problems: one finished file, written atomically
    expect(existsSync(join(out, "report.json"))).toBe(false);
    const saved = JSON.parse(readFileSync(join(out, "problems", done[0]!), "utf8"));
    const resumed = await spawnUntil(args, () => false);
    expect(resumed.code, resumed.err).toBe(0);
    expect(resumed.err).not.toMatch(/^\s{4}at /m);
    const name = done[0]!.replace(/\.json$/, "");
    expect(resumed.err).toMatch(new RegExp(`${name}: already finished, reusing its results`));
    expect(resumed.err.match(/already finished/g)).toHaveLength(1);
    const report = JSON.parse(readFileSync(join(out, "report.json"), "utf8"));
    expect(report.problems.map((p: { name: string }) => p.name).sort()).toEqual(["standard-branin", "standard-forrester"]);
    expect(report.problems.find((p: { name: string }) => p.name === name)).toEqual(saved.report);
  }, 120_000);
});
