import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { fileURLToPath } from "node:url";

const bin = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));

describe("floorcast --help", () => {
  it("prints usage with the feasibility caution and exits 0", () => {
    const out = execFileSync(process.execPath, [bin, "--help"], { encoding: "utf8" });
    expect(out).toMatch(/Usage: floorcast/);
    expect(out).toMatch(/not a zoning determination/);
  });
});
