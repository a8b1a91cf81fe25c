import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { PassThrough } from "node:stream";
import { createCsvWriter, formatCsvValue, readTable } from "@floorcast/sampler";

const dir = mkdtempSync(join(tmpdir(), "floorcast-csvw-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("formatCsvValue", () => {
  it("uses the shortest round-trip text for numbers (ECMAScript Number::toString)", () => {
    expect(formatCsvValue(0.1)).toBe("0.1");
    expect(formatCsvValue(1 / 3)).toBe("0.3333333333333333");
    expect(formatCsvValue(1e21)).toBe("1e+21");
    expect(formatCsvValue(5e-324)).toBe("5e-324");
    expect(formatCsvValue(-0)).toBe("0");
    expect(formatCsvValue(true)).toBe("true");
    expect(formatCsvValue("far")).toBe("far");
  });
  it("refuses NaN, ±Infinity and other types", () => {
    expect(() => formatCsvValue(NaN)).toThrow(RangeError);
    expect(() => formatCsvValue(Infinity, "gfa")).toThrow(/gfa must be finite, got Infinity/);
    expect(() => formatCsvValue(-Infinity)).toThrow(RangeError);
    expect(() => formatCsvValue(null as unknown as number)).toThrow(TypeError);
  });
});

describe("createCsvWriter", () => {
  it("quotes commas, quotes and line breaks as RFC 4180 §2 items 6-7 require, and reads back", async () => {
    const p = join(dir, "q.csv");
    const w = createCsvWriter(p, ["a", "note"]);
    await w.write([1, 'x, "y"']);
    await w.write({ a: 2.5, note: "line\nbreak" });
    await w.close();
    expect(readFileSync(p, "utf8")).toBe('a,note\n1,"x, ""y"""\n2.5,"line\nbreak"\n');
    const t = await readTable(p, { columns: ["a"], categorical: ["note"] });
    expect(t.categorical.note).toEqual(['x, "y"', "line\nbreak"]);
    expect(w.rowsWritten).toBe(2);
  });
  it("quotes a lone CR too (a reader may take it for a line end)", async () => {
    const p = join(dir, "cr.csv");
    const w = createCsvWriter(p, ["a", "b"]);
    await w.write([1, "r\rx"]);
    await w.close();
    expect(readFileSync(p, "utf8")).toBe('a,b\n1,"r\rx"\n');
  });
  it("appends without a header", async () => {
    const p = join(dir, "a.csv");
    const w = createCsvWriter(p, ["a"]);
    await w.write([1]);
    await w.close();
    const w2 = createCsvWriter(p, ["a"], { header: false, append: true });
    await w2.write([2]);
    await w2.close();
    expect(readFileSync(p, "utf8")).toBe("a\n1\n2\n");
  });
  it("writes to a stream", async () => {
    const s = new PassThrough();
    const chunks: Buffer[] = [];
    s.on("data", (c: Buffer) => chunks.push(c));
    const w = createCsvWriter(s, ["x", "y"]);
    await w.write([1, true]);
    await w.close();
    expect(Buffer.concat(chunks).toString()).toBe("x,y\n1,true\n");
  });
  it("rejects bad columns and bad rows", async () => {
    expect(() => createCsvWriter(join(dir, "b.csv"), [])).toThrow(RangeError);
    expect(() => createCsvWriter(join(dir, "b.csv"), ["a", "a"])).toThrow(/unique/);
    expect(() => createCsvWriter(join(dir, "b.csv"), [1] as unknown as string[])).toThrow(TypeError);
    const w = createCsvWriter(join(dir, "c.csv"), ["a", "b"]);
    await expect(w.write([1])).rejects.toThrow(/row 1 has 1 values, expected 2/);
    await expect(w.write({ a: 1 })).rejects.toThrow(/row 1 lacks "b"/);
    await expect(w.write([1, NaN])).rejects.toThrow(/column "b" must be finite/);
    await w.close();
  });
  it("a file in a missing directory fails on close with the error", async () => {
    const w = createCsvWriter(join(dir, "no", "such", "x.csv"), ["a"]);
    await expect(w.write([1]).then(() => w.close())).rejects.toThrow(/ENOENT/);
  });
});
