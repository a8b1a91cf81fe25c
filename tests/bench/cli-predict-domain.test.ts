import { beforeAll, describe, expect, it } from "vitest";
import { existsSync } from "node:fs";
import { mkdtemp, readFile, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { runCli } from "./run-cli.js";
import { fitGaussianProcess } from "@floorcast/surrogate";

let dir = "";
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "floorcast-predict-domain-"));
  // A 6×6 grid on [0, 50] × [0, 5]: bounds known, leave-one-out NN distance 0.2 for every row (derived).
  const x: number[][] = [];
  for (let i = 0; i <= 5; i++) for (let j = 0; j <= 5; j++) x.push([10 * i, j]);
  const gp = fitGaussianProcess({ inputs: ["a", "b"], targets: ["y"], x, y: x.map(([a, b]) => [a! + 3 * b!]) }, { seed: 1 });
  await writeFile(join(dir, "model.json"), JSON.stringify(gp.toJSON()));
  await writeFile(join(dir, "train.csv"), "a,b\n" + x.map((r) => r.join(",")).join("\n") + "\n");
  // rows: a grid point, a cell centre (distance √0.02 ≈ 0.141 ≤ 0.2), beyond a's bound, beyond b's bound.
  await writeFile(join(dir, "query.csv"), "a,b\n20,3\n25,2.5\n60,1\n10,-1\n");
});

describe("floorcast predict: in_domain column and --strict", () => {
  it("flags each row 1 inside / 0 outside the GP's domain of validity (from its stored training inputs)", async () => {
    const out = join(dir, "pred.csv");
    const r = await runCli(["predict", "--model", join(dir, "model.json"), "--data", join(dir, "query.csv"), "--keep", "", "--out", out]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/2 outside the domain of validity/);
    const lines = (await readFile(out, "utf8")).trim().split("\n");
    expect(lines[0]).toBe("y_mean,y_sd,in_domain,error");
    expect(lines.slice(1).map((l) => l.split(",")[2])).toEqual(["1", "1", "0", "0"]);
    // The same flags from --train (the same rows).
    const out2 = join(dir, "pred2.csv");
    expect((await runCli(["predict", "--model", join(dir, "model.json"), "--data", join(dir, "query.csv"), "--train", join(dir, "train.csv"), "--keep", "", "--out", out2])).code).toBe(0);
    expect(await readFile(out2, "utf8")).toBe(await readFile(out, "utf8"));
  });

  it("--strict refuses, naming the data rows, and writes nothing", async () => {
    const out = join(dir, "strict.csv");
    const r = await runCli(["predict", "--model", join(dir, "model.json"), "--data", join(dir, "query.csv"), "--strict", "--out", out]);
    expect(r.code).toBe(2);
    expect(r.err).toBe("floorcast: predict: --strict: data rows 3, 4 of query.csv (2 in all) are outside the model's domain of validity\n");
    expect(existsSync(out)).toBe(false);
    expect((await runCli(["predict", "--model", join(dir, "model.json"), "--data", join(dir, "train.csv"), "--strict", "--out", out])).code).toBe(0);
  });
});
