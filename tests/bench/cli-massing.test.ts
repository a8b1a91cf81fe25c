import { describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, writeFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { runCli } from "./run-cli.js";
import { FLOORCAST_CAUTION } from "@floorcast/bench";
import { evaluateMassing, quadParcel } from "@floorcast/sampler";
import type { MassingInput } from "@floorcast/sampler";

const bin = fileURLToPath(new URL("../../packages/bench/bin/floorcast.js", import.meta.url));

const run = (args: string[], stdinText = "") => runCli(args, stdinText);

// A Larkspur Terraces-like small residential lot of the invented district Quillmere, and a Ferrow Corner-like
// corner lot with a sky plane.
const larkspur: MassingInput = {
  parcel: quadParcel({ frontage: 14, depth: 32 }),
  setbacks: { front: 4.5, side: 1.5, rear: 6 },
  floorHeight: 3.1,
  maxHeight: 11,
  maxCoverage: 0.45,
};
const ferrow: MassingInput = {
  parcel: quadParcel({ frontage: 24, depth: 30, rearWidth: 22, skew: 6, corner: "right" }),
  setbacks: { front: 0, side: 3, rear: 5, street: 0 },
  floorHeight: 3.5,
  maxHeight: 24,
  maxFar: 3.2,
  skyPlane: { startHeight: 12, ratio: 2.7 },
  minPlateArea: 120,
};

describe("floorcast massing", () => {
  it("writes one result per input line, in order, equal to evaluateMassing (blank lines skipped)", async () => {
    const text = `${JSON.stringify(larkspur)}\n\n${JSON.stringify(ferrow)}\r\n`;
    const r = await run(["massing"], text);
    expect(r.code).toBe(0);
    const lines = r.out.trim().split("\n").map((l) => JSON.parse(l));
    expect(lines).toEqual([evaluateMassing(larkspur), evaluateMassing(ferrow)]);
    expect(lines[0].plates).toBeUndefined();
    // the caution, once, on stderr (stdout stays pure JSON Lines)
    expect(r.err).toBe(`${FLOORCAST_CAUTION}\n`);
  });

  it("puts an error object in a bad line's place, goes on, and exits 1", async () => {
    const bad = { ...larkspur, setbacks: { ...larkspur.setbacks, front: -1 } };
    const noFront = { ...larkspur, parcel: { ...larkspur.parcel, lotLines: ["side", "side", "rear", "side"] } };
    const text = [JSON.stringify(larkspur), "{not json", JSON.stringify(bad), "[1,2]", JSON.stringify(noFront), JSON.stringify(ferrow)].join("\n");
    const r = await run(["massing"], text);
    expect(r.code).toBe(1);
    const lines = r.out.trim().split("\n").map((l) => JSON.parse(l));
    expect(lines).toHaveLength(6);
    expect(lines[0]).toEqual(evaluateMassing(larkspur));
    expect(lines[1].error).toMatchObject({ line: 2, field: "(json)" });
    expect(lines[2].error).toEqual({
      line: 3, field: "setbacks.front", message: "evaluateMassing: setbacks.front must be ≥ 0, got -1",
    });
    expect(lines[3].error).toMatchObject({ line: 4, field: "input" });
    expect(lines[4].error).toMatchObject({ line: 5, field: "parcel.lotLines" });
    expect(lines[5]).toEqual(evaluateMassing(ferrow));
    expect(r.err).toMatch(/4 of the input lines failed/);
  });

  it("--plates adds the floor plates; --input reads a file", async () => {
    const dir = mkdtempSync(join(tmpdir(), "floorcast-massing-"));
    try {
      const file = join(dir, "in.jsonl");
      writeFileSync(file, `${JSON.stringify(ferrow)}\n`);
      const r = await run(["massing", "--input", file, "--plates"]);
      expect(r.code).toBe(0);
      const res = JSON.parse(r.out);
      expect(res).toEqual(evaluateMassing(ferrow, { plates: true }));
      expect(res.plates).toHaveLength(res.floors);
      // --input - is stdin, the same answer
      const piped = await run(["massing", "--input", "-", "--plates"], `${JSON.stringify(ferrow)}\n`);
      expect([piped.code, piped.out]).toEqual([0, r.out]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it("empty input writes nothing and exits 0", async () => {
    const r = await run(["massing"], "");
    expect([r.code, r.out, r.err]).toEqual([0, "", ""]); // no result shown, so no caution either
  });

  it("a missing --input file or an unknown option is a usage error (exit 2, one line, no stack)", async () => {
    const r = await run(["massing", "--input", "/nonexistent/floorcast.jsonl"]);
    expect(r.code).toBe(2);
    expect(r.err.trim().split("\n")).toHaveLength(1);
    expect(r.err).toMatch(/cannot read --input/);
    expect((await run(["massing", "--bogus"])).code).toBe(2);
    const dir = await run(["massing", "--input", tmpdir()]);
    expect([dir.code, dir.err.trim().split("\n").length]).toEqual([2, 1]);
  });

  it("works through the installed bin with the process's own exit status", () => {
    const p = spawnSync(process.execPath, [bin, "massing"], { input: `${JSON.stringify(larkspur)}\n{}\n`, encoding: "utf8" });
    expect(p.status).toBe(1);
    const lines = p.stdout.trim().split("\n").map((l) => JSON.parse(l));
    expect(lines[0]).toEqual(evaluateMassing(larkspur));
    expect(lines[1].error).toMatchObject({ line: 2, field: "parcel" });
  });
});

describe("README's floorcast massing example", () => {
  it("prints exactly what the README shows", async () => {
    const readme = readFileSync(fileURLToPath(new URL("../../README.md", import.meta.url)), "utf8");
    const section = readme.slice(readme.indexOf("### `floorcast massing`"));
    const block = section.slice(section.indexOf("```sh\n") + 6, section.indexOf("\n```", section.indexOf("```sh\n") + 6)).split("\n");
    const cat = block.indexOf("$ cat quillmere-lots.jsonl");
    const cmd = block.indexOf("$ floorcast massing --input quillmere-lots.jsonl");
    const echo = block.indexOf("$ echo $?");
    expect(Math.min(cat, cmd, echo)).toBeGreaterThanOrEqual(0);
    const r = await run(["massing"], block.slice(cat + 1, cmd).join("\n"));
    expect(r.out.trim().split("\n").map((l) => JSON.parse(l))).toEqual(block.slice(cmd + 1, echo).map((l) => JSON.parse(l)));
    expect(String(r.code)).toBe(block[echo + 1]);
  });
});
