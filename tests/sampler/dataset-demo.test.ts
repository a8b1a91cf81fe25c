import { afterAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { FLOORCAST_CAUTION, loadScenario, manifestPathFor, readManifest, readTable } from "@floorcast/sampler";
import { expectOnlyCaution } from "../bench/helpers/only-caution.js";
import { referenceAvailable, runReference } from "../reference/python.js";

const datasets = fileURLToPath(new URL("../../datasets/", import.meta.url));
const list = JSON.parse(readFileSync(join(datasets, "demo-datasets.json"), "utf8")) as {
  datasets: { scenario: string; out: string; design: string; n: number; seed: number }[];
};
const dir = mkdtempSync(join(tmpdir(), "floorcast-demo-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("committed demo datasets", () => {
  it("each scenario has a training set and an independent test set (other seed, other design)", () => {
    for (const name of ["larkspur-terraces", "ferrow-corner", "quillmere-core"]) {
      const mine = list.datasets.filter((d) => d.scenario === `scenarios/${name}.json`);
      const train = mine.find((d) => d.out.endsWith("train.csv"))!;
      const test = mine.find((d) => d.out.endsWith("test.csv"))!;
      expect(train.design).toBe("lhs-maximin");
      expect(test.seed).not.toBe(train.seed);
      expect(test.design).not.toBe(train.design);
    }
  });
  it("regenerating them (datasets/regenerate.mjs) gives the committed files byte for byte", () => {
    execFileSync(process.execPath, [join(datasets, "regenerate.mjs"), "--out-dir", dir], { encoding: "utf8", timeout: 120_000 });
    for (const d of list.datasets) {
      const fresh = join(dir, d.out);
      const committed = join(datasets, d.out);
      expect(readFileSync(fresh).equals(readFileSync(committed)), d.out).toBe(true);
      expect(readFileSync(manifestPathFor(fresh)).equals(readFileSync(manifestPathFor(committed))), d.out).toBe(true);
    }
  }, 120_000);
  it("manifests match their scenario files and settings", async () => {
    for (const d of list.datasets) {
      const m = await readManifest(join(datasets, d.out));
      const s = await loadScenario(join(datasets, d.scenario));
      expect(m.scenario).toEqual({ name: s.name, file: s.fileName, sha256: s.sha256 });
      expect(m).toMatchObject({ design: d.design, seed: d.seed, n: d.n, rows: d.n });
      // the one caution, word for word, and no other caution wording in the file
      expect(m.caution, d.out).toBe(FLOORCAST_CAUTION);
      expectOnlyCaution(readFileSync(manifestPathFor(join(datasets, d.out)), "utf8"), d.out);
    }
  });
  it("every limitedBy regime occurs in the demo data, and the coverage cap binds in Quillmere Core", async () => {
    const seen = new Set<string>();
    for (const d of list.datasets) {
      const t = await readTable(join(datasets, d.out), { columns: ["coverageCapped"], categorical: ["limitedBy"] });
      for (const l of t.categorical.limitedBy!) seen.add(l);
      if (d.out.startsWith("quillmere-core")) {
        expect(t.rows.filter((r) => r[0] === 1).length).toBeGreaterThan(d.n / 2);
        expect(t.categorical.limitedBy!.filter((l) => l === "far").length).toBeGreaterThan(d.n / 4);
      }
    }
    expect([...seen].sort()).toEqual(["far", "height", "plate", "setbacks"]);
  });
});

const hasPython = referenceAvailable([]);
describe.skipIf(!hasPython)("manifest hashes against Python's hashlib (reference)", () => {
  it("csv.sha256 and csv.bytes of every demo manifest equal hashlib.sha256 and os.path.getsize", async () => {
    const paths = list.datasets.map((d) => join(datasets, d.out));
    // Python's hashlib implements SHA-256 as FIPS 180-4 specifies; an independent implementation of Node's crypto.
    const ref = runReference<{ sha256: string[]; bytes: number[] }>("sha256_files.py", { paths });
    for (let i = 0; i < paths.length; i++) {
      const m = await readManifest(paths[i]!);
      expect(m.csv.sha256).toBe(ref.sha256[i]);
      expect(m.csv.bytes).toBe(ref.bytes[i]);
    }
    const scen = [...new Set(list.datasets.map((d) => join(datasets, d.scenario)))];
    const refScen = runReference<{ sha256: string[] }>("sha256_files.py", { paths: scen });
    for (let i = 0; i < scen.length; i++) expect((await loadScenario(scen[i]!)).sha256).toBe(refScen.sha256[i]);
  });
});
