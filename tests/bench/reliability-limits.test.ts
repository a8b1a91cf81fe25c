import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { evaluateMassing } from "@floorcast/sampler";
import { fitGaussianProcess, loadSurrogate } from "@floorcast/surrogate";
import { loadPredictor } from "@floorcast/surrogate/predict";
import { expectCleanOutcome } from "./reliability-cli-run.js";
import { runCli } from "./run-cli.js";

// Budgets, vertex counts and model sizes have limits, checked before anything large is allocated.
const dir = mkdtempSync(join(tmpdir(), "floorcast-limits-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const branin = fileURLToPath(new URL("../../datasets/problems/standard-branin.json", import.meta.url));

/** A regular polygon of n vertices around (0, 0), radius 20 m, counter-clockwise; every lot line a side. */
function polygonInput(n: number) {
  const base = { setbacks: { front: 1, side: 1, rear: 1 }, floorHeight: 3, maxHeight: 12, maxFar: 2, maxCoverage: 0.6 };
  const vertices = Array.from({ length: n }, (_, i) => [20 * Math.cos((2 * Math.PI * i) / n), 20 * Math.sin((2 * Math.PI * i) / n)]);
  const lotLines = Array.from({ length: n }, (_, i) => (i === 0 ? "front" : "side"));
  return { ...base, parcel: { vertices, lotLines } };
}

describe("limits", () => {
  it("optimize --budget beyond 1,000,000 is refused at once (exit 2) instead of growing without output", async () => {
    const r = await runCli(["optimize", "--problem", branin, "--exact", "--optimizer", "random", "--budget", "100000000000", "--out", join(dir, "o")]);
    expectCleanOutcome(r, [2], "budget");
    expect(r.err).toMatch(/--budget must be at most 1000000 evaluations/);
  });
  it("a parcel with more than 10,000 vertices is a RangeError naming the field; 1,000 vertices evaluate", () => {
    expect(() => evaluateMassing(polygonInput(10_001) as never)).toThrow(/^evaluateMassing: parcel\.vertices must have at most 10000 vertices, got 10001/);
    const ok = evaluateMassing(polygonInput(1_000) as never);
    // lot area of a regular 1,000-gon of circumradius 20 m: ½·n·r²·sin(2π/n) (derived, standard polygon formula)
    expect(ok.lotArea).toBeCloseTo(0.5 * 1000 * 400 * Math.sin((2 * Math.PI) / 1000), 6);
    expect(ok.gfa).toBeGreaterThan(0);
  });
  it("a GP model file too large to predict with is refused by both loaders before its rows are copied", () => {
    const x = [[1, 2], [2, 3], [3, 1], [4, 4], [5, 2], [6, 1], [7, 3], [8, 5]];
    const gp = fitGaussianProcess({ inputs: ["a", "b"], targets: ["y"], x, y: x.map(([a, b]) => [a! + 2 * b!]) }, { restarts: 1 });
    const file = JSON.parse(JSON.stringify(gp.toJSON()));
    delete file.checksum;
    // 17,000 rows: one 17,000² factor plus one more (derived: 8 B × 2 × 17,000² ≈ 4.3 GiB) > the 2 GiB budget
    const n = 17_000;
    file.payload.trainingInputs = Array.from({ length: n }, (_, i) => [(i % 97) / 97, (i % 89) / 89]);
    file.payload.components[0].alpha = new Array(n).fill(0);
    const text = JSON.stringify(file);
    writeFileSync(join(dir, "big.json"), text);
    expect(() => loadSurrogate(text, "big.json")).toThrow(/^loadSurrogate: big\.json: a GP on n = 17000 training rows × 1 target\(s\) needs about 4\.31 GiB to predict with, over the memory budget of 2\.00 GiB/);
    expect(() => loadPredictor(text)).toThrow(/a GP on n = 17000 training rows .* over the memory budget of 2\.00 GiB/);
    expect(readFileSync(join(dir, "big.json"), "utf8").length).toBeGreaterThan(100_000);
  });
});
