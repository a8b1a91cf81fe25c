import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { expectCleanOutcome, spawnCli } from "./reliability-cli-run.js";
import { runCli } from "./run-cli.js";

// Every command that writes a file: temporary name, fsync, rename; refusals before any work; one writer.
const root = fileURLToPath(new URL("../../", import.meta.url));
const BIN = join(root, "packages/bench/bin/floorcast.js");
const scenario = join(root, "datasets/scenarios/larkspur-terraces.json");
const branin = join(root, "datasets/problems/standard-branin.json");
const dir = mkdtempSync(join(tmpdir(), "floorcast-outputs-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const p = (name: string) => join(dir, name);
// SHA-256 (FIPS 180-4) of the file as read back, by Node's crypto.
const sha = (f: string) => createHash("sha256").update(readFileSync(f)).digest("hex");
const KEEP = "keep me\n";

// y = a + 2b (derived), 8 distinct rows.
const TRAIN = "a,b,y\n" + [[1, 2], [2, 3], [3, 1], [4, 4], [5, 2], [6, 1], [7, 3], [8, 5]].map(([a, b]) => `${a},${b},${a! + 2 * b!}`).join("\n") + "\n";
beforeAll(async () => {
  writeFileSync(p("train.csv"), TRAIN);
  const fit = await runCli(["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", p("model.json")]);
  expect(fit.code, fit.err).toBe(0);
  for (const k of [1, 2]) {
    const s = await runCli(["sample", "--scenario", scenario, "--n", "6", "--seed", "1", "--design", "lhs", "--shard", `${k}/2`, "--out", p(`shard${k}.csv`)]);
    expect(s.code, s.err).toBe(0);
  }
});

/** Each writing command with its output (file or folder) and the files its output check refuses to replace. */
const commands: { name: string; args: (out: string) => string[]; files: (out: string) => string[] }[] = [
  { name: "design", args: (o) => ["design", "--n", "4", "--dims", "2", "--seed", "1", "--out", o], files: (o) => [o] },
  { name: "sample", args: (o) => ["sample", "--scenario", scenario, "--n", "4", "--seed", "1", "--design", "lhs", "--out", o], files: (o) => [o] },
  { name: "merge", args: (o) => ["merge", p("shard1.csv"), p("shard2.csv"), "--out", o], files: (o) => [o] },
  { name: "fit", args: (o) => ["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", o], files: (o) => [o] },
  { name: "predict", args: (o) => ["predict", "--model", p("model.json"), "--data", p("train.csv"), "--out", o], files: (o) => [o] },
  { name: "assess", args: (o) => ["assess", "--model", p("model.json"), "--data", p("train.csv"), "--target", "y", "--out", o], files: (o) => [join(o, "report.json")] },
  { name: "optimize", args: (o) => ["optimize", "--problem", branin, "--exact", "--optimizer", "random", "--budget", "5", "--out", o], files: (o) => [join(o, "optimum.json")] },
  { name: "bench", args: (o) => ["bench", "--suite", "standard", "--problem", "standard-forrester", "--quick", "--no-peers", "--seeds", "1", "--out", o], files: (o) => [join(o, "report.md")] },
];

describe("every writing command: --force has one meaning", () => {
  for (const c of commands) {
    it(`${c.name}: an existing output is refused (exit 2, kept byte for byte) before any work`, async () => {
      const out = p(`exists-${c.name}`);
      const files = c.files(out);
      if (files[0] !== out) mkdirSync(out);
      for (const f of files) writeFileSync(f, KEEP);
      const r = await runCli(c.args(out));
      expectCleanOutcome(r, [2], c.name);
      // sample and merge report through their library functions (writeDataset, mergeShards)
      expect(r.err).toMatch(new RegExp(`^floorcast: (${c.name}|writeDataset|mergeShards): .* already exists; use --force`, "m"));
      for (const f of files) expect(readFileSync(f, "utf8")).toBe(KEEP);
      expect(readdirSync(files[0] === out ? dir : out).filter((f) => /\.(partial|lock)$/.test(f))).toEqual([]);
    });
  }
  it("with --force the output is replaced (design, fit, predict)", async () => {
    for (const c of commands.filter((c) => ["design", "fit", "predict"].includes(c.name))) {
      const out = p(`force-${c.name}`);
      writeFileSync(out, KEEP);
      const r = await runCli([...c.args(out), "--force"]);
      expect(r.code, r.err).toBe(0);
      expect(readFileSync(out, "utf8")).not.toBe(KEEP);
    }
  });
});

describe("outputs that cannot or must not be written are found before any work", () => {
  it("an output that is an input is refused even with --force, and the input is untouched", async () => {
    const cases = [
      ["fit", "--data", p("train.csv"), "--inputs", "a,b", "--target", "y", "--restarts", "1", "--force", "--out", p("train.csv")],
      ["predict", "--model", p("model.json"), "--data", p("train.csv"), "--force", "--out", p("train.csv")],
      ["predict", "--model", p("model.json"), "--data", p("train.csv"), "--force", "--out", p("model.json")],
      ["merge", p("shard1.csv"), p("shard2.csv"), "--force", "--out", p("shard2.csv")],
    ];
    const before = [sha(p("train.csv")), sha(p("model.json")), sha(p("shard2.csv"))];
    for (const args of cases) {
      const r = await runCli(args);
      expectCleanOutcome(r, [2], args[0]);
      expect(r.err).toMatch(/is also an input/);
    }
    expect([sha(p("train.csv")), sha(p("model.json")), sha(p("shard2.csv"))]).toEqual(before);
  });
  it("an unwritable --out is named before the inputs are even read", async () => {
    const missing = p("no-such-input.csv");
    const file = p("plain-file");
    writeFileSync(file, "x");
    const cases = [
      ["fit", "--data", missing, "--inputs", "a,b", "--target", "y", "--out", join(dir, "nope", "m.json")],
      ["predict", "--model", p("model.json"), "--data", missing, "--out", join(dir, "nope", "p.csv")],
      ["assess", "--model", p("model.json"), "--data", missing, "--target", "y", "--out", join(file, "sub")],
      ["optimize", "--problem", missing, "--exact", "--out", join(file, "sub")],
    ];
    for (const args of cases) {
      const r = await runCli(args);
      expectCleanOutcome(r, [2], args[0]);
      expect(r.err, args[0]).not.toMatch(/no-such-input/);
      expect(r.err, args[0]).toMatch(/nope|plain-file/);
    }
  });
  it("predict --out /dev/full (a device) is a usage error, exit 2, with or without --force", async () => {
    for (const extra of [[], ["--force"]]) {
      const r = await runCli(["predict", "--model", p("model.json"), "--data", p("train.csv"), ...extra, "--out", "/dev/full"]);
      expectCleanOutcome(r, [2], "predict /dev/full");
      expect(r.err).toMatch(/not a regular file/);
    }
  });
});

describe("one writer per output; nothing partial under a final name", () => {
  it("two sample runs on one --out: exactly one writes, the other exits 2; the manifest matches the file", async () => {
    const out = p("shared.csv");
    const args = ["sample", "--scenario", scenario, "--n", "3000", "--seed", "2", "--design", "lhs", "--out", out];
    const [a, b] = await Promise.all([spawnCli(args, "", 120_000), spawnCli(args, "", 120_000)]);
    expect([a.code, b.code].sort(), `${a.err}\n${b.err}`).toEqual([0, 2]);
    expect(`${a.err}${b.err}`).toMatch(/is being written by run \d+|already exists/);
    const manifest = JSON.parse(readFileSync(out.replace(/\.csv$/, ".manifest.json"), "utf8"));
    expect(manifest.csv.sha256).toBe(sha(out));
    expect(manifest.csv.bytes).toBe(readFileSync(out).length);
    expect(readFileSync(out, "utf8").trimEnd().split("\n")).toHaveLength(3001);
    expect(readdirSync(dir).filter((f) => f.startsWith("shared.csv."))).toEqual([]);
  }, 240_000);
  // The probe: run a writer over an existing file holding KEEP, freeze it (SIGSTOP) at the first new byte under the
  // final name or its temporary name, read the final name while it is frozen, then SIGKILL it. An atomic writer
  // leaves KEEP or the whole new file at both moments; a writer that streams into the final name is caught with a
  // short file. The same probe is run on a deliberately non-atomic writer (the sampler's CSV writer pointed at
  // the final name, as predict wrote before it claimed its output), so the check is shown able to fail.
  const ROWS = 120_000;
  const atomicOutcome = (text: string): boolean => text === KEEP || (text.endsWith("\n") && text.trimEnd().split("\n").length === ROWS + 1);
  /** Linux process state from /proc (T stopped, Z exited and not yet reaped), or "" when it is gone. */
  const stateOf = (pid: number): string => {
    try {
      return readFileSync(`/proc/${pid}/stat`, "utf8").replace(/^.*\) /s, "")[0] ?? "";
    } catch {
      return "";
    }
  };
  async function freezeAtFirstWrite(args: string[], out: string): Promise<{ midRun: boolean; whileFrozen: string; afterKill: string }> {
    writeFileSync(out, KEEP);
    rmSync(`${out}.partial`, { force: true });
    rmSync(`${out}.lock`, { force: true });
    const child = spawn(process.execPath, args, { cwd: root, stdio: "ignore" });
    let exited = false;
    const ended = new Promise<void>((resolve) =>
      child.on("close", () => {
        exited = true;
        resolve();
      }),
    );
    const size = (f: string): number => (existsSync(f) ? readFileSync(f).length : 0);
    const guard = Date.now() + 120_000; // a hang guard only: the probe itself does not depend on timing
    let midRun = false;
    while (!exited && Date.now() < guard) {
      if (size(`${out}.partial`) > 0 || readFileSync(out, "utf8") !== KEEP) {
        child.kill("SIGSTOP");
        let state = stateOf(child.pid!);
        while (state !== "T" && state !== "Z" && state !== "") state = stateOf(child.pid!); // the stop is delivered asynchronously
        midRun = state === "T";
        break;
      }
      await new Promise((r) => setTimeout(r, 1));
    }
    const whileFrozen = readFileSync(out, "utf8");
    child.kill("SIGKILL");
    await ended;
    return { midRun, whileFrozen, afterKill: readFileSync(out, "utf8") };
  }
  it("predict frozen and killed while writing leaves the previous file, never a short one; a non-atomic writer fails the same probe", async () => {
    const rows = ["a,b"];
    for (let i = 0; i < ROWS; i++) rows.push(`${1 + (i % 8)},${1 + ((i * 7) % 5)}`);
    writeFileSync(p("many.csv"), `${rows.join("\n")}\n`);
    const out = p("pred.csv");
    // the control: the CSV writer streaming into the final name, the same number of rows
    const streamed = `import { createCsvWriter } from "@floorcast/sampler";
      const w = createCsvWriter(${JSON.stringify(out)}, ["a", "b", "y_mean"]);
      for (let i = 0; i < ${ROWS}; i++) {
        await w.write([1, 2, 5]);
        // halfway it waits for the probe, so the probe catches it mid-run however loaded the machine is
        if (i === ${ROWS / 2}) await new Promise((resolve) => setTimeout(resolve, 600_000));
      }
      await w.close();`;
    const control = await freezeAtFirstWrite(["--input-type=module", "-e", streamed], out);
    expect(control.midRun).toBe(true);
    expect(atomicOutcome(control.whileFrozen)).toBe(false);
    expect(atomicOutcome(control.afterKill)).toBe(false);
    // predict: frozen mid-run at its first byte in at least one of three tries (a try where the run ended before
    // the probe saw a byte proves nothing), and every try leaves the previous file or the whole new one
    let caught = 0;
    for (let attempt = 0; attempt < 3 && caught === 0; attempt++) {
      const r = await freezeAtFirstWrite([BIN, "predict", "--model", p("model.json"), "--data", p("many.csv"), "--force", "--out", out], out);
      expect(atomicOutcome(r.whileFrozen), "while frozen").toBe(true);
      expect(atomicOutcome(r.afterKill), "after SIGKILL").toBe(true);
      if (r.midRun) {
        caught += 1;
        expect(r.whileFrozen).toBe(KEEP);
        expect(r.afterKill).toBe(KEEP);
      }
    }
    expect(caught).toBe(1);
  }, 400_000);
});

describe("predict reports a row it cannot predict in place", () => {
  it("rows far beyond the model's domain get an error in their row; the others are predicted; exit 1", async () => {
    writeFileSync(p("far.csv"), "a,b\n2,3\n1e160,3\n5,2\n4,-1e200\n");
    const out = p("far-pred.csv");
    const r = await runCli(["predict", "--model", p("model.json"), "--data", p("far.csv"), "--out", out]);
    expectCleanOutcome(r, [1], "far rows");
    expect(r.err).toMatch(/data row 2 of far\.csv: input a = 1e\+160 lies more than 1e\+150 training ranges outside the model's domain/);
    expect(r.err).toMatch(/2 of 4 rows could not be predicted/);
    const lines = readFileSync(out, "utf8").trimEnd().split("\n");
    // the data's own columns first, then the predictions, in_domain and error
    expect(lines[0]).toBe("a,b,y_mean,y_sd,in_domain,error");
    expect(lines).toHaveLength(5);
    // y = a + 2b (derived): the GP interpolates its own training rows' neighbourhood closely
    expect(Number(lines[1]!.split(",")[2])).toBeCloseTo(8, 0);
    expect(lines[2]).toMatch(/^1e\+160,3,,,0,input a = 1e\+160 lies more than/);
    expect(Number(lines[3]!.split(",")[2])).toBeCloseTo(9, 0);
    expect(lines[4]).toMatch(/^4,-1e\+200,,,0,input b = -1e\+200 lies more than/);
  });
});

describe("merge checks each shard's row count", () => {
  it("a manifest whose row count is not its shard's range is refused (exit 2), naming it", async () => {
    const { copyFileSync } = await import("node:fs");
    for (const s of [1, 2]) {
      copyFileSync(p(`shard${s}.csv`), p(`rc${s}.csv`));
      copyFileSync(p(`shard${s}.manifest.json`), p(`rc${s}.manifest.json`));
    }
    const m = JSON.parse(readFileSync(p("rc1.manifest.json"), "utf8"));
    m.rows = m.rows + 2;
    writeFileSync(p("rc1.manifest.json"), JSON.stringify(m, null, 2));
    const r = await runCli(["merge", p("rc1.csv"), p("rc2.csv"), "--out", p("rc-all.csv")]);
    expectCleanOutcome(r, [2], "merge rows");
    expect(r.err).toMatch(/rc1\.csv: its manifest says 5 rows but shard 1\/2 covers 3/);
    expect(existsSync(p("rc-all.csv"))).toBe(false);
  });
});
