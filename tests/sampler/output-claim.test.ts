import { afterAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { existsSync, linkSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { hostname, tmpdir } from "node:os";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import { acquireOutputLock, checkOutputPath, claimOutput, lockPathFor, writeFileAtomically } from "@floorcast/sampler";

const root = mkdtempSync(join(tmpdir(), "floorcast-claim-"));
afterAll(() => rmSync(root, { recursive: true, force: true }));
let k = 0;
const fresh = (): string => {
  const d = join(root, `d${k++}`);
  mkdirSync(d);
  return d;
};
// SHA-256 as FIPS 180-4 defines it, computed by Node's crypto on the bytes read back.
const sha = (p: string) => createHash("sha256").update(readFileSync(p)).digest("hex");

describe("checkOutputPath", () => {
  it("refuses an existing file without force, a missing or non-folder parent, and a device even with force", () => {
    const d = fresh();
    const f = join(d, "a.csv");
    expect(() => checkOutputPath(f, { fn: "t" })).not.toThrow();
    writeFileSync(f, "old\n");
    expect(() => checkOutputPath(f, { fn: "t" })).toThrow(/^t: .*a\.csv already exists; use --force/);
    expect(() => checkOutputPath(f, { fn: "t", force: true })).not.toThrow();
    expect(() => checkOutputPath(join(d, "no", "x.csv"), { fn: "t" })).toThrow(/cannot write .*x\.csv: the folder .* does not exist/);
    expect(() => checkOutputPath(join(f, "x.csv"), { fn: "t" })).toThrow(/is not a folder/);
    expect(() => checkOutputPath("/dev/full", { fn: "t", force: true })).toThrow(/it exists and is not a regular file/);
    expect(() => checkOutputPath(d, { fn: "t", force: true })).toThrow(/not a regular file/);
  });
  it("refuses an output that is an input: same path, another spelling, a symbolic link, a hard link", () => {
    const d = fresh();
    const data = join(d, "train.csv");
    writeFileSync(data, "a,y\n1,2\n");
    symlinkSync(data, join(d, "sym.csv"));
    linkSync(data, join(d, "hard.csv"));
    for (const out of [data, join(d, ".", "train.csv"), join(d, "sym.csv"), join(d, "hard.csv")]) {
      expect(() => checkOutputPath(out, { fn: "t", force: true, inputs: [data] }), out).toThrow(/is also an input/);
    }
    expect(() => checkOutputPath(join(d, "other.csv"), { fn: "t", inputs: [data] })).not.toThrow();
  });
});

describe("claimOutput", () => {
  it("writes under a temporary name and renames on commit; the digest is of the bytes on disk", async () => {
    const d = fresh();
    const out = join(d, "m.json");
    const claim = await claimOutput(out, { fn: "t" });
    expect(existsSync(lockPathFor(out))).toBe(true);
    await claim.put(out, "{\"a\":1}\n");
    expect(existsSync(out)).toBe(false);
    const digests = await claim.commit();
    expect(readFileSync(out, "utf8")).toBe("{\"a\":1}\n");
    expect(digests.get(out)).toEqual({ bytes: 8, sha256: sha(out) });
    expect(readdirSync(d)).toEqual(["m.json"]); // no temporary file, no lock
  });
  it("a failed run (released without commit) keeps the previous file and leaves nothing else", async () => {
    const d = fresh();
    const out = join(d, "p.csv");
    writeFileSync(out, "previous\n");
    const claim = await claimOutput(out, { fn: "t", force: true });
    writeFileSync(claim.temporary(out), "half a resu");
    await claim.release();
    expect(readFileSync(out, "utf8")).toBe("previous\n");
    expect(readdirSync(d)).toEqual(["p.csv"]);
  });
  it("a second claim of the same output is refused while the first holds it, and allowed after", async () => {
    const d = fresh();
    const out = join(d, "x.csv");
    const first = await claimOutput(out, { fn: "t" });
    await expect(claimOutput(out, { fn: "u" })).rejects.toThrow(new RegExp(`^u: .*x\\.csv is being written by run ${process.pid}`));
    await first.release();
    const second = await claimOutput(out, { fn: "u" });
    await second.release();
  });
  it("of many claims started together exactly one wins", async () => {
    const d = fresh();
    const out = join(d, "race.csv");
    const results = await Promise.allSettled(Array.from({ length: 8 }, () => claimOutput(out, { fn: "t" })));
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    for (const r of results) if (r.status === "fulfilled") await r.value.release();
  });
  it("a lock left by a dead process of this host is taken over; one of another host is not", async () => {
    const d = fresh();
    const out = join(d, "s.csv");
    // a process that has ended: its pid is free (pids are reused only after wrapping, far from here)
    const dead = spawnSync(process.execPath, ["-e", "process.stdout.write(String(process.pid))"]).stdout.toString();
    writeFileSync(lockPathFor(out), JSON.stringify({ pid: Number(dead), host: hostname() }));
    const release = await acquireOutputLock(out, "t");
    await release();
    expect(existsSync(lockPathFor(out))).toBe(false);
    writeFileSync(lockPathFor(out), JSON.stringify({ pid: Number(dead), host: `${hostname()}-elsewhere` }));
    await expect(acquireOutputLock(out, "t")).rejects.toThrow(/is being written by run \d+ on .*-elsewhere/);
  });
});

describe("writeFileAtomically", () => {
  it("replaces the whole file and leaves no temporary file", async () => {
    const d = fresh();
    const f = join(d, "c.json");
    writeFileSync(f, "old");
    await writeFileAtomically(f, "new contents");
    expect(readFileSync(f, "utf8")).toBe("new contents");
    expect(readdirSync(d)).toEqual(["c.json"]);
  });
});
