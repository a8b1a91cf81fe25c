import { afterAll, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { runCli } from "./run-cli.js";
import { createDesign, isLatin, readTable } from "@floorcast/sampler";

const dir = mkdtempSync(join(tmpdir(), "floorcast-design-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const run = (args: string[]) => runCli(args);

describe("floorcast design", () => {
  it("writes x1..xD columns holding exactly createDesign's points, for every design", async () => {
    for (const design of ["lhs", "lhs-centred", "lhs-maximin", "sobol", "random"]) {
      const out = join(dir, `${design}.csv`);
      const r = await run(["design", "--n", "32", "--dims", "3", "--design", design, "--seed", "7", "--out", out]);
      expect(r.code, r.err).toBe(0);
      const text = readFileSync(out, "utf8");
      expect(text.split("\n")[0]).toBe("x1,x2,x3");
      const table = await readTable(out);
      expect(table.columns).toEqual(["x1", "x2", "x3"]);
      // Shortest round-trip numbers: the file gives back the very doubles.
      expect(table.rows).toEqual(createDesign({ n: 32, dims: 3, design: design as "lhs", seed: "7" }));
      if (design !== "random") expect(isLatin(table.rows)).toBe(true); // Sobol': 32 = 2^5 points
    }
    expect(readdirSync(dir).some((f) => f.includes(".partial-"))).toBe(false);
  });

  it("refuses to overwrite an existing file without --force", async () => {
    const out = join(dir, "keep.csv");
    writeFileSync(out, "precious\n");
    const r = await run(["design", "--n", "4", "--dims", "2", "--design", "lhs", "--seed", "1", "--out", out]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/already exists; use --force/);
    expect(readFileSync(out, "utf8")).toBe("precious\n");
    const forced = await run(["design", "--n", "4", "--dims", "2", "--design", "lhs", "--seed", "1", "--out", out, "--force"]);
    expect(forced.code).toBe(0);
    expect(readFileSync(out, "utf8").split("\n")).toHaveLength(6); // header, 4 rows, final LF
  });

  it("reports user mistakes on one stderr line with exit status 2 and writes nothing", async () => {
    const out = join(dir, "bad.csv");
    const cases: [string[], RegExp][] = [
      [["--n", "0", "--dims", "2", "--design", "lhs"], /n must be an integer ≥ 1/],
      [["--n", "abc", "--dims", "2", "--design", "lhs"], /--n must be a whole number/],
      [["--n", "2.5", "--dims", "2", "--design", "lhs"], /--n must be a whole number/],
      [["--n", "4", "--dims", "0", "--design", "lhs"], /dims must be an integer ≥ 1/],
      [["--n", "4", "--dims", "-1", "--design", "lhs"], /--dims must be a whole number ≥ 0, got "-1"/],
      [["--n", "4", "--dims", "2", "--design", "grid"], /--design must be one of/],
      [["--n", "4", "--dims", "99", "--design", "sobol"], /dims must be ≤/],
    ];
    for (const [args, message] of cases) {
      const r = await run(["design", ...args, "--seed", "1", "--out", out]);
      expect(r.code).toBe(2);
      expect(r.err).toMatch(message);
      expect(r.err.trim().split("\n")).toHaveLength(1);
      expect(r.err).not.toMatch(/\n\s+at /);
    }
    const missing = await run(["design", "--n", "4", "--dims", "2", "--out", out]);
    expect(missing.code).toBe(2); // --seed is required
    expect(existsSync(out)).toBe(false);
  });
});
