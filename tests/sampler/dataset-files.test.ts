import { beforeAll, afterAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, truncateSync, writeFileSync, copyFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import {
  FLOORCAST_CAUTION,
  loadScenario,
  manifestPathFor,
  mergeShards,
  readManifest,
  readTable,
  recoverPartial,
  writeDataset,
  type Scenario,
} from "@floorcast/sampler";

const scenarioPath = fileURLToPath(new URL("../../datasets/scenarios/ferrow-corner.json", import.meta.url));
const root = mkdtempSync(join(tmpdir(), "floorcast-ds-"));
afterAll(() => rmSync(root, { recursive: true, force: true }));
let scenario: Scenario;
let k = 0;
const fresh = (): string => {
  const d = join(root, `d${k++}`);
  mkdirSync(d);
  return d;
};
// "lhs" keeps these tests fast; lhs-maximin (a global design) is checked for shards below and in dataset-generate.
const run = { n: 45, design: "lhs", seed: 11 } as const;
let reference: string; // an uninterrupted, unsharded run
beforeAll(async () => {
  scenario = await loadScenario(scenarioPath);
  reference = join(fresh(), "all.csv");
  await writeDataset(scenario, { out: reference, ...run });
});
const bytes = (p: string) => readFileSync(p);
const sha = (p: string) => createHash("sha256").update(readFileSync(p)).digest("hex");

describe("writeDataset", () => {
  it("the same seed gives byte-identical CSV and manifest; another seed does not", async () => {
    const again = join(fresh(), "all.csv");
    await writeDataset(scenario, { out: again, ...run });
    expect(bytes(again).equals(bytes(reference))).toBe(true);
    expect(bytes(manifestPathFor(again)).equals(bytes(manifestPathFor(reference)))).toBe(true);
    const other = join(fresh(), "all.csv");
    await writeDataset(scenario, { out: other, ...run, seed: 12 });
    expect(bytes(other).equals(bytes(reference))).toBe(false);
  });
  it("the manifest records scenario, design, seed, n, shard, version and the CSV's SHA-256", async () => {
    const m = await readManifest(reference);
    expect(m).toMatchObject({
      kind: "floorcast.dataset-manifest",
      formatVersion: 1,
      scenario: { name: "ferrow-corner", file: "ferrow-corner.json", sha256: scenario.sha256 },
      design: "lhs",
      seed: 11,
      n: 45,
      shard: { index: 1, count: 1, start: 0, end: 45 },
      evaluator: "massing-rule-v1",
      packageVersion: "0.1.0",
      rows: 45,
      csv: { file: "all.csv", bytes: statSync(reference).size, sha256: sha(reference) },
    });
    expect(m.caution).toBe(FLOORCAST_CAUTION);
    const t = await readTable(reference, { categorical: ["limitedBy"] });
    expect(t.rows).toHaveLength(45);
    expect(t.header).toEqual(m.columns);
  });
  it("never overwrites an existing file without force, and leaves no temporary files behind", async () => {
    const d = fresh();
    const out = join(d, "x.csv");
    writeFileSync(out, "precious\n");
    await expect(writeDataset(scenario, { out, ...run })).rejects.toThrow(/x\.csv already exists; use --force/);
    expect(readFileSync(out, "utf8")).toBe("precious\n");
    await writeDataset(scenario, { out, ...run, force: true });
    expect(bytes(out).equals(bytes(reference))).toBe(true);
    expect(existsSync(`${out}.partial`)).toBe(false);
    expect(existsSync(`${out}.partial.json`)).toBe(false);
  });
  it("an output folder that does not exist is a RangeError naming it", async () => {
    await expect(writeDataset(scenario, { out: join(root, "no", "such", "x.csv"), ...run })).rejects.toThrow(
      /cannot write .*x\.csv: the folder .* does not exist/,
    );
  });
  it("an interrupted run leaves only the temporary file; the output name appears when complete", async () => {
    const out = join(fresh(), "all.csv");
    let calls = 0;
    const crashAt = (at: number) => () => {
      if (++calls === at) throw new Error("power cut");
      return { v: 1 };
    };
    await expect(writeDataset(scenario, { out, ...run, evaluator: crashAt(20) })).rejects.toThrow(/power cut/);
    expect(existsSync(out)).toBe(false);
    expect(existsSync(`${out}.partial`)).toBe(true);
  });
});

/** Runs the reference settings but stops (an evaluator error) after `rows` rows, then tears `cut` bytes off. */
async function interrupted(rows: number, cut: number): Promise<string> {
  const out = join(fresh(), "all.csv");
  const { massingEvaluator } = await import("@floorcast/sampler");
  const exact = massingEvaluator(scenario);
  let calls = 0;
  const evaluator = {
    ...exact,
    evaluate: (batch: readonly Record<string, number | string | boolean>[]) => {
      calls += batch.length;
      if (calls > rows) throw new Error("killed");
      return exact.evaluate(batch);
    },
  };
  await expect(writeDataset(scenario, { out, ...run, evaluator })).rejects.toThrow(/killed/);
  const partial = `${out}.partial`;
  truncateSync(partial, cut < 0 ? -cut : statSync(partial).size - cut); // cut < 0: keep only −cut bytes
  return out;
}

describe("resume", () => {
  it("after a file truncated mid-line, resuming gives the uninterrupted file byte for byte", async () => {
    const out = await interrupted(20, 7);
    const before = readFileSync(`${out}.partial`, "utf8");
    expect(before.endsWith("\n")).toBe(false); // the last line is torn
    await writeDataset(scenario, { out, ...run, resume: true });
    expect(bytes(out).equals(bytes(reference))).toBe(true);
    expect(bytes(manifestPathFor(out)).equals(bytes(manifestPathFor(reference)))).toBe(true);
  });
  it("a cut exactly at a line end, a cut inside the header, and a finished-but-unrenamed file all resume", async () => {
    for (const [rows, cut] of [[30, 0], [1, -10], [45, 0]] as const) {
      const out = await (rows === 45 ? interruptedAfterAll() : interrupted(rows, cut));
      await writeDataset(scenario, { out, ...run, resume: true });
      expect(bytes(out).equals(bytes(reference))).toBe(true);
    }
  });
  it("recoverPartial drops only the torn line", async () => {
    const out = await interrupted(10, 3);
    const r = await recoverPartial(`${out}.partial`);
    expect(r).toMatchObject({ rows: 9, lastSample: 8 });
    expect(readFileSync(`${out}.partial`, "utf8").split("\n")).toHaveLength(11); // header + 9 rows + ""
  });
  it("refuses to resume a partial file of other settings", async () => {
    const out = await interrupted(10, 0);
    await expect(writeDataset(scenario, { out, ...run, seed: 99, resume: true })).rejects.toThrow(/started with other settings/);
    await expect(writeDataset(scenario, { out, ...run, shard: { index: 1, count: 3 }, resume: true })).rejects.toThrow(
      /started with other settings/,
    );
  });
  it("without --resume an old partial file is replaced by a fresh run", async () => {
    const out = await interrupted(10, 4);
    await writeDataset(scenario, { out, ...run });
    expect(bytes(out).equals(bytes(reference))).toBe(true);
  });
});

/** A run whose rows are all written but which died before the rename. */
async function interruptedAfterAll(): Promise<string> {
  const d = fresh();
  const out = join(d, "all.csv");
  const full = await interrupted(44, 0);
  copyFileSync(`${full}.partial.json`, `${out}.partial.json`);
  copyFileSync(reference, `${out}.partial`);
  return out;
}

describe("shards and merge", () => {
  async function shards(count: number, dir = fresh()): Promise<string[]> {
    const paths: string[] = [];
    for (let i = 1; i <= count; i++) {
      const p = join(dir, `part-${i}.csv`);
      await writeDataset(scenario, { out: p, ...run, shard: { index: i, count } });
      paths.push(p);
    }
    return paths;
  }
  it("shards 1…N merged (in any order) are byte-identical to the unsharded file, manifest too", async () => {
    const parts = await shards(4);
    const out = join(fresh(), "all.csv");
    await mergeShards([parts[2]!, parts[0]!, parts[3]!, parts[1]!], out);
    expect(bytes(out).equals(bytes(reference))).toBe(true);
    expect(bytes(manifestPathFor(out)).equals(bytes(manifestPathFor(reference)))).toBe(true);
    const m = await readManifest(parts[1]!);
    expect(m.shard).toEqual({ index: 2, count: 4, start: 11, end: 22 });
  });
  it("lhs-maximin: the design is computed whole, so its shards merge to the unsharded file too", async () => {
    const maximin = { n: 16, design: "lhs-maximin", seed: 3 } as const;
    const d = fresh();
    const whole = join(d, "whole.csv");
    await writeDataset(scenario, { out: whole, ...maximin });
    const parts = [1, 2].map((i) => join(d, `m-${i}.csv`));
    for (const [i, p] of parts.entries()) await writeDataset(scenario, { out: p, ...maximin, shard: { index: i + 1, count: 2 } });
    const out = join(d, "merged.csv");
    await mergeShards(parts, out);
    expect(bytes(out).equals(bytes(whole))).toBe(true);
  });
  it("checks the manifests: missing, repeated, foreign or altered shards are refused", async () => {
    const parts = await shards(3);
    const out = join(fresh(), "m.csv");
    await expect(mergeShards([parts[0]!, parts[2]!], out)).rejects.toThrow(/shard 2 of 3 missing/);
    await expect(mergeShards([parts[0]!, parts[1]!, parts[1]!], out)).rejects.toThrow(/shard 2\/3 is given twice/);
    const d = fresh();
    const foreign = join(d, "part-2.csv");
    await writeDataset(scenario, { out: foreign, ...run, seed: 12, shard: { index: 2, count: 3 } });
    await expect(mergeShards([parts[0]!, foreign, parts[2]!], out)).rejects.toThrow(/part-2\.csv has seed 12, part-1\.csv has 11/);
    const other = join(d, "part-3.csv");
    await writeDataset(scenario, { out: other, ...run, shard: { index: 3, count: 4 } });
    await expect(mergeShards([parts[0]!, parts[1]!, other], out)).rejects.toThrow(/is shard 3\/4, not of 3/);
    writeFileSync(parts[1]!, readFileSync(parts[1]!, "utf8").replace(/\n(\d+),/, "\n$1,9"));
    await expect(mergeShards(parts, out)).rejects.toThrow(/part-2\.csv does not match the SHA-256 in its manifest/);
    rmSync(manifestPathFor(parts[2]!));
    await expect(mergeShards(parts, out)).rejects.toThrow(/cannot read the manifest .*part-3\.manifest\.json/);
    expect(existsSync(out)).toBe(false);
  });
  it("never overwrites the merged file without force; bad arguments", async () => {
    const parts = await shards(2);
    const out = join(fresh(), "all.csv");
    writeFileSync(out, "keep\n");
    await expect(mergeShards(parts, out)).rejects.toThrow(/already exists/);
    await mergeShards(parts, out, { force: true });
    expect(bytes(out).equals(bytes(reference))).toBe(true);
    await expect(mergeShards([], out)).rejects.toThrow(/no shards given/);
    await expect(mergeShards("a.csv" as never, out)).rejects.toThrow(TypeError);
  });
  it("a manifest that breaks the schema is named with the field", async () => {
    const parts = await shards(2);
    const mp = manifestPathFor(parts[0]!);
    writeFileSync(mp, readFileSync(mp, "utf8").replace('"formatVersion": 1', '"formatVersion": 7'));
    await expect(mergeShards(parts, join(fresh(), "x.csv"))).rejects.toThrow(/part-1\.manifest\.json: formatVersion: /);
  });
});
