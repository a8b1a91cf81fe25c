import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadSurrogate } from "@floorcast/surrogate";
import { README, checkQuickStartOutput, readmeCodeBlock, runQuickStart } from "./readme-code.js";

const root = fileURLToPath(new URL("../../", import.meta.url));

describe("README", () => {
  let dir = "";
  beforeAll(() => {
    // Inside the workspace, so that the script resolves the workspace's packages as a user's project would.
    dir = mkdtempSync(join(root, ".floorcast-tmp-readme-"));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("the library quick start runs: sample, fit, save, load, predict", () => {
    checkQuickStartOutput(runQuickStart(dir));
    const model = loadSurrogate(JSON.parse(readFileSync(join(dir, "gfa-model.json"), "utf8")));
    expect(model.inputs).toEqual(["frontage", "maxHeight"]);
    expect(model.targets).toEqual(["gfa"]);
  });

  it("the Quick start commands are the two the project promises", () => {
    expect(readmeCodeBlock("## Quick start", "sh")).toBe("npm ci && npm run demo\nnpm test\n");
  });

  it("Prerequisites name every Debian package that .ci/run installs", () => {
    const ci = readFileSync(join(root, ".ci/run"), "utf8");
    const debian = [...new Set([...ci.matchAll(/need\+=\(([^)]*)\)/g)].flatMap((m) => m[1]!.trim().split(/\s+/)))];
    expect(debian.length).toBeGreaterThan(0);
    const text = readFileSync(README, "utf8");
    const prerequisites = text.slice(text.indexOf("## Prerequisites"), text.indexOf("## Install"));
    for (const pkg of debian) expect(prerequisites, pkg).toContain(pkg);
    expect(prerequisites).toMatch(/Node\.js 20 or later/);
  });

  it("every package ships the root LICENSE unchanged", () => {
    const license = readFileSync(join(root, "LICENSE"), "utf8");
    for (const p of ["sampler", "surrogate", "bench"]) expect(readFileSync(join(root, "packages", p, "LICENSE"), "utf8"), p).toBe(license);
  });
});
