import { afterAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const dir = mkdtempSync(join(tmpdir(), "floorcast-mem-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const child = fileURLToPath(new URL("./helpers/stream-200k.mjs", import.meta.url));

describe("streamed datasets", () => {
  it("200,000 rows are written and read back without being held in memory", () => {
    const out = join(dir, "big.csv");
    // A 96 MB old-space cap as a hard stop besides the measured bound below.
    const text = execFileSync(process.execPath, ["--expose-gc", "--max-old-space-size=96", child, out, "200000"], {
      encoding: "utf8",
      cwd: fileURLToPath(new URL("../..", import.meta.url)),
      timeout: 120_000,
    });
    const r = JSON.parse(text) as Record<string, number | boolean> & Record<"write" | "read", { baseline: number; peak: number }>;
    expect(r.rows).toBe(200_000);
    expect(r.manifestRows).toBe(200_000);
    expect(r.inOrder).toBe(true);
    const bytes = r.bytes as number;
    expect(bytes).toBeGreaterThan(12e6);
    // Bound (derived): holding the rows from the baseline (row 20,000) on, even only as the file's text (1 byte per
    // character), would grow the live heap by at least 0.9 × `bytes`; streaming keeps each phase's growth over its
    // baseline under 10% of `bytes`.
    for (const phase of [r.write, r.read]) {
      expect(phase.baseline).toBeGreaterThan(0);
      expect(phase.peak - phase.baseline).toBeLessThan(0.1 * bytes);
    }
  }, 120_000);
});
