import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawn } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { expectCleanOutcome } from "./reliability-cli-run.js";
import { runCli } from "./run-cli.js";
import { FLOORCAST_CAUTION } from "@floorcast/bench";
import { expectOnlyCaution } from "./helpers/only-caution.js";
import { HOSTILE_PROGRAM } from "../sampler/helpers/hostile-evaluator.js";

// The README's exit-status table, cell by cell: each case is one command run that must end with that status.
const root = fileURLToPath(new URL("../../", import.meta.url));
const BIN = join(root, "packages/bench/bin/floorcast.js");
const scenario = join(root, "datasets/scenarios/larkspur-terraces.json");
const branin = join(root, "datasets/problems/standard-branin.json");
const parcels = join(root, "datasets/parcels/");
const dir = mkdtempSync(join(tmpdir(), "floorcast-exit-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const p = (name: string) => join(dir, name);
let k = 0;
const fresh = (ext = "csv") => p(`o${k++}.${ext}`);
const MASSING_OK = JSON.stringify({ parcel: { vertices: [[0, 0], [10, 0], [10, 30], [0, 30]], lotLines: ["front", "side", "rear", "side"] }, setbacks: { front: 1, side: 1, rear: 1 }, floorHeight: 3, maxHeight: 9 });
// y = a + 2b (derived), 8 distinct rows.
const TRAIN = "a,b,y\n" + [[1, 2], [2, 3], [3, 1], [4, 4], [5, 2], [6, 1], [7, 3], [8, 5]].map(([a, b]) => `${a},${b},${a! + 2 * b!}`).join("\n") + "\n";

beforeAll(async () => {
  writeFileSync(p("train.csv"), TRAIN);
  writeFileSync(p("far.csv"), "a,b\n2,3\n1e160,3\n");
  writeFileSync(p("hostile.mjs"), HOSTILE_PROGRAM);
  writeFileSync(p("ok.jsonl"), `${MASSING_OK}\n`);
  writeFileSync(p("bad.jsonl"), `${MASSING_OK}\n{"parcel": 3}\n`);
  const problem = JSON.parse(readFileSync(join(root, "datasets/problems/larkspur-fit-gfa.json"), "utf8"));
  problem.scenario = scenario;
  problem.constraints = [{ output: "height", max: -1 }]; // no design can satisfy it
  writeFileSync(p("infeasible.json"), JSON.stringify(problem));
  expect((await runCli(["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", p("m.json")])).code).toBe(0);
  for (const s of [1, 2]) {
    const r = await runCli(["sample", "--scenario", scenario, "--n", "6", "--seed", "1", "--design", "lhs", "--shard", `${s}/2`, "--out", p(`s${s}.csv`)]);
    expect(r.code, r.err).toBe(0);
  }
  // one good 20 × 30 m lot and one with no controls (fc_error in place)
  const lot = { type: "Polygon", coordinates: [[[0, 0], [20, 0], [20, 30], [0, 30], [0, 0]]] };
  const lotLines = ["front", "side", "rear", "side"];
  writeFileSync(p("bad.geojson"), JSON.stringify({ type: "FeatureCollection", features: [
    { type: "Feature", properties: { setbacks: { front: 3, side: 1, rear: 4 }, floorHeight: 3, maxHeight: 9, lotLines }, geometry: lot },
    { type: "Feature", properties: { lotLines }, geometry: lot },
  ] }));
  mkdirSync(p("reports"));
  writeFileSync(p("reports/report.json"), "{}\n");
});

const hostile = (mode: string) => `${JSON.stringify(process.execPath)} ${JSON.stringify(p("hostile.mjs"))} ${mode} 2`;
const table: Record<string, Partial<Record<0 | 1 | 2, () => string[]>>> = {
  design: { 0: () => ["design", "--n", "4", "--dims", "2", "--seed", "1", "--out", fresh()], 2: () => ["design", "--n", "4", "--dims", "2", "--seed", "-3", "--out", fresh()] },
  sample: {
    0: () => ["sample", "--scenario", scenario, "--n", "4", "--seed", "1", "--design", "lhs", "--out", fresh()],
    1: () => ["sample", "--scenario", scenario, "--n", "8", "--seed", "1", "--design", "lhs", "--evaluator-command", hostile("skip"), "--out", fresh()],
    2: () => ["sample", "--scenario", scenario, "--n", "4", "--seed", "1", "--design", "nope", "--out", fresh()],
  },
  merge: { 0: () => ["merge", p("s1.csv"), p("s2.csv"), "--out", fresh()], 2: () => ["merge", p("s1.csv"), "--out", fresh()] },
  massing: { 0: () => ["massing", "--input", p("ok.jsonl")], 1: () => ["massing", "--input", p("bad.jsonl")], 2: () => ["massing", "--input", p("missing.jsonl")] },
  fit: {
    0: () => ["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", fresh("json")],
    2: () => ["fit", "--data", p("train.csv"), "--inputs", "a,c", "--target", "y", "--out", fresh("json")],
  },
  predict: {
    0: () => ["predict", "--model", p("m.json"), "--data", p("train.csv"), "--out", fresh()],
    1: () => ["predict", "--model", p("m.json"), "--data", p("far.csv"), "--out", fresh()],
    2: () => ["predict", "--model", p("m.json"), "--data", p("train.csv"), "--out", "/dev/full"],
  },
  assess: {
    0: () => ["assess", "--model", p("m.json"), "--data", p("train.csv"), "--target", "y", "--out", fresh("d")],
    2: () => ["assess", "--model", p("m.json"), "--data", p("train.csv"), "--target", "y", "--out", p("reports")],
  },
  optimize: {
    0: () => ["optimize", "--problem", branin, "--exact", "--optimizer", "random", "--budget", "5", "--out", fresh("d")],
    1: () => ["optimize", "--problem", p("infeasible.json"), "--exact", "--optimizer", "random", "--budget", "5", "--out", fresh("d")],
    2: () => ["optimize", "--problem", branin, "--exact", "--budget", "100000000000", "--out", fresh("d")],
  },
  bench: {
    0: () => ["bench", "--suite", "standard", "--problem", "standard-forrester", "--quick", "--no-peers", "--seeds", "1", "--out", fresh("d")],
    2: () => ["bench", "--suite", "nope", "--out", fresh("d")],
  },
  parcels: {
    0: () => ["parcels", "--input", `${parcels}quillmere-parcels.geojson`, "--zoning", `${parcels}quillmere-zoning.json`, "--streets", `${parcels}quillmere-streets.geojson`, "--street-distance", "8", "--out", fresh("geojson")],
    1: () => ["parcels", "--input", p("bad.geojson"), "--coordinates", "metres", "--out", fresh("geojson")],
    2: () => ["parcels", "--input", p("bad.geojson"), "--coordinates", "metres", "--out", p("reports/report.json")],
  },
  demo: { 2: () => ["demo", "--out", p("reports"), "--no-such-option"] },
};

describe("exit statuses: the README's table, for every command", () => {
  it("the README's table lists exactly these commands, with a case for each of its cells", () => {
    const readme = readFileSync(join(root, "README.md"), "utf8");
    const rows = [...readme.matchAll(/^\| `([a-z]+)` \| ([^|]+) \| ([^|]+) \| ([^|]+) \|$/gm)];
    expect(rows.map((r) => r[1]).sort()).toEqual(Object.keys(table).sort());
    for (const r of rows) {
      const cells = [r[2], r[3], r[4]].map((c) => c!.trim() !== "—");
      const cases = table[r[1]!]!;
      expect([0, 1, 2].map((c) => cells[c]), r[1]).toEqual([0 in cases || r[1] === "demo", 1 in cases, 2 in cases]);
    }
  });
  for (const [command, cases] of Object.entries(table)) {
    for (const [code, args] of Object.entries(cases)) {
      it(`${command} → ${code}`, async () => {
        const r = await runCli(args());
        expectCleanOutcome(r, [Number(code)], `${command} ${code}`);
        // every command that shows results shows the one caution (design writes a unit-cube design, no result)
        // word for word, and no other caution wording on stdout or stderr
        if (code === "0" && command !== "design") expectOnlyCaution(`${r.out}${r.err}`, command);
      }, 180_000);
    }
  }
  it("a reader that closes the pipe early ends massing quietly (only the caution on stderr, no EPIPE message, status 0)", async () => {
    writeFileSync(p("many.jsonl"), `${MASSING_OK}\n`.repeat(20_000));
    const child = spawn(process.execPath, [BIN, "massing", "--input", p("many.jsonl")], { stdio: ["ignore", "pipe", "pipe"] });
    let err = "";
    child.stderr.on("data", (c: Buffer) => (err += c.toString()));
    child.stdout.once("data", () => child.stdout.destroy()); // like `| head -1`: read a little, then close
    const code = await new Promise<number | null>((resolve) => child.on("close", (c) => resolve(c)));
    expect(err).toBe(`${FLOORCAST_CAUTION}\n`); // the caution, printed before the first result, and no EPIPE message
    expect(code).toBe(0);
  }, 120_000);
});
