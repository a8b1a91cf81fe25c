import { describe, expect, it } from "vitest";
import { fileURLToPath } from "node:url";
import { join } from "node:path";
import { tmpdir } from "node:os";
import { runCli } from "./run-cli.js";

// Every command reads its whole-number options with the CLI's one parser: digits only (no sign, fraction, exponent
// or blank), refused before any work with exit 2 and one line naming the command, the option and the value as given
// (the usage-error convention of the README's exit-code table).
const file = (p: string): string => fileURLToPath(new URL(`../../datasets/${p}`, import.meta.url));
const scenario = file("scenarios/quillmere-core.json");
const problem = file("problems/core-tower-gfa.json");
const train = file("quillmere-core/train.csv");
const out = (name: string): string => join(tmpdir(), `floorcast-whole-${process.pid}-${name}`);

const cases: [string, string, (v: string) => string[], number][] = [
  ["sample", "--seed", (v) => ["sample", "--scenario", scenario, "--n", "10", "--seed", v, "--out", out("s.csv")], 0],
  ["sample", "--n", (v) => ["sample", "--scenario", scenario, "--n", v, "--seed", "1", "--out", out("s.csv")], 1],
  ["design", "--seed", (v) => ["design", "--n", "5", "--dims", "2", "--seed", v, "--out", out("d.csv")], 0],
  ["optimize", "--budget", (v) => ["optimize", "--problem", problem, "--exact", "--budget", v, "--out", out("o.json")], 1],
  ["fit", "--seed", (v) => ["fit", "--data", train, "--inputs", "frontage", "--target", "gfa", "--seed", v, "--out", out("m.json")], 0],
  ["fit", "--restarts", (v) => ["fit", "--data", train, "--inputs", "frontage", "--target", "gfa", "--restarts", v, "--out", out("m.json")], 1],
  ["bench", "--seeds", (v) => ["bench", "--seeds", v, "--out", out("b")], 1],
];

describe("whole-number options: one parser for every command (exit 2, one line)", () => {
  for (const [command, flag, args, min] of cases) {
    it(`${command} ${flag} refuses a sign, a fraction, an exponent, a blank and a value below ${min}`, async () => {
      for (const bad of ["-3", "2.5", "1e3", " ", "x", String(min - 1)]) {
        if (bad === "-1" && min === 0) continue; // already covered by "-3"
        const r = await runCli(args(bad));
        expect(r.code, `${command} ${flag} ${JSON.stringify(bad)}: ${r.err}`).toBe(2);
        const range = flag === "--seeds" ? "in [1, 100]" : `≥ ${min}`;
        expect(r.err).toBe(`floorcast: ${command}: ${flag} must be a whole number ${range}, got ${JSON.stringify(bad)}\n`);
      }
    });
  }
});
