import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import * as bench from "@floorcast/bench";

// Importing the optimizers or the problem contract must not load the CLI parser, the chart packages, the progress
// bars or tfjs: the loaded modules are recorded by a loader hook in a child process.

const root = fileURLToPath(new URL("../../", import.meta.url));
const hook = fileURLToPath(new URL("./helpers/list-modules.mjs", import.meta.url));
let dir = "";
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-modules-"));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function modulesLoadedBy(specifier: string): string[] {
  const list = join(dir, `${specifier.replace(/\W+/g, "-")}.txt`);
  const r = spawnSync(process.execPath, ["--import", hook, "--input-type=module", "-e", `await import(${JSON.stringify(specifier)});`], {
    cwd: root,
    env: { ...process.env, FLOORCAST_MODULE_LIST: list },
    encoding: "utf8",
  });
  expect(r.status, r.stderr).toBe(0);
  return readFileSync(list, "utf8").trim().split("\n");
}

const HEAVY = [/\/node_modules\/commander\//, /\/node_modules\/vega/, /\/node_modules\/cli-progress\//, /@tensorflow/, /\/bench\/dist\/cli\/(main|register-commands|commands\/)/];

describe("@floorcast/bench subpaths by audience", () => {
  for (const subpath of ["@floorcast/bench/optimizers", "@floorcast/bench/problems", "@floorcast/bench/harness", "@floorcast/bench/report"]) {
    it(`${subpath} loads no CLI parser, chart package, progress bar or tfjs`, () => {
      const loaded = modulesLoadedBy(subpath);
      expect(loaded.some((u) => u.includes("/packages/bench/dist/"))).toBe(true); // the hook saw the package
      for (const heavy of HEAVY) expect(loaded.filter((u) => heavy.test(u)), String(heavy)).toEqual([]);
    }, 60_000);
  }
  it("the root re-exports the subpaths' library, and the command line's main is not a library export", () => {
    expect("main" in bench).toBe(false);
    expect(typeof bench.nsga2).toBe("function");
    expect(typeof bench.loadProblem).toBe("function");
    expect(typeof bench.runBench).toBe("function");
    expect(typeof bench.renderTrustHtml).toBe("function");
    expect(bench.OPTIMIZERS.map((o) => o.name)).toEqual(["grid", "random", "lhs", "gradient", "pso", "ga", "nsga2", "bo"]);
    expect(bench.MODEL_FAMILIES.map((f) => f.name)).toEqual(["gp", "nn", "plate-stack"]);
  });
});
