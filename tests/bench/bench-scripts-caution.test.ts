import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { FLOORCAST_CAUTION } from "@floorcast/bench";

// Every `npm run bench:*` script shows its figures with the one caution constant (FLOORCAST_CAUTION); none spells
// its own wording. Running them all is hours of work (they are scripts, not tests), so each script's source is
// checked, and the quickest one (bench:cli with one run per case) is run to see the caution in its output.
const root = fileURLToPath(new URL("../../", import.meta.url));
const scripts = Object.entries((JSON.parse(readFileSync(join(root, "package.json"), "utf8")) as { scripts: Record<string, string> }).scripts).filter(([name]) =>
  name.startsWith("bench:"),
);

describe("bench:* scripts print the caution", () => {
  it("there are bench scripts, each a built file of packages/bench/src/benchmarks", () => {
    expect(scripts.length).toBeGreaterThanOrEqual(13);
    for (const [name, command] of scripts) expect(command, name).toMatch(/^node packages\/bench\/dist\/benchmarks\/[a-z-]+\.js$/);
  });
  for (const [name, command] of scripts) {
    it(`${name} prints FLOORCAST_CAUTION and no wording of its own`, () => {
      const source = join(root, command.replace(/^node packages\/bench\/dist\/benchmarks\/(.+)\.js$/, "packages/bench/src/benchmarks/$1.ts"));
      expect(existsSync(source), source).toBe(true);
      const text = readFileSync(source, "utf8");
      expect(text).toContain('import { FLOORCAST_CAUTION } from "../floorcast-caution.js";');
      // printed alone or inside a template literal
      expect(text).toMatch(/console\.log\((?:FLOORCAST_CAUTION\)|[^)]*\$\{FLOORCAST_CAUTION\})/);
      const code = text.split("\n").filter((l) => !/^\s*(\*|\/\/|\/\*\*)/.test(l));
      expect(code.filter((l) => /zoning determination/.test(l)), name).toEqual([]);
    });
  }
  it("bench:cli, run once per case, ends with the caution", () => {
    const r = spawnSync(process.execPath, [join(root, "packages/bench/dist/benchmarks/cli-start.js")], {
      encoding: "utf8",
      env: { ...process.env, FLOORCAST_BENCH_RUNS: "1" },
    });
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout.trimEnd().split("\n").at(-1)).toBe(FLOORCAST_CAUTION);
  }, 180_000);
});
