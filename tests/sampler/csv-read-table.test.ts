import { afterAll, describe, expect, it } from "vitest";
import { mkdtempSync, rmSync, writeFileSync, mkdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { openTableStream, readTable } from "@floorcast/sampler";

const dir = mkdtempSync(join(tmpdir(), "floorcast-csv-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
let count = 0;
function file(text: string | Buffer): string {
  const p = join(dir, `t${count++}.csv`);
  writeFileSync(p, text);
  return p;
}

describe("readTable: RFC 4180 format details", () => {
  it("reads CRLF line ends (RFC 4180 §2 item 1: records end in CRLF)", async () => {
    const t = await readTable(file("a,b\r\n1,2\r\n3,4\r\n"));
    expect(t.header).toEqual(["a", "b"]);
    expect(t.rows).toEqual([[1, 2], [3, 4]]);
  });
  it("reads a last record without a line break (RFC 4180 §2 item 2)", async () => {
    expect((await readTable(file("a,b\n1,2\n3,4"))).rows).toEqual([[1, 2], [3, 4]]);
  });
  it("skips a UTF-8 byte-order mark before the header", async () => {
    const t = await readTable(file(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from("x,y\n5,6\n")])));
    expect(t.header).toEqual(["x", "y"]);
    expect(t.rows).toEqual([[5, 6]]);
  });
  it("reads quoted fields, doubled quotes and line breaks inside quotes (RFC 4180 §2 items 5-7)", async () => {
    const t = await readTable(file('"a","note, with comma"\r\n"1","say ""hi""\r\nagain"\r\n2,plain\r\n'), {
      columns: ["a"],
      categorical: ["note, with comma"],
    });
    expect(t.rows).toEqual([[1], [2]]);
    expect(t.categorical["note, with comma"]).toEqual(['say "hi"\r\nagain', "plain"]);
  });
  it("reads the header-named columns in the order asked, and inputs/targets into x and y", async () => {
    const p = file("u,v,w,limitedBy\n1,2,3,far\n4,5,6,height\n");
    const t = await readTable(p, { inputs: ["w", "u"], targets: ["v"], categorical: ["limitedBy"] });
    expect(t.columns).toEqual(["w", "u", "v"]);
    expect(t.x).toEqual([[3, 1], [6, 4]]);
    expect(t.y).toEqual([[2], [5]]);
    expect(t.categorical.limitedBy).toEqual(["far", "height"]);
  });
  it("parses numbers exactly (negative, exponent, leading dot, spaces around)", async () => {
    const t = await readTable(file("a\n-0.1\n1e-300\n.5\n 7 \n+3E2\n"));
    expect(t.rows.map((r) => r[0])).toEqual([-0.1, 1e-300, 0.5, 7, 300]);
  });
});

describe("readTable: errors name the file, the row and the column", () => {
  it("an empty file", async () => {
    await expect(readTable(file(""))).rejects.toThrow(/readTable: t\d+\.csv is empty \(no header row\)/);
  });
  it("a file of blank lines only, or a BOM only, is empty too", async () => {
    await expect(readTable(file("\n\n\n"))).rejects.toThrow(/is empty/);
    await expect(readTable(file("\r\n\r\n"))).rejects.toThrow(/is empty/);
    await expect(readTable(file(Buffer.from([0xef, 0xbb, 0xbf])))).rejects.toThrow(/is empty/);
  });
  it("a header without data rows", async () => {
    await expect(readTable(file("a,b\n"))).rejects.toThrow(/has a header but no data rows/);
  });
  it("missing columns are named, with the columns the file has", async () => {
    const p = file("frontage,depth,gfa\n1,2,3\n");
    await expect(readTable(p, { inputs: ["frontage", "skew"], targets: ["far"] })).rejects.toThrow(
      /readTable: t\d+\.csv is missing columns "skew", "far"; it has "frontage", "depth", "gfa"/,
    );
    await expect(readTable(p, { categorical: ["limitedBy"] })).rejects.toThrow(/missing column "limitedBy"/);
  });
  it("a semicolon- or tab-separated file gets a hint", async () => {
    await expect(readTable(file("a;b\n1;2\n"), { columns: ["a"] })).rejects.toThrow(/looks ";"-separated/);
    await expect(readTable(file("a\tb\n1\t2\n"), { columns: ["b"] })).rejects.toThrow(/looks "\\t"-separated/);
  });
  it("a non-numeric cell names row, line and column", async () => {
    const p = file("a,b\n1,2\n3,abc\n");
    await expect(readTable(p)).rejects.toThrow(/t\d+\.csv row 2 \(line 3\), column "b": "abc" is not a number/);
  });
  it("the line number counts blank lines and line breaks inside quotes", async () => {
    const p = file('a,b\r\n1,"x\r\ny"\r\n\r\n2,3\r\n4,oops\r\n');
    await expect(readTable(p, { columns: ["a", "b"] })).rejects.toThrow(/row 1 \(line 2\), column "b"/);
    await expect(readTable(p, { columns: ["a"], categorical: ["b"] }).then(() => "ok")).resolves.toBe("ok");
    const q = file('a,b\r\n1,"x\r\ny"\r\n\r\n2,3\r\nz,4\r\n');
    await expect(readTable(q, { columns: ["a"], categorical: ["b"] })).rejects.toThrow(/row 3 \(line 6\), column "a"/);
  });
  it("empty, NaN, Infinity and hexadecimal cells are refused", async () => {
    await expect(readTable(file("a,b\n1,\n"))).rejects.toThrow(/row 1 \(line 2\), column "b": is empty/);
    await expect(readTable(file("a\nNaN\n"))).rejects.toThrow(/"NaN" is not a number/);
    await expect(readTable(file("a\nInfinity\n"))).rejects.toThrow(/"Infinity" is not a number/);
    await expect(readTable(file("a\n0x10\n"))).rejects.toThrow(/"0x10" is not a number/);
    await expect(readTable(file("a\n1e999\n"))).rejects.toThrow(/"1e999" is not a finite number/);
  });
  it("a text column not named categorical gets a hint", async () => {
    await expect(readTable(file("a,limitedBy\n1,far\n"))).rejects.toThrow(/options\.categorical/);
  });
  it("ragged rows name the row", async () => {
    await expect(readTable(file("a,b,c\n1,2,3\n4,5\n"))).rejects.toThrow(
      /row 2 \(line 3\) has 2 fields; the header has 3/,
    );
    await expect(readTable(file("a,b\n1,2,3\n"))).rejects.toThrow(/row 1 \(line 2\) has 3 fields; the header has 2/);
  });
  it("an unclosed quote is reported with the file name", async () => {
    await expect(readTable(file('a,b\n1,"2\n'))).rejects.toThrow(/readTable: t\d+\.csv: .*quote/i);
  });
  it("duplicate header names and a column both numeric and categorical", async () => {
    await expect(readTable(file("a,a\n1,2\n"))).rejects.toThrow(/column "a" twice/);
    await expect(readTable(file("a,b\n1,2\n"), { columns: ["a"], categorical: ["a"] })).rejects.toThrow(
      /both as numeric and as categorical/,
    );
  });
  it("a missing file or a directory is a RangeError naming the path; bad options are TypeErrors", async () => {
    await expect(readTable(join(dir, "nope.csv"))).rejects.toThrow(RangeError);
    await expect(readTable(join(dir, "nope.csv"))).rejects.toThrow(/cannot read .*nope\.csv: ENOENT/);
    mkdirSync(join(dir, "sub"));
    await expect(readTable(join(dir, "sub"))).rejects.toThrow(/is not a file/);
    await expect(readTable("")).rejects.toThrow(TypeError);
    await expect(readTable(file("a\n1\n"), { columns: "a" as unknown as string[] })).rejects.toThrow(TypeError);
  });
});

describe("openTableStream", () => {
  it("gives the header at once and rows one at a time with row and line numbers", async () => {
    const s = await openTableStream(file("k,v,tag\n1,2,x\n\n3,4,y\n"), { categorical: ["tag"] });
    expect(s.header).toEqual(["k", "v", "tag"]);
    expect(s.columns).toEqual(["k", "v"]);
    const got = [];
    for await (const r of s) got.push(r);
    expect(got).toEqual([
      { row: 1, line: 2, values: [1, 2], labels: ["x"] },
      { row: 2, line: 4, values: [3, 4], labels: ["y"] },
    ]);
  });
  it("allows a header-only file (zero rows) and stops early on break", async () => {
    const s = await openTableStream(file("a\n"));
    let n = 0;
    for await (const _ of s) n++;
    expect(n).toBe(0);
    const t = await openTableStream(file("a\n1\n2\n3\n"));
    for await (const r of t) if (r.row === 1) break;
    t.close();
  });
  it("errors from openTableStream start with its own name", async () => {
    await expect(openTableStream(file(""))).rejects.toThrow(/^openTableStream: /);
  });
});
