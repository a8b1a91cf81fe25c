import { afterAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";

const dir = mkdtempSync(join(tmpdir(), "floorcast-rel-mem-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const child = fileURLToPath(new URL("./helpers/read-rss.mjs", import.meta.url));

// tests/sampler/dataset-memory.test.ts bounds the live heap while 200,000 generated rows are written and read;
// this one bounds the resident set size (what the operating system sees) while a ~100 MB file is streamed.
describe("streaming a large CSV keeps resident memory bounded", () => {
  it("reading 66,000 rows of 1.5 kB (≈100 MB) grows RSS by well under the size of the file", () => {
    const rows = 66_000;
    const text = execFileSync(process.execPath, ["--expose-gc", child, join(dir, "wide.csv"), String(rows), "1500"], {
      encoding: "utf8",
      cwd: fileURLToPath(new URL("../..", import.meta.url)),
      timeout: 60_000,
    });
    const r = JSON.parse(text) as { rows: number; sum: number; bytes: number; start: number; peak: number };
    expect(r.rows).toBe(rows);
    expect(r.sum).toBe((rows * (rows - 1)) / 2); // every row read once, in order of a (derived: Σ i)
    expect(r.bytes).toBeGreaterThan(95e6);
    // Bound (derived): holding the rows, even only their text, would grow RSS by at least the file size; a stream
    // holds one parser chunk and one row, so its growth stays well under it: measured 8–18 MB of a 100 MB file on an idle machine, more under load; the bound is 35% (the child collects garbage every 5,000 rows).
    expect(r.peak - r.start, `RSS ${r.start} → ${r.peak} bytes for a ${r.bytes}-byte file`).toBeLessThan(0.35 * r.bytes);
  }, 60_000);
});
