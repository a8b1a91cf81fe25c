import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

const bin = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));

describe("floorcast --help", () => {
  it("prints usage with the feasibility caution and exits 0", () => {
    const out = execFileSync(process.execPath, [bin, "--help"], { encoding: "utf8" });
    expect(out).toMatch(/Usage: floorcast/);
    expect(out).toMatch(/not a zoning determination/);
  });
  it("--version and -V print the version of @floorcast/bench and exit 0", () => {
    const { version } = JSON.parse(readFileSync(new URL("../../packages/bench/package.json", import.meta.url), "utf8")) as { version: string };
    for (const flag of ["--version", "-V"]) expect(execFileSync(process.execPath, [bin, flag], { encoding: "utf8" }).trim()).toBe(version);
  });
});
