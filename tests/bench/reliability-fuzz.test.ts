import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import seedrandom from "seedrandom";
import { drawHostileCase, runHostileCase, type HostileCase } from "../../packages/bench/src/benchmarks/hostile-case.js";
import { HOSTILE_MODES } from "../../packages/bench/src/benchmarks/hostile-evaluator-program.js";

// The kept fuzz suite: cases drawn from a fixed seed, plus every evaluator fault once, each run through the real
// `floorcast` command line. `npm run bench:hostile` runs the same cases 200 at a time (README, "Reliability").
const dir = mkdtempSync(join(tmpdir(), "floorcast-fuzz-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const rng = seedrandom("floorcast-fuzz-ci");
const drawn: HostileCase[] = Array.from({ length: 3 }, () => drawHostileCase(rng));
const everyMode: HostileCase[] = HOSTILE_MODES.map((mode, i) => ({ kind: "evaluator", mode, at: 3 + i, n: 24, processes: i % 3 === 2 ? 2 : 1, seed: i }));
const fixedKinds: HostileCase[] = [
  { kind: "concurrent", n: 800, seed: 4 },
  { kind: "kill-resume", n: 1500, seed: 5, killShare: 0.4 },
  { kind: "predict-far", rows: 20, seed: 6 },
];

describe("hostile runs from a fixed seed: nothing lost, nothing misaligned", () => {
  const cases = [...everyMode, ...fixedKinds, ...drawn];
  cases.forEach((c, i) => {
    const label = c.kind === "evaluator" ? `evaluator ${c.mode}${c.processes > 1 ? " ×2" : ""} (n ${c.n}, fault at ${c.at})` : `${c.kind} ${JSON.stringify(c)}`;
    it(label, async () => {
      const f = await runHostileCase(c, dir, `fuzz-${i}`);
      expect(f).toEqual({ misalignedRows: 0, partialFiles: 0, nanOutputs: 0, unexpected: null });
    }, 300_000);
  });
});
