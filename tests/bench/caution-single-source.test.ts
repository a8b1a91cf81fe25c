import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { join, relative } from "node:path";
import { fileURLToPath } from "node:url";
import { FLOORCAST_CAUTION as benchCaution } from "@floorcast/bench";
import { FLOORCAST_CAUTION } from "@floorcast/sampler";
import { TRUST_REPORT_DEFAULT_CAUTION } from "@floorcast/surrogate";
import { CAUTION_WORDING, expectOnlyCaution } from "./helpers/only-caution.js";
import { stringLiterals } from "./helpers/string-literals.js";

// One caution, one wording, from one constant (README "Cautions"): no string literal in the three packages' sources
// or built JavaScript carries caution-like wording except the constant itself (in @floorcast/sampler) and the trust
// report's default (the surrogate package may not import the sampler), which is pinned equal to it here.
// TSDoc and other comments may describe the caution; they are skipped.
const root = fileURLToPath(new URL("../../", import.meta.url));
const ALLOWED = new Set([
  "packages/sampler/src/floorcast-caution.ts",
  "packages/sampler/dist/floorcast-caution.js",
  "packages/surrogate/src/trust/trust-report-caution.ts",
  "packages/surrogate/dist/trust/trust-report-caution.js",
]);

function files(dir: string, keep: (name: string) => boolean): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    if (e.isDirectory()) return files(join(dir, e.name), keep);
    return e.isFile() && keep(e.name) ? [relative(root, join(dir, e.name)).split("\\").join("/")] : [];
  });
}
const sources = ["sampler", "surrogate", "bench"].flatMap((p) => [
  ...files(join(root, "packages", p, "src"), (n) => n.endsWith(".ts")),
  ...files(join(root, "packages", p, "dist"), (n) => /\.(js|mjs)$/.test(n)),
]);
const worded = (file: string) =>
  stringLiterals(readFileSync(join(root, file), "utf8"))
    .filter((l) => new RegExp(CAUTION_WORDING.source, "i").test(l.text))
    .map((l) => `${file}:${l.line}: ${l.text}`);

describe("one caution from one constant", () => {
  it("bench's FLOORCAST_CAUTION is the sampler's, and the trust report's default is the same text", () => {
    expect(benchCaution).toBe(FLOORCAST_CAUTION);
    expect(TRUST_REPORT_DEFAULT_CAUTION).toBe(FLOORCAST_CAUTION);
    expectOnlyCaution(FLOORCAST_CAUTION, "the constant");
  });

  it("the literal scanner finds strings and templates, and skips comments and regular expressions", () => {
    const code = [
      "/** Estimates: not a zoning determination (TSDoc). */",
      "// not a zoning determination (line comment)",
      'const a = /["\'`]/g, b = x / 2 / y, e = r[i]! / 2 / t!; // a regex with quotes, then divisions',
      "const c = 'not a zoning determination';",
      "const d = `${f({ k: \"in\" })} licensed professionals decide ${g`inner`}`;",
      "if (v) return /zoning determination/.test(v);",
    ].join("\n");
    expect(stringLiterals(code)).toEqual([
      { text: "not a zoning determination", line: 4 },
      { text: "in", line: 5 },
      { text: "inner", line: 5 },
      { text: "${…} licensed professionals decide ${…}", line: 5 },
    ]);
    expect(() => stringLiterals("const s = 'open")).toThrow(/unterminated string/);
  });

  it("scans every source and built file of the three packages", () => {
    expect(sources.length).toBeGreaterThan(300);
    for (const file of ALLOWED) expect(sources, file).toContain(file);
    // the tokenizer reads every file to its end without losing its place (it throws on an unterminated literal)
    for (const file of sources) expect(() => stringLiterals(readFileSync(join(root, file), "utf8")), file).not.toThrow();
  });

  it("no string literal but the constant (and the pinned default) carries caution-like wording", () => {
    for (const file of ALLOWED) expect(worded(file), file).toEqual([expect.stringContaining(FLOORCAST_CAUTION)]);
    expect(sources.filter((f) => !ALLOWED.has(f)).flatMap(worded)).toEqual([]);
  });
});
