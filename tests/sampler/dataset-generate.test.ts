import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { fileURLToPath } from "node:url";
import {
  createDesign,
  evaluateMassing,
  generateDataset,
  loadScenario,
  mapUnitToSpace,
  massingOutputs,
  MASSING_OUTPUT_COLUMNS,
  parseShard,
  scenarioToMassingInput,
  shardRange,
  type DatasetRow,
} from "@floorcast/sampler";

const scenarioPath = fileURLToPath(new URL("../../datasets/scenarios/larkspur-terraces.json", import.meta.url));
async function collect(it: AsyncIterable<DatasetRow>): Promise<DatasetRow[]> {
  const rows: DatasetRow[] = [];
  for await (const r of it) rows.push(r);
  return rows;
}

describe("generateDataset", () => {
  it("yields sample, every parameter (as mapUnitToSpace maps the design) and every MassingResult scalar", async () => {
    const s = await loadScenario(scenarioPath);
    const rows = await collect(generateDataset(s, { n: 40, design: "lhs", seed: 5 }));
    const records = mapUnitToSpace({ parameters: s.parameters }, createDesign({ n: 40, dims: s.parameters.length, design: "lhs", seed: 5 }));
    expect(rows).toHaveLength(40);
    expect(Object.keys(rows[0]!)).toEqual(["sample", ...s.parameters.map((p) => p.name), ...MASSING_OUTPUT_COLUMNS]);
    rows.forEach((row, i) => {
      expect(row.sample).toBe(i);
      const expected = massingOutputs(evaluateMassing(scenarioToMassingInput(s, records[i]!)));
      expect(row).toEqual({ sample: i, ...records[i], ...expected });
      expect(typeof row.limitedBy).toBe("string");
      expect([0, 1]).toContain(row.coverageCapped);
    });
  });
  it("a shard is the same slice of the same design; skip drops the first rows of the slice", async () => {
    const s = await loadScenario(scenarioPath);
    const all = await collect(generateDataset(s, { n: 30, design: "lhs-maximin", seed: 2 }));
    const second = await collect(generateDataset(s, { n: 30, design: "lhs-maximin", seed: 2, shard: { index: 2, count: 3 } }));
    expect(second).toEqual(all.slice(10, 20));
    const skipped = await collect(generateDataset(s, { n: 30, design: "lhs-maximin", seed: 2, shard: { index: 2, count: 3 }, skip: 4 }));
    expect(skipped).toEqual(all.slice(14, 20));
  });
  it("takes any function evaluator, sync or async, and keeps design order under concurrency", async () => {
    const s = await loadScenario(scenarioPath);
    const sync = await collect(generateDataset(s, { n: 12, design: "random", seed: 1, evaluator: (x) => ({ area: (x.frontage as number) * (x.depth as number) }) }));
    expect(sync.map((r) => r.area)).toEqual(sync.map((r) => (r.frontage as number) * (r.depth as number)));
    let inFlight = 0;
    let most = 0;
    const slow = {
      name: "slow",
      concurrency: 6,
      // the one Evaluator contract: a batch in, one answer per input out (the generator sends batches of one)
      evaluate: (batch: readonly Record<string, unknown>[]) =>
        Promise.all(
          batch.map(async (x) => {
            inFlight++;
            most = Math.max(most, inFlight);
            // later samples answer sooner, so order is only kept if the generator restores it
            await new Promise((r) => setTimeout(r, 20 - ((x.frontage as number) % 10)));
            inFlight--;
            return { f: x.frontage as number };
          }),
        ),
      close: async () => {},
    };
    const rows = await collect(generateDataset(s, { n: 24, design: "random", seed: 1, evaluator: slow }));
    expect(rows.map((r) => r.sample)).toEqual(Array.from({ length: 24 }, (_, i) => i));
    expect(rows.map((r) => r.f)).toEqual(rows.map((r) => r.frontage));
    expect(most).toBe(6);
  });
  it("passes the fixed values to the evaluator with the sampled ones", async () => {
    const s = await loadScenario(scenarioPath);
    const seen: Record<string, unknown>[] = [];
    await collect(generateDataset(s, { n: 2, design: "random", seed: 1, evaluator: (x) => (seen.push({ ...x }), { ok: 1 }) }));
    expect(seen[0]).toMatchObject({ maxCoverage: 0.5, minPlateWidth: 3.5, minPlateArea: 30 });
  });
  it("refuses bad evaluator answers, naming the sample", async () => {
    const s = await loadScenario(scenarioPath);
    const run = (evaluator: (x: Record<string, unknown>) => unknown) =>
      collect(generateDataset(s, { n: 5, design: "random", seed: 1, evaluator: evaluator as never }));
    await expect(run(() => 3)).rejects.toThrow(/sample 0: the evaluator must return an object/);
    await expect(run(() => ({}))).rejects.toThrow(/sample 0: the evaluator returned no outputs/);
    await expect(run(() => ({ y: NaN }))).rejects.toThrow(/sample 0: output y must be a finite number/);
    await expect(run(() => ({ depth: 1 }))).rejects.toThrow(/output "depth" clashes with an input column/);
    let k = 0;
    await expect(run(() => (k++ === 2 ? { z: 1 } : { y: 1 }))).rejects.toThrow(/sample 2: outputs \["z"\] differ/);
    await expect(run(() => Promise.reject(new Error("model crashed")))).rejects.toThrow(/model crashed/);
  });
  it("refuses bad options", async () => {
    const s = await loadScenario(scenarioPath);
    await expect(collect(generateDataset(s, { n: 0, design: "random", seed: 1 }))).rejects.toThrow(RangeError);
    await expect(collect(generateDataset(s, { n: 5, design: "grid" as never, seed: 1 }))).rejects.toThrow(/design must be one of/);
    await expect(collect(generateDataset(s, { n: 5, design: "random", seed: 1, shard: { index: 3, count: 2 } }))).rejects.toThrow(
      /shard\.index/,
    );
    await expect(collect(generateDataset(s, { n: 5, design: "random", seed: 1, skip: 6 }))).rejects.toThrow(/skip/);
    await expect(collect(generateDataset(null as never, { n: 5, design: "random", seed: 1 }))).rejects.toThrow(TypeError);
  });
});

describe("shards", () => {
  it("parseShard reads k/N and refuses anything else", () => {
    expect(parseShard("2/8")).toEqual({ index: 2, count: 8 });
    expect(parseShard(" 1 / 1 ")).toEqual({ index: 1, count: 1 });
    for (const bad of ["0/3", "4/3", "1/0", "a/b", "1", "-1/2", "1.5/3", ""]) expect(() => parseShard(bad)).toThrow(RangeError);
  });
  it("shardRange: the N slices cover 0…n−1 once, in order, sizes within one (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5000 }), fc.integer({ min: 1, max: 64 }), (n, c) => {
        fc.pre(c <= n);
        let next = 0;
        const sizes: number[] = [];
        for (let k = 1; k <= c; k++) {
          const { start, end } = shardRange(n, { index: k, count: c });
          expect(start).toBe(next);
          sizes.push(end - start);
          next = end;
        }
        expect(next).toBe(n);
        expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      }),
      { seed: 7 },
    );
    expect(() => shardRange(3, { index: 1, count: 4 })).toThrow(/shard\.count/);
    expect(() => shardRange(NaN)).toThrow(RangeError);
    expect(shardRange(10)).toEqual({ start: 0, end: 10 });
  });
});
