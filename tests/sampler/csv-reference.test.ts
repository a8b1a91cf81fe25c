import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createCsvWriter, readTable } from "@floorcast/sampler";
import { referenceAvailable, runReference } from "../reference/python.js";

const dir = mkdtempSync(join(tmpdir(), "floorcast-csvref-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const hasPython = referenceAvailable([]);

// Python's csv module (standard library of Debian's python3) is an independent reader/writer of the
// RFC 4180 format: quoted fields, doubled quotes, CRLF record ends.
describe.skipIf(!hasPython)("CSV against Python's csv module (reference)", () => {
  const labels = ["plain", "comma, inside", 'a "quote"', "line\nbreak", "cr\r\nlf", " spaced ", "", "é ünïcode"];
  const numbers = [0.1, -2.5e-7, 1e21, 123456789.125, 5e-324, 1 / 3];
  it("csv.reader reads what createCsvWriter wrote, field for field", async () => {
    const mine = join(dir, "mine.csv");
    const w = createCsvWriter(mine, ["label", "x"]);
    for (let i = 0; i < labels.length; i++) await w.write([labels[i]!, numbers[i % numbers.length]!]);
    await w.close();
    const ref = runReference<{ parsed: string[][] }>("csv_roundtrip.py", { read: mine, rows: [] });
    expect(ref.parsed[0]).toEqual(["label", "x"]);
    expect(ref.parsed.slice(1).map((r) => r[0])).toEqual(labels);
    expect(ref.parsed.slice(1).map((r) => Number(r[1]))).toEqual(labels.map((_, i) => numbers[i % numbers.length]));
  });
  it("readTable reads what csv.writer wrote (CRLF line ends, minimal quoting), values exact", async () => {
    const theirs = join(dir, "theirs.csv");
    const rows = [["label", "x"], ...labels.map((l, i) => [l, numbers[i % numbers.length]!])];
    runReference("csv_roundtrip.py", { write: theirs, rows });
    expect(readFileSync(theirs, "utf8")).toContain("\r\n");
    const t = await readTable(theirs, { columns: ["x"], categorical: ["label"] });
    expect(t.categorical.label).toEqual(labels);
    // Python's repr(float) is also the shortest round-trip text, so the doubles come back bit for bit
    expect(t.rows.map((r) => r[0])).toEqual(labels.map((_, i) => numbers[i % numbers.length]));
  });
});
