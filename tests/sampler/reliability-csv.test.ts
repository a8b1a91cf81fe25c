import { afterAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { openTableStream, readTable } from "@floorcast/sampler";

const dir = mkdtempSync(join(tmpdir(), "floorcast-rel-csv-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
let k = 0;
const write = (text: string) => {
  const p = join(dir, `t${k++}.csv`);
  writeFileSync(p, text);
  return p;
};

/** Reads a file with both readers; each gives its rows, or its error. */
async function both(path: string, options: { columns?: string[]; categorical?: string[] }) {
  const whole = await readTable(path, options).then(
    (t) => ({ rows: t.rows, labels: t.categorical }),
    (e: unknown) => e as Error,
  );
  let streamed: { rows: number[][]; labels: Record<string, string[]> } | Error;
  try {
    const s = await openTableStream(path, options);
    const rows: number[][] = [];
    const labels: Record<string, string[]> = Object.fromEntries(s.categorical.map((c) => [c, [] as string[]]));
    for await (const r of s) {
      rows.push(r.values);
      r.labels.forEach((l, j) => labels[s.categorical[j]!]!.push(l));
    }
    streamed = { rows, labels };
  } catch (e) {
    streamed = e as Error;
  }
  return { whole, streamed };
}

// A numeric cell as a user's spreadsheet might write it, with the number it stands for (null: not a valid number).
const cell = fc.oneof(
  { weight: 5, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }).map((v) => [String(v), v] as const) },
  { weight: 2, arbitrary: fc.integer().map((v) => [` ${v} `, v] as const) },
  { weight: 2, arbitrary: fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((v) => [`"${v}"`, v] as const) },
  { weight: 1, arbitrary: fc.constantFrom(["NaN", null], ["Infinity", null], ["-Infinity", null], ["", null], ["1e309", null], ["0x10", null], ["abc", null], ['"1,5"', null], ["1e-400", 0], ["5e-324", 5e-324], ["-0", -0], ["1.7976931348623157e308", 1.7976931348623157e308]) },
);

describe("readTable and the streaming reader under hostile CSV text", () => {
  it("agree with each other and with the numbers written: BOM, CRLF, quoted fields, spaces, a missing last line end", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.array(cell, { minLength: 3, maxLength: 3 }), { minLength: 1, maxLength: 15 }),
        fc.record({ bom: fc.boolean(), crlf: fc.boolean(), lastEol: fc.boolean(), quoteHeader: fc.boolean(), label: fc.string({ maxLength: 8 }) }),
        async (rows, f) => {
          const eol = f.crlf ? "\r\n" : "\n";
          const q = (s: string) => `"${s.replace(/"/g, '""')}"`;
          const header = (f.quoteHeader ? ["a", "b", "c", "kind"].map(q) : ["a", "b", "c", "kind"]).join(",");
          const lines = rows.map((r) => [...r.map(([t]) => t), q(f.label)].join(","));
          const text = (f.bom ? "\uFEFF" : "") + [header, ...lines].join(eol) + (f.lastEol ? eol : "");
          const path = write(text);
          const { whole, streamed } = await both(path, { columns: ["a", "b", "c"], categorical: ["kind"] });
          const valid = rows.every((r) => r.every(([, v]) => v !== null));
          if (valid) {
            expect(whole).not.toBeInstanceOf(Error);
            expect(streamed).toEqual(whole);
            expect((whole as { rows: number[][] }).rows).toEqual(rows.map((r) => r.map(([, v]) => v)));
            expect((whole as { labels: Record<string, string[]> }).labels.kind).toEqual(rows.map(() => f.label));
          } else {
            // A bad cell: both refuse, naming the file, the row and the column (RangeError, message by function).
            for (const [fn, e] of [["readTable", whole], ["openTableStream", streamed]] as const) {
              expect(e).toBeInstanceOf(RangeError);
              expect((e as Error).message).toMatch(new RegExp(`^${fn}: t\\d+\\.csv row \\d+ \\(line \\d+\\), column "[abc]": `));
            }
          }
        },
      ),
      { numRuns: 150, seed: 21 },
    );
  });

  it("wrong column counts, empty input and garbage are refused by both readers with the same problem", async () => {
    const garbage = fc.oneof(
      fc.string({ maxLength: 60 }),
      fc.array(fc.array(fc.constantFrom("1", "2", "", '"', "x", ",", " "), { maxLength: 5 }).map((r) => r.join(",")), { maxLength: 6 }).map((l) => "a,b\n" + l.join("\n")),
      fc.constantFrom("", "\uFEFF", "\n\n\n", "a,b\n", "a,b\n1,2,3\n", "a,b\n1\n", 'a,b\n"1,2\n', "a;b\n1;2\n", "a,a\n1,2\n", "\u0000\u0001"),
    );
    await fc.assert(
      fc.asyncProperty(garbage, async (text) => {
        const { whole, streamed } = await both(write(text), { columns: ["a", "b"] });
        if (whole instanceof Error || streamed instanceof Error) {
          // readTable refuses a file without data rows; the stream allows zero rows (documented). Otherwise they agree.
          const headerOnly = !(whole instanceof Error) || /has a header but no data rows/.test(whole.message);
          if (!(headerOnly && !(streamed instanceof Error))) {
            expect(whole).toBeInstanceOf(RangeError);
            expect(streamed).toBeInstanceOf(RangeError);
            expect((streamed as Error).message.replace(/^openTableStream/, "")).toBe((whole as Error).message.replace(/^readTable/, ""));
          }
        } else {
          expect(streamed).toEqual(whole);
          for (const r of whole.rows) for (const v of r) expect(Number.isFinite(v)).toBe(true);
        }
      }),
      { numRuns: 200, seed: 22 },
    );
  });

  it("very long lines (a 1 MB label, a 300-digit number) are read, or refused with a short message", async () => {
    const label = "q".repeat(1_000_000);
    const ok = await both(write(`a,kind\n1,${label}\n2,"${label}"\n`), { columns: ["a"], categorical: ["kind"] });
    expect(ok.whole).toEqual({ rows: [[1], [2]], labels: { kind: [label, label] } });
    expect(ok.streamed).toEqual(ok.whole);
    const long = await both(write(`a\n${"9".repeat(300)}\n${"9".repeat(400)}\n`), { columns: ["a"] });
    for (const e of [long.whole, long.streamed]) {
      expect(e).toBeInstanceOf(RangeError);
      expect((e as Error).message).toMatch(/row 2 \(line 3\), column "a": .*… \(400 characters\) is not a finite number/);
      expect((e as Error).message.length).toBeLessThan(200);
    }
  });
});
