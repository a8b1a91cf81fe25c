import { describe, expect, it } from "vitest";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { runCli } from "../bench/run-cli.js";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

// y = a + 2b (derived), 8 distinct rows.
const x = [[1, 2], [2, 3], [3, 1], [4, 4], [5, 2], [6, 1], [7, 3], [8, 5]];
const data = { inputs: ["a", "b"], targets: ["y"], x, y: x.map(([a, b]) => [a! + 2 * b!]) };

describe("a fixed GP noise variance has a documented upper limit", () => {
  it("1e300 is a RangeError naming the field (it broke the eigendecomposition); 1e100 still fits", () => {
    expect(() => fitGaussianProcess(data, { noiseVariance: 1e300, restarts: 1 })).toThrow(/^fitGaussianProcess: options\.noiseVariance must be ≤ 1e\+100/);
    const gp = fitGaussianProcess(data, { noiseVariance: 1e100, restarts: 1 });
    // noise swamps the signal: the posterior mean is the training mean, 9.75 (derived: (5+8+5+12+9+8+13+18)/8)
    expect(gp.predict([[1, 2]]).mean[0]![0]).toBeCloseTo(9.75, 9);
  });
  it("fit --noise 1e300 exits 2 with one clear line", async () => {
    const dir = mkdtempSync(join(tmpdir(), "floorcast-noise-"));
    try {
      writeFileSync(join(dir, "t.csv"), `a,b,y\n${data.x.map((r, i) => `${r[0]},${r[1]},${data.y[i]![0]}`).join("\n")}\n`);
      const r = await runCli(["fit", "--data", join(dir, "t.csv"), "--inputs", "a,b", "--target", "y", "--noise", "1e300", "--out", join(dir, "m.json")]);
      expect(r.code).toBe(2);
      // fit runs the restarts on worker threads, so its entry point fitGaussianProcessParallel names itself
      expect(r.err.trim()).toMatch(/^floorcast: fitGaussianProcessParallel: options\.noiseVariance must be ≤ 1e\+100 .*got 1e\+300$/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
