import { afterAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createCsvWriter, readTable } from "@floorcast/sampler";

const dir = mkdtempSync(join(tmpdir(), "floorcast-csvp-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Cell text that exercises RFC 4180 quoting: commas, double quotes, CR, LF, spaces and non-ASCII.
const unit = fc.constantFrom("a", "Z", "0", ",", '"', "\r", "\n", " ", "é", "-");

describe("CSV write → read round trip (property)", () => {
  it("random finite numeric tables with arbitrary text headers and labels read back exactly", async () => {
    let k = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 1, max: 5 }),
        fc.integer({ min: 1, max: 20 }),
        fc.uniqueArray(fc.string({ unit, minLength: 1, maxLength: 6 }), { minLength: 6, maxLength: 6 }),
        fc.array(fc.string({ unit, maxLength: 8 }), { minLength: 20, maxLength: 20 }),
        fc.infiniteStream(fc.double({ noNaN: true, noDefaultInfinity: true })),
        async (cols, nrows, names, labels, values) => {
          const header = names.slice(0, cols);
          const labelCol = names[5]!;
          const it = values[Symbol.iterator]();
          const rows = Array.from({ length: nrows }, () => header.map(() => it.next().value as number));
          const p = join(dir, `p${k++}.csv`);
          const w = createCsvWriter(p, [...header, labelCol]);
          for (let i = 0; i < nrows; i++) await w.write([...rows[i]!, labels[i]!]);
          await w.close();
          const t = await readTable(p, { columns: header, categorical: [labelCol] });
          // -0 is written as "0" (String(-0)); compare with Object.is after normalising it
          expect(t.rows).toEqual(rows.map((r) => r.map((v) => (Object.is(v, -0) ? 0 : v))));
          expect(t.categorical[labelCol]).toEqual(labels.slice(0, nrows));
        },
      ),
      { numRuns: 60, seed: 20261201 },
    );
  });
});
