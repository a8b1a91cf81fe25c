import { describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { runCli } from "./run-cli.js";
import { fileURLToPath } from "node:url";
import { FLOORCAST_CAUTION } from "@floorcast/sampler";
import { expectOnlyCaution } from "./helpers/only-caution.js";

const bin = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));

describe("floorcast --help", () => {
  it("prints usage with the feasibility caution and exits 0", () => {
    const out = execFileSync(process.execPath, [bin, "--help"], { encoding: "utf8" });
    expect(out).toMatch(/Usage: floorcast/);
    // the one caution, word for word, once, at the end (no command description spells its own)
    expect(out.trimEnd().endsWith(`\n\n${FLOORCAST_CAUTION}`)).toBe(true);
    expectOnlyCaution(out, "floorcast --help");
    expect(out.split(FLOORCAST_CAUTION)).toHaveLength(2);
  });
  it("every command's help ends with the same caution, once", async () => {
    const commands = [...execFileSync(process.execPath, [bin, "--help"], { encoding: "utf8" }).matchAll(/^  ([a-z-]+) /gm)].map((m) => m[1]!).filter((c) => c !== "help");
    expect(commands).toEqual(expect.arrayContaining(["massing", "parcels", "rank-parcels", "assess", "sample"]));
    for (const command of commands) {
      const r = await runCli([command, "--help"]);
      expect(r.code, command).toBe(0);
      expect(r.out.trimEnd().endsWith(`\n\n${FLOORCAST_CAUTION}`), command).toBe(true);
      expect(r.out.split(FLOORCAST_CAUTION), command).toHaveLength(2);
      expectOnlyCaution(r.out, `floorcast ${command} --help`);
    }
  });
  it("--version and -V print the version of @floorcast/bench and exit 0", () => {
    const { version } = JSON.parse(readFileSync(new URL("../../packages/bench/package.json", import.meta.url), "utf8")) as { version: string };
    for (const flag of ["--version", "-V"]) expect(execFileSync(process.execPath, [bin, flag], { encoding: "utf8" }).trim()).toBe(version);
  });
  it("an unknown option is reported before a missing required one, for every command", async () => {
    for (const command of ["sample", "fit", "predict", "optimize", "design", "assess", "merge"]) {
      const r = await runCli([command, "--nope"]);
      expect(r.code, command).toBe(2);
      expect(r.err, command).toMatch(/^error: unknown option '--nope'\n/); // commander may add "(Did you mean …?)"
      expect(r.err, command).not.toMatch(/required option/);
    }
    const missing = await runCli(["sample", "--n", "3"]);
    expect(missing.code).toBe(2);
    expect(missing.err).toBe("error: required option '--seed <s>' not specified\n");
  });
  it("help marks every required option (required) and no other", async () => {
    const help = (await runCli(["sample", "--help"])).out.replace(/\s+/g, " ");
    for (const flag of ["--n <n>", "--seed <s>", "--out <file.csv>"]) expect(help).toMatch(new RegExp(`${flag.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")} [^-]*\\(required\\)`));
    // --scenario and --problem: one of the two (checked by sample itself), so neither is marked on its own
    expect(help).toMatch(/--scenario <file> .*?one of --scenario and --problem is required.*?--problem <file> .*?one of --scenario and --problem is required/);
    expect(help).not.toMatch(/--(scenario|problem) <file> [^-]*\(required\)/);
    expect(help).not.toMatch(/--force [^-]*\(required\)/);
    expect((await runCli(["predict", "--help"])).out.match(/\(required\)/g)).toHaveLength(3);
  });
});
