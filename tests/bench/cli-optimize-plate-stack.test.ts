import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { loadProblem } from "../../packages/bench/src/problem/load-problem.js";
import { fileURLToPath } from "node:url";
// the repository's problem files (the package finds its shipped copies relative to its built dist/)
const DEFAULT_PROBLEMS_DIR = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));
import { floorcastTrainer } from "../../packages/bench/src/harness/floorcast-trainer.js";
import { sampleTrainingSet } from "../../packages/bench/src/harness/sample-training-set.js";
import { runCli } from "./run-cli.js";

const dir = mkdtempSync(join(tmpdir(), "floorcast-opt-plate-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("floorcast optimize --surrogate with a plate-stack model file", () => {
  it("optimizes larkspur-fit-gfa on the plate stack and reports an exactly re-evaluated optimum within 0.5% of 504 m²", async () => {
    const file = join(DEFAULT_PROBLEMS_DIR, "larkspur-fit-gfa.json");
    const problem = await loadProblem(file);
    const train = await sampleTrainingSet(problem, 24, "train-7", dir);
    await floorcastTrainer("plate-stack", true).fit(train, 7, join(dir, "ps.json"));
    const r = await runCli(["optimize", "--problem", file, "--surrogate", join(dir, "ps.json"), "--budget", "400", "--out", join(dir, "o")]);
    expect(r.code, r.err).toBe(0);
    const o = JSON.parse(readFileSync(join(dir, "o", "optimum.json"), "utf8"));
    const best = o.optima[0];
    // FAR 1.2 × 12 m × 35 m = 504 m² (max GFA = FAR × lot area, DC Zoning Handbook "Floor Area Ratio")
    expect(best.result.gfa).toBeGreaterThanOrEqual(504 * 0.995);
    expect(best.result.height).toBeLessThanOrEqual(10);
    expect(r.out).toMatch(/not a zoning determination/);
  }, 600_000);
});
