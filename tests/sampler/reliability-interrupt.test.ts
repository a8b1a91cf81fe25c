import { afterAll, describe, expect, it } from "vitest";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import seedrandom from "seedrandom";
import { loadScenario, writeDataset } from "@floorcast/sampler";
import { spawnUntil } from "../bench/reliability-cli-run.js";

const dir = mkdtempSync(join(tmpdir(), "floorcast-rel-kill-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const scenarioPath = fileURLToPath(new URL("../../datasets/scenarios/ferrow-corner.json", import.meta.url));
// n large enough that writing takes a second or two on the development machine.
const N = 40_000;
const args = ["sample", "--scenario", scenarioPath, "--n", String(N), "--seed", "3", "--design", "lhs"];

const sizeOf = (path: string) => (existsSync(path) ? statSync(path).size : 0);

describe("floorcast sample killed with SIGKILL and resumed", () => {
  it("ends with a file byte-identical to an uninterrupted run, whatever moments the kills land on", async () => {
    // The reference has the same file name (manifests record it) in its own folder.
    mkdirSync(join(dir, "reference"));
    const reference = join(dir, "reference", "killed.csv");
    await writeDataset(await loadScenario(scenarioPath), { out: reference, n: N, design: "lhs", seed: 3 });
    const expected = readFileSync(reference);
    const out = join(dir, "killed.csv");
    const rng = seedrandom("floorcast-reliability-kills");
    let kills = 0;
    let midRun = 0;
    let attempts = 0;
    const partialPath = `${out}.partial`;
    // Seeded kill moments: after a random share of the file's bytes are on disk (mid-run), at a random early
    // moment (during start-up or the design), and again mid-run; later runs go to the end.
    const plan = [
      () => { const at = (0.05 + 0.4 * rng()) * expected.length; return () => sizeOf(partialPath) >= at; },
      () => { const at = 50 + 400 * rng(); return (t: number) => t >= at; },
      () => { const have = sizeOf(partialPath); const at = have + (0.1 + 0.6 * rng()) * (expected.length - have); return () => sizeOf(partialPath) >= at; },
    ];
    while (!existsSync(out) && attempts < 8) {
      const killNow = attempts < plan.length ? plan[attempts]!() : () => false;
      attempts++;
      const r = await spawnUntil([...args, ...(attempts === 1 ? ["--out", out] : ["--resume", "--out", out])], killNow);
      if (r.signal === "SIGKILL") {
        kills++;
        // What a kill leaves behind is never the final file, and the rows on disk are a prefix of the true file
        // (a torn last line at most).
        expect(existsSync(out)).toBe(false);
        const partial = `${out}.partial`;
        if (existsSync(partial)) {
          const bytes = readFileSync(partial);
          if (bytes.length > 0) midRun++;
          expect(bytes.equals(expected.subarray(0, bytes.length))).toBe(true);
        }
      } else {
        expect(r.code, r.err).toBe(0);
        expect(r.err).not.toMatch(/^\s{4}at /m);
      }
    }
    expect(kills).toBeGreaterThanOrEqual(2);
    expect(midRun).toBeGreaterThanOrEqual(2); // kills landed while rows were being written
    expect(readFileSync(out).equals(expected)).toBe(true);
    expect(readFileSync(join(dir, "killed.manifest.json"), "utf8")).toBe(readFileSync(join(dir, "reference", "killed.manifest.json"), "utf8"));
  }, 300_000);
});
