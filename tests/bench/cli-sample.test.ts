import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, truncateSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { runCli } from "./run-cli.js";
import { FLOORCAST_CAUTION } from "@floorcast/bench";

const scenario = fileURLToPath(new URL("../../datasets/scenarios/larkspur-terraces.json", import.meta.url));
const dir = mkdtempSync(join(tmpdir(), "floorcast-cli-sample-"));
const home = process.cwd();
beforeAll(() => process.chdir(dir)); // relative paths in the commands below are inside dir
afterAll(() => {
  process.chdir(home);
  rmSync(dir, { recursive: true, force: true });
});

/** Runs the CLI in-process (main, as bin/floorcast.js does) with captured streams. */
async function floorcast(...args: string[]): Promise<{ status: number; stdout: string; stderr: string }> {
  const r = await runCli(args);
  return { status: r.code, stdout: r.out, stderr: r.err };
}
const base = ["sample", "--scenario", scenario, "--n", "40", "--seed", "5", "--design", "lhs"];
const same = (a: string, b: string) => readFileSync(join(dir, a)).equals(readFileSync(join(dir, b)));

describe("floorcast sample", async () => {
  it("writes the CSV and its manifest, says what it wrote and carries the caution", async () => {
    const r = await floorcast(...base, "--out", "a.csv");
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/wrote a\.csv: 40 rows \(samples 0–39 of 40, shard 1\/1\), sha256 [0-9a-f]{64}/);
    expect(r.stdout.trimEnd().split("\n").at(-1)).toBe(FLOORCAST_CAUTION); // the CLI's one caution constant
    expect(r.stderr).toBe(""); // no progress bar when stderr is not a terminal
    const m = JSON.parse(readFileSync(join(dir, "a.manifest.json"), "utf8"));
    expect(m).toMatchObject({ design: "lhs", seed: 5, n: 40, rows: 40 });
  });
  it("without --design, uses the default for the size, says so in one stderr line and records it in the manifest", async () => {
    const base0 = ["sample", "--scenario", scenario, "--seed", "5"];
    for (const [n, design] of [["30", "lhs-maximin-cd"], ["1025", "sobol"]] as const) {
      const r = await floorcast(...base0, "--n", n, "--out", `default-${n}.csv`);
      expect(r.status).toBe(0);
      const lines = r.stderr.trim().split("\n");
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(new RegExp(`^sample: design ${design} \\(O\\(n`));
      expect(JSON.parse(readFileSync(join(dir, `default-${n}.manifest.json`), "utf8"))).toMatchObject({ design, n: Number(n) });
    }
    const given = await floorcast(...base0, "--n", "1025", "--design", "sobol", "--out", "given.csv");
    expect(given.stderr).toBe(""); // a chosen design is not announced
    expect(same("given.csv", "default-1025.csv")).toBe(true);
  });
  it("refuses to overwrite without --force (exit 2, one line, no stack); --force gives the identical file", async () => {
    const r = await floorcast(...base, "--out", "a.csv");
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toMatch(/a\.csv already exists; use --force/);
    writeFileSync(join(dir, "copy.csv"), readFileSync(join(dir, "a.csv")));
    expect((await floorcast(...base, "--out", "a.csv", "--force")).status).toBe(0);
    expect(same("a.csv", "copy.csv")).toBe(true);
  });
  it("--shard k/N writes slices that floorcast merge joins into the unsharded file", async () => {
    expect((await floorcast(...base, "--shard", "2/2", "--out", "s2.csv")).status).toBe(0);
    const r1 = await floorcast(...base, "--shard", "1/2", "--out", "s1.csv");
    expect(r1.stdout).toMatch(/20 rows \(samples 0–19 of 40, shard 1\/2\)/);
    const m = await floorcast("merge", "s2.csv", "s1.csv", "--out", "merged.csv");
    expect(m.status).toBe(0);
    expect(m.stdout).toMatch(/merged 2 shards into merged\.csv: 40 rows/);
    expect(m.stdout.trimEnd().split("\n").at(-1)).toBe(FLOORCAST_CAUTION);
    expect(same("merged.csv", "a.csv")).toBe(true);
    const missing = await floorcast("merge", "s1.csv", "--out", "m2.csv");
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/shard 2 of 2 missing/);
  });
  it("--evaluator-command samples an external program; --resume continues after a crash and a torn line", async () => {
    const model = join(dir, "model.mjs");
    writeFileSync(
      model,
      `import { createInterface } from "node:readline";
import { existsSync } from "node:fs";
let k = 0;
for await (const line of createInterface({ input: process.stdin })) {
  if (++k === 25 && existsSync(${JSON.stringify(join(dir, "crash"))})) process.exit(9);
  const x = JSON.parse(line);
  process.stdout.write(JSON.stringify({ sample: x.sample, area: x.frontage * x.depth }) + "\\n");
}`,
    );
    const cmd = `${JSON.stringify(process.execPath)} ${JSON.stringify(model)}`;
    const ok = await floorcast(...base, "--evaluator-command", cmd, "--out", "ext.csv");
    expect(ok.status).toBe(0);
    expect(readFileSync(join(dir, "ext.csv"), "utf8").split("\n")[0]).toMatch(/,area$/);
    writeFileSync(join(dir, "crash"), "");
    const died = await floorcast(...base, "--evaluator-command", cmd, "--out", "ext2.csv");
    expect(died.status).toBe(1);
    expect(died.stderr).toMatch(/exited \(status 9\)/);
    expect(existsSync(join(dir, "ext2.csv"))).toBe(false);
    const partial = join(dir, "ext2.csv.partial");
    truncateSync(partial, statSync(partial).size - 5);
    rmSync(join(dir, "crash"));
    // resuming with two copies of the program gives the same rows: the process count is not part of the result
    const resumed = await floorcast(...base, "--evaluator-command", cmd, "--processes", "2", "--resume", "--out", "ext2.csv");
    expect(resumed.status).toBe(0);
    expect(same("ext2.csv", "ext.csv")).toBe(true);
  });
  it("user mistakes exit 2 with one line naming the problem", async () => {
    const cases: [string[], RegExp][] = [
      [["sample", "--scenario", scenario, "--n", "x", "--seed", "1", "--out", "b.csv"], /--n must be a whole number ≥ 1, got "x"/],
      [["sample", "--scenario", scenario, "--n", "10", "--seed", "-1", "--out", "b.csv"], /--seed must be a whole number ≥ 0/],
      [["sample", "--scenario", scenario, "--n", "10", "--seed", "1", "--design", "grid", "--out", "b.csv"], /--design must be one of random, lhs/],
      [["sample", "--scenario", scenario, "--n", "10", "--seed", "1", "--shard", "3/2", "--out", "b.csv"], /shard must look like k\/N/],
      [["sample", "--scenario", "nope.json", "--n", "10", "--seed", "1", "--out", "b.csv"], /cannot read nope\.json/],
      [["sample", "--scenario", scenario, "--n", "1", "--seed", "1", "--shard", "1/2", "--out", "b.csv"], /shard\.count must be an integer in \[1, n = 1\]/],
      [["merge", "nope.csv", "--out", "c.csv"], /cannot read the manifest nope\.manifest\.json/],
      [["sample", "--scenario", scenario, "--n", "10", "--seed", "1", "--processes", "2", "--out", "b.csv"], /--processes needs --evaluator-command/],
    ];
    writeFileSync(join(dir, "bad.json"), JSON.stringify({ kind: "floorcast.scenario", formatVersion: 1 }));
    cases.push([["sample", "--scenario", "bad.json", "--n", "10", "--seed", "1", "--out", "b.csv"], /loadScenario: bad\.json: name: /]);
    for (const [args, message] of cases) {
      const r = await floorcast(...args);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trim().split("\n"), args.join(" ")).toHaveLength(1);
    }
    expect(existsSync(join(dir, "b.csv"))).toBe(false);
  });
});
