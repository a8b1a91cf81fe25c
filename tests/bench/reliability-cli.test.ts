import { afterAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { evaluateMassing, readTable } from "@floorcast/sampler";
import { loadSurrogate } from "@floorcast/surrogate";
import { expectCleanOutcome, spawnCli } from "./reliability-cli-run.js";
import { runCli as run } from "./run-cli.js";

const dir = mkdtempSync(join(tmpdir(), "floorcast-rel-cli-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const root = fileURLToPath(new URL("../../", import.meta.url));
const scenario = join(root, "datasets/scenarios/larkspur-terraces.json");
const branin = join(root, "datasets/problems/standard-branin.json");
const parcelFiles = ["--input", join(root, "datasets/parcels/quillmere-parcels.geojson"), "--zoning", join(root, "datasets/parcels/quillmere-zoning.json"), "--streets", join(root, "datasets/parcels/quillmere-streets.geojson")];
let fileNo = 0;
const file = (text: string, ext = "csv") => {
  const p = join(dir, `f${fileNo++}.${ext}`);
  writeFileSync(p, text);
  return p;
};
const outPath = (ext = "csv") => join(dir, `o${fileNo++}.${ext}`);

// A small, well-posed table: y = a + 2b (derived), 8 distinct rows.
const GOOD = "a,b,y\n" + [[1, 2], [2, 3], [3, 1], [4, 4], [5, 2], [6, 1], [7, 3], [8, 5]].map(([a, b]) => `${a},${b},${a! + 2 * b!}`).join("\n") + "\n";
const goodCsv = file(GOOD);
const model = outPath("json");
const fitted = await run(["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", model]);

/** Strings that are not numbers at all (Number() gives NaN): every numeric option must refuse them (exit 2). */
const notANumber = fc.oneof(
  fc.constantFrom("NaN", "Infinity", "-Infinity", "abc", "", " ", "1,5", "0x", "1e", "--", "１", "1 2", "+-1"),
  fc.string({ maxLength: 12 }).filter((s) => Number.isNaN(Number(s)) || s.trim() === ""),
);
/** Numbers no count or seed option accepts: non-integers, negative, overflowing to Infinity. */
const badCount = fc.constantFrom("1e309", "-1", "2.5", "1e-320", "-0.5", "-1e300");

// One numeric option of each command with a context in which every other option is valid.
const numericOptions: [string, (v: string) => string[]][] = [
  ["design --n", (v) => ["design", "--n", v, "--dims", "2", "--seed", "1", "--out", outPath()]],
  ["design --dims", (v) => ["design", "--n", "4", "--dims", v, "--seed", "1", "--out", outPath()]],
  ["design --seed", (v) => ["design", "--n", "4", "--dims", "2", "--seed", v, "--out", outPath()]],
  ["sample --n", (v) => ["sample", "--scenario", scenario, "--n", v, "--seed", "1", "--design", "lhs", "--out", outPath()]],
  ["sample --seed", (v) => ["sample", "--scenario", scenario, "--n", "4", "--seed", v, "--design", "lhs", "--out", outPath()]],
  ["fit --restarts", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", v, "--out", outPath("json")]],
  ["fit --seed", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--seed", v, "--out", outPath("json")]],
  ["fit --subset", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--subset", v, "--out", outPath("json")]],
  ["fit --epochs", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--model", "nn", "--epochs", v, "--out", outPath("json")]],
  ["fit --ensemble", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--ensemble", v, "--out", outPath("json")]],
  ["assess --folds", (v) => ["assess", "--model", model, "--data", goodCsv, "--target", "y", "--train", goodCsv, "--folds", v, "--out", outPath("d")]],
  ["assess --seed", (v) => ["assess", "--model", model, "--data", goodCsv, "--target", "y", "--seed", v, "--out", outPath("d")]],
  ["optimize --budget", (v) => ["optimize", "--problem", branin, "--exact", "--optimizer", "random", "--budget", v, "--out", outPath("d")]],
  ["optimize --seed", (v) => ["optimize", "--problem", branin, "--exact", "--optimizer", "random", "--budget", "5", "--seed", v, "--out", outPath("d")]],
  ["rank-parcels --budget", (v) => ["rank-parcels", ...parcelFiles, "--budget", v, "--out", outPath("geojson"), "--summary", outPath("s")]],
  ["rank-parcels --training-rows", (v) => ["rank-parcels", ...parcelFiles, "--training-rows", v, "--out", outPath("geojson"), "--summary", outPath("s")]],
  ["bench --seeds", (v) => ["bench", "--suite", "standard", "--problem", "standard-forrester", "--quick", "--no-peers", "--seeds", v, "--out", outPath("d")]],
];
// Real-valued options: NaN, ±Infinity and values outside their range.
const realOptions: [string, (v: string) => string[], string[]][] = [
  ["rank-parcels --street-distance", (v) => ["rank-parcels", ...parcelFiles, "--street-distance", v, "--route", "exact", "--out", outPath("geojson"), "--summary", outPath("s")], ["-1", "1e309"]],
  ["fit --noise", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--noise", v, "--out", outPath("json")], ["-1", "1e309", "-1e-9"]],
  ["fit --learning-rate", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--model", "nn", "--epochs", "2", "--learning-rate", v, "--out", outPath("json")], ["0", "-1", "1e309"]],
  ["fit --conformal", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--conformal", v, "--out", outPath("json")], ["0", "1", "1.5", "-0.1", "1e309"]],
  ["fit --calibration-fraction", (v) => ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--conformal", "0.8", "--calibration-fraction", v, "--out", outPath("json")], ["0", "1", "-0.5", "1e309"]],
];

describe("every floorcast command under hostile input (in-process)", () => {
  it("the fixture model was fitted", () => {
    expectCleanOutcome(fitted, [0], "fit fixture");
  });

  it("the commands tested here are the commands `floorcast --help` lists", async () => {
    const r = await run(["--help"]);
    expect(r.code).toBe(0);
    const listed = [...r.out.matchAll(/^ {2}([a-z-]+) /gm)].map((m) => m[1]).filter((c) => c !== "help").sort();
    expect(listed).toEqual(["assess", "bench", "demo", "design", "fit", "massing", "merge", "optimize", "parcels", "predict", "rank-parcels", "sample"]);
  });

  it("exit status 2 with a one-line message for an unknown option, on every command", async () => {
    for (const c of ["assess", "bench", "demo", "design", "fit", "massing", "merge", "optimize", "parcels", "predict", "rank-parcels", "sample"]) {
      const r = await run([c, "--no-such-option"]);
      expectCleanOutcome(r, [2], c);
      // commander names the first problem it meets: the unknown option, or a required option left out.
      expect(r.err).toMatch(/unknown option '--no-such-option'|required option '--[a-z-]+ <[^>]+>' not specified/);
    }
    expectCleanOutcome(await run(["no-such-command"]), [2], "unknown command");
  });

  it("exit status 2 naming the file for a missing input file, on every command that reads one", async () => {
    const missing = join(dir, "does-not-exist.json");
    const cases: string[][] = [
      ["massing", "--input", missing],
      ["parcels", "--input", missing, "--out", outPath("geojson")],
      ["rank-parcels", "--input", missing, "--out", outPath("geojson"), "--summary", outPath("s")],
      ["rank-parcels", ...parcelFiles.slice(0, 2), "--zoning", missing, "--out", outPath("geojson"), "--summary", outPath("s")],
      ["sample", "--scenario", missing, "--n", "4", "--seed", "1", "--out", outPath()],
      ["merge", missing, "--out", outPath()],
      ["fit", "--data", missing, "--inputs", "a", "--target", "y", "--out", outPath("json")],
      ["predict", "--model", missing, "--data", goodCsv, "--out", outPath()],
      ["predict", "--model", model, "--data", missing, "--out", outPath()],
      ["assess", "--model", missing, "--data", goodCsv, "--target", "y", "--out", outPath("d")],
      ["optimize", "--problem", missing, "--exact", "--out", outPath("d")],
      ["bench", "--problems", missing, "--out", outPath("d")],
    ];
    for (const args of cases) {
      const r = await run(args);
      expectCleanOutcome(r, [2], args.join(" "));
      expect(r.err, args.join(" ")).toContain("does-not-exist");
    }
  });

  it("exit status 2 (not 1) when an output file cannot be written", async () => {
    const nowhere = join(dir, "no-such-dir", "x");
    const cases: string[][] = [
      ["design", "--n", "4", "--dims", "2", "--seed", "1", "--out", `${nowhere}.csv`],
      ["sample", "--scenario", scenario, "--n", "4", "--seed", "1", "--design", "lhs", "--out", `${nowhere}.csv`],
      ["fit", "--data", goodCsv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", `${nowhere}.json`],
      ["predict", "--model", model, "--data", goodCsv, "--out", `${nowhere}.csv`],
      ["rank-parcels", ...parcelFiles, "--route", "exact", "--out", `${nowhere}.geojson`, "--summary", nowhere],
    ];
    for (const args of cases) expectCleanOutcome(await run(args), [2], args.join(" "));
  });

  it("a numeric option that is not a number, or not an allowed count, is a usage error (2) on every command", async () => {
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...numericOptions), fc.oneof(notANumber, badCount), async ([label, args], v) => {
        const r = await run(args(v));
        expectCleanOutcome(r, [2], `${label} ${JSON.stringify(v)}`);
      }),
      { numRuns: 120, seed: 8 },
    );
    for (const [label, args, bad] of realOptions) {
      for (const v of ["NaN", "Infinity", "abc", "", ...bad]) expectCleanOutcome(await run(args(v)), [2], `${label} ${JSON.stringify(v)}`);
    }
  }, 60_000);

  it("massing: hostile JSON Lines (BOM, CRLF, blank lines, wrong types, NaN-like strings, huge and tiny values, garbage) — one answer per line, in order, exit 1 iff some failed", async () => {
    const base = {
      parcel: { vertices: [[0, 0], [14, 0], [14, 32], [0, 32]], lotLines: ["front", "side", "rear", "side"] },
      setbacks: { front: 4.5, side: 1.5, rear: 6 },
      floorHeight: 3.1,
      maxHeight: 11,
      maxFar: 1.2,
      maxCoverage: 0.5,
    };
    const hostile = fc.oneof(
      fc.constantFrom(null, "NaN", "Infinity", -1, 0, -0, 1e308, 1e-308, 5e-324, 1e9, [], {}, true, "3.1", [1, 2]),
      fc.double(),
      fc.string({ maxLength: 5 }),
    );
    const field = fc.constantFrom("floorHeight", "maxHeight", "maxFar", "maxCoverage", "setbacks.front", "setbacks.side", "parcel.vertices.1.0", "parcel.vertices.2", "parcel.lotLines.0", "skyPlane", "minPlateArea", "extraField");
    const line = fc.oneof(
      { weight: 3, arbitrary: fc.tuple(field, hostile).map(([f, v]) => {
        const copy = JSON.parse(JSON.stringify(base));
        const keys = f.split(".");
        let o = copy;
        for (const k of keys.slice(0, -1)) o = o[k];
        o[keys.at(-1)!] = v;
        return JSON.stringify(copy, (_k, x) => (typeof x === "number" && !Number.isFinite(x) ? String(x) : x));
      }) },
      { weight: 1, arbitrary: fc.constant(JSON.stringify(base)) },
      { weight: 1, arbitrary: fc.constantFrom("", "   ", "{", "null", "[1,2]", '"text"', "42", '{"parcel":', "\u0000") },
      { weight: 1, arbitrary: fc.json() },
    );
    await fc.assert(
      fc.asyncProperty(fc.array(line, { minLength: 1, maxLength: 8 }), fc.boolean(), fc.boolean(), async (lines, bom, crlf) => {
        const text = (bom ? "\uFEFF" : "") + lines.join(crlf ? "\r\n" : "\n") + (crlf ? "\r\n" : "\n");
        const r = await run(["massing"], text);
        const answers = r.out.split("\n").filter((l) => l !== "");
        const nonBlank = lines.map((l, i) => [l, i + 1] as const).filter(([l]) => l.trim() !== "");
        expect(answers).toHaveLength(nonBlank.length);
        let failed = 0;
        answers.forEach((a, k) => {
          const parsed = JSON.parse(a);
          const [src, lineNo] = nonBlank[k]!;
          if ("error" in parsed) {
            failed++;
            expect(parsed.error.line).toBe(lineNo);
            expect(typeof parsed.error.field).toBe("string");
            expect(parsed.error.message).toMatch(/^(evaluateMassing: |massing: )|JSON|object/);
          } else {
            // A result is the evaluator's own answer for that line, every number finite.
            expect(parsed).toEqual(JSON.parse(JSON.stringify(evaluateMassing(JSON.parse(src)))));
            for (const v of Object.values(parsed)) if (typeof v === "number") expect(Number.isFinite(v)).toBe(true);
          }
        });
        expectCleanOutcome(r, [failed > 0 ? 1 : 0], "massing");
      }),
      { numRuns: 60, seed: 3 },
    );
  });

  it("massing: a very long line (1 MB) gets one clear answer", async () => {
    const r = await run(["massing"], `{"floorHeight": 3, "pad": "${"x".repeat(1_000_000)}"}\n`);
    expectCleanOutcome(r, [1]);
    expect(JSON.parse(r.out).error.line).toBe(1);
    expect(r.out.length).toBeLessThan(2000);
  });

  it("fit, predict and assess on hostile CSVs: a working model or exit 2 naming the file and the problem", async () => {
    const cell = fc.oneof(
      { weight: 6, arbitrary: fc.double({ min: -100, max: 100, noNaN: true }).map(String) },
      { weight: 2, arbitrary: fc.constantFrom("NaN", "Infinity", "-Infinity", "", " ", "abc", '"7"', '"1,5"', "1e309", "1e-320", "1e300", "-0", "0x1F", "1.5e12") },
    );
    const table = fc.record({
      bom: fc.boolean(),
      crlf: fc.boolean(),
      quotedHeader: fc.boolean(),
      header: fc.constantFrom(["a", "b", "y"], ["a", "b", "y"], ["a", "y"], ["a", "b", "y", "a"], ["a", "b", "y", "extra"]),
      rows: fc.array(fc.array(cell, { minLength: 2, maxLength: 5 }), { minLength: 0, maxLength: 12 }),
      duplicate: fc.boolean(),
    });
    await fc.assert(
      fc.asyncProperty(table, async (t) => {
        const eol = t.crlf ? "\r\n" : "\n";
        const head = t.header.map((h) => (t.quotedHeader ? `"${h}"` : h)).join(",");
        const rows = t.duplicate && t.rows.length ? [...t.rows, t.rows[0]!, t.rows[0]!] : t.rows;
        const text = (t.bom ? "\uFEFF" : "") + [head, ...rows.map((r) => r.join(","))].join(eol) + eol;
        const csv = file(text);
        const m = outPath("json");
        const f = await run(["fit", "--data", csv, "--inputs", "a,b", "--target", "y", "--restarts", "1", "--out", m]);
        expectCleanOutcome(f, [0, 2], "fit");
        if (f.code === 2) {
          expect(f.err).toMatch(/floorcast: (readTable|fit|fitGaussianProcess)\b/);
          expect(existsSync(m)).toBe(false);
        } else {
          const loaded = loadSurrogate(readFileSync(m, "utf8"));
          const { x } = await readTable(csv, { inputs: ["a", "b"], targets: ["y"] });
          for (const row of loaded.predict(x).mean) expect(Number.isFinite(row[0])).toBe(true);
        }
        const p = await run(["predict", "--model", model, "--data", csv, "--out", outPath()]);
        expectCleanOutcome(p, [0, 2], "predict");
        const a = await run(["assess", "--model", model, "--data", csv, "--target", "y", "--out", outPath("d")]);
        expectCleanOutcome(a, [0, 2], "assess");
      }),
      { numRuns: 40, seed: 11 },
    );
  }, 120_000);

  it("predict and assess refuse a damaged or edited model file with exit 2", async () => {
    const text = readFileSync(model, "utf8");
    const edited = JSON.parse(text);
    edited.payload.components[0].alpha[0] += 1;
    for (const bad of [text.slice(0, text.length >> 1), "", "{}", "[]", JSON.stringify(edited), text.replace('"kind"', '"__proto__":{"x":1},"kind"')]) {
      const m = file(bad, "json");
      const p = await run(["predict", "--model", m, "--data", goodCsv, "--out", outPath()]);
      expectCleanOutcome(p, [2], "predict");
      expect(p.err).toMatch(/loadSurrogate: f\d+\.json: /);
      expectCleanOutcome(await run(["assess", "--model", m, "--data", goodCsv, "--target", "y", "--out", outPath("d")]), [2], "assess");
      expectCleanOutcome(await run(["optimize", "--problem", branin, "--surrogate", m, "--out", outPath("d")]), [2], "optimize");
    }
  });

  it("a model file without a checksum (written before checksums) is used, with a one-line note on stderr", async () => {
    const { checksum, ...legacy } = JSON.parse(readFileSync(model, "utf8"));
    expect(checksum).toMatch(/^sha256:/);
    const m = file(JSON.stringify(legacy), "json");
    const p = await run(["predict", "--model", m, "--data", goodCsv, "--out", outPath()]);
    expectCleanOutcome(p, [0], "predict legacy");
    expect(p.err).toMatch(/^predict: note: f\d+\.json has no checksum/m);
    const a = await run(["assess", "--model", m, "--data", goodCsv, "--target", "y", "--out", outPath("d")]);
    expectCleanOutcome(a, [0], "assess legacy");
    expect(a.err).toMatch(/^assess: note: .* has no checksum/m);
    const sealed = await run(["predict", "--model", model, "--data", goodCsv, "--out", outPath()]);
    expect(sealed.err).not.toMatch(/no checksum/);
  });

  it("sample, optimize and bench refuse hostile scenario and problem files with exit 2", async () => {
    const scen = readFileSync(scenario, "utf8");
    const prob = readFileSync(branin, "utf8");
    const mutate = (text: string) =>
      fc.oneof(
        fc.nat({ max: text.length - 1 }).map((k) => text.slice(0, k)),
        fc.jsonValue().map((v) => JSON.stringify(v)),
        fc.tuple(fc.constantFrom(...Object.keys(JSON.parse(text))), fc.jsonValue()).map(([k, v]) => JSON.stringify({ ...JSON.parse(text), [k]: v })),
      );
    await fc.assert(
      fc.asyncProperty(mutate(scen), fc.boolean(), async (s, bom) => {
        const r = await run(["sample", "--scenario", file((bom ? "\uFEFF" : "") + s, "json"), "--n", "3", "--seed", "1", "--design", "lhs", "--out", outPath()]);
        expectCleanOutcome(r, [0, 2], "sample");
      }),
      { numRuns: 40, seed: 5 },
    );
    await fc.assert(
      fc.asyncProperty(mutate(prob), async (s) => {
        const r = await run(["optimize", "--problem", file(s, "json"), "--exact", "--optimizer", "random", "--budget", "5", "--out", outPath("d")]);
        expectCleanOutcome(r, [0, 2], "optimize");
      }),
      { numRuns: 40, seed: 6 },
    );
    const probs = join(dir, "problems");
    rmSync(probs, { recursive: true, force: true });
    writeFileSync(file("", "tmp"), "");
    (await import("node:fs")).mkdirSync(probs);
    writeFileSync(join(probs, "broken.json"), prob.slice(0, 40));
    expectCleanOutcome(await run(["bench", "--problems", probs, "--suite", "standard", "--out", outPath("d")]), [2], "bench broken problem");
    expectCleanOutcome(await run(["bench", "--suite", "no-such-suite", "--out", outPath("d")]), [2], "bench suite");
    expectCleanOutcome(await run(["bench", "--suite", "standard", "--problem", "no-such", "--out", outPath("d")]), [2], "bench problem");
  }, 60_000);

  it("merge refuses shards that do not belong together, or are not shards, with exit 2", async () => {
    const a = outPath();
    const b = outPath();
    expectCleanOutcome(await run(["sample", "--scenario", scenario, "--n", "6", "--seed", "1", "--design", "lhs", "--shard", "1/2", "--out", a]), [0]);
    expectCleanOutcome(await run(["sample", "--scenario", scenario, "--n", "6", "--seed", "2", "--design", "lhs", "--shard", "2/2", "--out", b]), [0]);
    const r = await run(["merge", a, b, "--out", outPath()]);
    expectCleanOutcome(r, [2], "merge different seeds");
    expectCleanOutcome(await run(["merge", a, "--out", outPath()]), [2], "merge missing shard");
    expectCleanOutcome(await run(["merge", a, a, "--out", outPath()]), [2], "merge repeated shard");
    expectCleanOutcome(await run(["merge", goodCsv, "--out", outPath()]), [2], "merge non-shard");
    writeFileSync(a.replace(/\.csv$/, ".manifest.json"), "{ not json");
    expectCleanOutcome(await run(["merge", a, b, "--out", outPath()]), [2], "merge garbage manifest");
  });
});

describe("the real process (a few spawned runs, each killed after 20 s)", () => {
  it("exit statuses and streams of the installed bin agree with main: 2, 1 and 0", async () => {
    const unknown = await spawnCli(["no-such-command"]);
    expectCleanOutcome(unknown, [2], "spawn unknown");
    const lines = '\uFEFF{"floorHeight":3}\r\n\r\n{"parcel":{"vertices":[[0,0],[14,0],[14,32],[0,32]],"lotLines":["front","side","rear","side"]},"setbacks":{"front":4.5,"side":1.5,"rear":6},"floorHeight":3.1,"maxHeight":11}\r\n';
    const mass = await spawnCli(["massing"], lines);
    expectCleanOutcome(mass, [1], "spawn massing");
    const answers = mass.out.trim().split("\n").map((l) => JSON.parse(l));
    expect(answers[0].error.line).toBe(1);
    expect(answers[1].floors).toBe(3); // 3 floors of 3.1 m fit under 11 m (derived: floor(11 / 3.1) = 3)
    const trunc = await spawnCli(["predict", "--model", file('{"kind":"floorcast.surrogate","formatVersion":1,"mod', "json"), "--data", goodCsv, "--out", outPath()]);
    expectCleanOutcome(trunc, [2], "spawn truncated model");
    expect(trunc.err).toMatch(/not valid JSON/);
    const huge = await spawnCli(["design", "--n", "2000000000", "--dims", "3", "--design", "lhs", "--seed", "1", "--out", outPath()]);
    expectCleanOutcome(huge, [2], "spawn huge design");
    expect(huge.err).toMatch(/createDesign: n × dims/);
  }, 240_000);
});
