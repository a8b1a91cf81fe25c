import { afterAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { mergeShards, shardFromEnvironment, shardRange } from "@floorcast/sampler";

// Variables: Slurm documentation, "Job Array Support" (SLURM_ARRAY_TASK_ID, SLURM_ARRAY_TASK_MIN,
// SLURM_ARRAY_TASK_STEP, SLURM_ARRAY_TASK_COUNT); Kubernetes documentation, "Jobs", completion mode Indexed
// (JOB_COMPLETION_INDEX, 0-based, from 0 to completions − 1).

describe("shardFromEnvironment", () => {
  it("reads a Slurm array task: (ID − MIN)/STEP + 1 of COUNT", () => {
    expect(shardFromEnvironment({ SLURM_ARRAY_TASK_ID: "2", SLURM_ARRAY_TASK_MIN: "1", SLURM_ARRAY_TASK_COUNT: "3" })?.shard).toEqual({ index: 2, count: 3 });
    expect(shardFromEnvironment({ SLURM_ARRAY_TASK_ID: "0", SLURM_ARRAY_TASK_MIN: "0", SLURM_ARRAY_TASK_COUNT: "4" })?.shard).toEqual({ index: 1, count: 4 });
    // --array=10-16:3 runs tasks 10, 13, 16
    const env = { SLURM_ARRAY_TASK_ID: "16", SLURM_ARRAY_TASK_MIN: "10", SLURM_ARRAY_TASK_STEP: "3", SLURM_ARRAY_TASK_COUNT: "3" };
    expect(shardFromEnvironment(env)).toEqual({ shard: { index: 3, count: 3 }, source: "SLURM_ARRAY_TASK_ID=16, SLURM_ARRAY_TASK_MIN=10, SLURM_ARRAY_TASK_STEP=3, SLURM_ARRAY_TASK_COUNT=3" });
  });
  it("reads a Kubernetes Indexed Job: JOB_COMPLETION_INDEX + 1 of the given count", () => {
    expect(shardFromEnvironment({ JOB_COMPLETION_INDEX: "0" }, 5)?.shard).toEqual({ index: 1, count: 5 });
    expect(shardFromEnvironment({ JOB_COMPLETION_INDEX: "4" }, 5)?.shard).toEqual({ index: 5, count: 5 });
  });
  it("is undefined without either scheduler's variables", () => {
    expect(shardFromEnvironment({ PATH: "/bin", SLURM_JOB_ID: "7" })).toBeUndefined();
    expect(shardFromEnvironment({}, 3)).toBeUndefined();
  });
  it("refuses what cannot be a shard, naming the variable", () => {
    expect(() => shardFromEnvironment({ SLURM_ARRAY_TASK_ID: "2" })).toThrow(/SLURM_ARRAY_TASK_COUNT must be a whole number ≥ 1, got nothing/);
    expect(() => shardFromEnvironment({ SLURM_ARRAY_TASK_ID: "x", SLURM_ARRAY_TASK_COUNT: "3" })).toThrow(/SLURM_ARRAY_TASK_ID/);
    // --array=1,5,9 (a list): task 9 is not the 3rd of an evenly spaced array from 1 by 1
    expect(() => shardFromEnvironment({ SLURM_ARRAY_TASK_ID: "9", SLURM_ARRAY_TASK_MIN: "1", SLURM_ARRAY_TASK_COUNT: "3" })).toThrow(/--array=1-3/);
    expect(() => shardFromEnvironment({ SLURM_ARRAY_TASK_ID: "2", SLURM_ARRAY_TASK_MIN: "1", SLURM_ARRAY_TASK_COUNT: "3" }, 4)).toThrow(/differs/);
    expect(() => shardFromEnvironment({ JOB_COMPLETION_INDEX: "2" })).toThrow(/no shard count/);
    expect(() => shardFromEnvironment({ JOB_COMPLETION_INDEX: "5" }, 5)).toThrow(/below the shard count 5/);
    expect(() => shardFromEnvironment({ JOB_COMPLETION_INDEX: "-1" }, 5)).toThrow(RangeError);
    expect(() => shardFromEnvironment({}, 0)).toThrow(/count must be an integer ≥ 1/);
  });
});

const dir = mkdtempSync(join(tmpdir(), "floorcast-shard-env-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const cli = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));
const scenario = fileURLToPath(new URL("../../datasets/scenarios/ferrow-corner.json", import.meta.url));
const sample = (out: string, env: Record<string, string>, extra: string[] = []) =>
  spawnSync(process.execPath, [cli, "sample", "--scenario", scenario, "--n", "50", "--seed", "3", "--design", "lhs", ...extra, "--out", join(dir, out)], {
    env: { PATH: process.env.PATH ?? "", ...env },
    encoding: "utf8",
    timeout: 120_000,
  });

describe("floorcast sample on a scheduler's array", () => {
  it("Indexed Job shards (JOB_COMPLETION_INDEX, --shard-count) merge into the unsharded file; merge refuses an incomplete shard", async () => {
    for (const k of [0, 1, 2]) {
      const r = sample(`k-${k}.csv`, { JOB_COMPLETION_INDEX: String(k) }, ["--shard-count", "3"]);
      expect(r.status, r.stderr).toBe(0);
      expect(r.stderr).toBe(`sample: shard ${k + 1}/3 from JOB_COMPLETION_INDEX=${k}, shard count 3\n`);
    }
    expect(sample("whole.csv", {}).status).toBe(0);
    await mergeShards([2, 0, 1].map((k) => join(dir, `k-${k}.csv`)), join(dir, "merged.csv"));
    expect(readFileSync(join(dir, "merged.csv")).equals(readFileSync(join(dir, "whole.csv")))).toBe(true);
    // --shard wins over the environment
    const given = sample("given.csv", { SLURM_ARRAY_TASK_ID: "1", SLURM_ARRAY_TASK_COUNT: "3" }, ["--shard", "2/3"]);
    expect(given.stderr).toBe("");
    expect(readFileSync(join(dir, "given.csv")).equals(readFileSync(join(dir, "k-1.csv")))).toBe(true);
    // a manifest that claims fewer rows than its slice (a shard cut short, then re-sealed) is refused
    const manifest = join(dir, "k-1.manifest.json");
    const m = JSON.parse(readFileSync(manifest, "utf8"));
    const { start, end } = shardRange(50, { index: 2, count: 3 });
    expect(m.shard).toMatchObject({ start, end });
    writeFileSync(manifest, JSON.stringify({ ...m, rows: m.rows - 1 }));
    await expect(mergeShards([0, 1, 2].map((k) => join(dir, `k-${k}.csv`)), join(dir, "m2.csv"))).rejects.toThrow(/k-1\.csv is incomplete/);
  }, 180_000);
  it("a user's mistake is one line on stderr, exit 2", () => {
    const cases: [Record<string, string>, string[], RegExp][] = [
      [{ JOB_COMPLETION_INDEX: "1" }, [], /JOB_COMPLETION_INDEX is set but no shard count/],
      [{}, ["--shard-count", "3"], /--shard-count needs JOB_COMPLETION_INDEX/],
      [{ JOB_COMPLETION_INDEX: "3" }, ["--shard-count", "3"], /below the shard count 3/],
      [{ SLURM_ARRAY_TASK_ID: "4", SLURM_ARRAY_TASK_MIN: "1", SLURM_ARRAY_TASK_COUNT: "3" }, [], /--array=1-3/],
      [{ SLURM_ARRAY_TASK_ID: "1", SLURM_ARRAY_TASK_MIN: "1", SLURM_ARRAY_TASK_COUNT: "60" }, [], /shard.count must be an integer in \[1, n = 50\]/],
    ];
    for (const [env, extra, message] of cases) {
      const r = sample("bad.csv", env, extra);
      expect(r.status, r.stderr).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
    }
  }, 120_000);
});
