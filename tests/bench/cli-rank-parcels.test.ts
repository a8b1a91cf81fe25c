// `floorcast rank-parcels` on the Quillmere demo parcel file with small budgets: the three outputs, their
// agreement with each other, the caution, and a user's mistakes (exit 2, one line).
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runCli, type CliOutcome } from "./run-cli.js";
import { FLOORCAST_CAUTION } from "@floorcast/sampler";
import { expectOnlyCaution } from "./helpers/only-caution.js";

const DEMO = fileURLToPath(new URL("../../datasets/parcels/", import.meta.url));
const FILES = [
  "--input", join(DEMO, "quillmere-parcels.geojson"),
  "--zoning", join(DEMO, "quillmere-zoning.json"),
  "--streets", join(DEMO, "quillmere-streets.geojson"),
  "--street-distance", "8",
];

describe("floorcast rank-parcels", () => {
  let dir = "";
  let run: CliOutcome;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "floorcast-rank-cli-"));
    run = await runCli([
      "rank-parcels", ...FILES, "--out", join(dir, "ranked.geojson"), "--summary", join(dir, "ranking"),
      "--budget", "30", "--training-rows", "40", "--seed", "2", "--work", join(dir, "work"),
    ]);
  }, 120_000);
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("writes the ranked GeoJSON and the JSON and Markdown summaries, with the caution", () => {
    expect(run.err).toBe("");
    expect(run.code).toBe(0);
    expect(run.out).toMatch(/12 parcels of quillmere-parcels\.geojson ranked by most gfa/);
    expect(run.out).toMatch(/exact route: 360 exact evaluations/);
    expect(run.out).toMatch(/surrogate route: \d+ exact evaluations \(40 training \+ \d+ re-evaluation\)/);
    expect(run.out).toMatch(/Spearman rho -?\d\.\d{3}, Kendall tau-b -?\d\.\d{3}, top-3 overlap \d+%/);
    expect(run.out.trimEnd().split("\n").at(-1)).toBe(FLOORCAST_CAUTION);
    const geo = JSON.parse(readFileSync(join(dir, "ranked.geojson"), "utf8"));
    const summary = JSON.parse(readFileSync(join(dir, "ranking.json"), "utf8"));
    const md = readFileSync(join(dir, "ranking.md"), "utf8");
    // the one caution word for word in every output, and no other caution wording
    expect(geo.fc_caution).toBe(FLOORCAST_CAUTION);
    expect(summary.caution).toBe(FLOORCAST_CAUTION);
    expect(md.split(FLOORCAST_CAUTION)).toHaveLength(3); // at the top and at the end
    for (const f of ["ranked.geojson", "ranking.json", "ranking.md"]) expectOnlyCaution(readFileSync(join(dir, f), "utf8"), f);
    expect(summary.kind).toBe("floorcast.parcel-ranking");
    expect(summary.file).toBe("quillmere-parcels.geojson");
    const ranks = geo.features.map((f: { properties: { fc_rank: number } }) => f.properties.fc_rank);
    expect([...ranks].sort((a: number, b: number) => a - b)).toEqual(Array.from({ length: 12 }, (_, i) => i + 1));
    // the GeoJSON, the JSON summary and the Markdown table say the same thing
    for (const [i, f] of geo.features.entries()) {
      const p = summary.parcels[i];
      expect(f.id).toBe(p.id);
      expect(f.properties.fc_capacity).toBe(p.exact.value);
      expect(f.properties.fc_capacitySurrogate).toBe(p.surrogate.value);
      expect(md).toMatch(new RegExp(`\\| ${p.exact.rank} \\| ${p.id} \\|`));
    }
    expect(md).toMatch(new RegExp(`\\| surrogate: its choices re-evaluated exactly \\| ${summary.agreement.reevaluated.spearman.toFixed(3)} \\|`));
    expect(md).toMatch(new RegExp(`\\| the zone's own controls, no search \\| ${summary.agreement.zone.spearman.toFixed(3)} \\|`));
    expect(run.out).toMatch(/zone's own controls \(12 evaluations, no search\) against the exact ranking: Spearman rho/);
    // --work keeps the training CSV, its manifest and the model file
    expect(existsSync(join(dir, "work", "parcels-train-2.csv"))).toBe(true);
    expect(existsSync(join(dir, "work", "parcels-model-2.json"))).toBe(true);
  });

  it("refuses to overwrite without --force, and a bad option: exit 2, one line, nothing written", async () => {
    const out = join(dir, "again.geojson");
    for (const [args, message] of [
      [["--out", join(dir, "ranked.geojson"), "--summary", join(dir, "other")], /exists/],
      [["--out", out, "--summary", join(dir, "s1"), "--route", "fast"], /--route must be exact, surrogate or both/],
      [["--out", out, "--summary", join(dir, "s2"), "--objective", "limitedBy"], /--objective must be one of/],
      [["--out", out, "--summary", join(dir, "s3"), "--optimizer", "nsga2"], /--optimizer must be one of/],
      [["--out", out, "--summary", join(dir, "s4"), "--budget", "0"], /--budget/],
      [["--out", out, "--summary", join(dir, "s5"), "--model", "plate-stack"], /--model must be gp or nn/],
    ] as const) {
      const r = await runCli(["rank-parcels", ...FILES, ...args]);
      expect(r.code, r.err).toBe(2);
      expect(r.err.trim().split("\n")).toHaveLength(1);
      expect(r.err).toMatch(/rank-parcels: /);
      expect(r.err).toMatch(message);
    }
    expect(existsSync(out)).toBe(false);
  });

  it("a file with fewer than two parcels to rank is a user's mistake", async () => {
    const one = JSON.parse(readFileSync(join(DEMO, "quillmere-parcels.geojson"), "utf8"));
    one.features = one.features.slice(0, 1);
    writeFileSync(join(dir, "one.geojson"), JSON.stringify(one));
    const r = await runCli(["rank-parcels", ...FILES.slice(2), "--input", join(dir, "one.geojson"), "--out", join(dir, "one-out.geojson"), "--summary", join(dir, "one"), "--route", "exact"]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/rank-parcels: one\.geojson: parcels must hold at least 2 parcels to rank, got 1/);
  });

  it("a feature that cannot be evaluated is reported in place, the rest ranked: exit 1", async () => {
    const file = JSON.parse(readFileSync(join(DEMO, "quillmere-parcels.geojson"), "utf8"));
    file.features.push({ type: "Feature", id: "QM-bad", properties: { zone: "QM-R1" }, geometry: { type: "MultiPolygon", coordinates: [] } });
    writeFileSync(join(dir, "with-bad.geojson"), JSON.stringify(file));
    const r = await runCli(["rank-parcels", ...FILES.slice(2), "--input", join(dir, "with-bad.geojson"), "--out", join(dir, "bad-out.geojson"), "--summary", join(dir, "bad"), "--route", "exact", "--budget", "5"]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/rank-parcels: 1 of 13 features could not be evaluated and are not ranked/);
    const geo = JSON.parse(readFileSync(join(dir, "bad-out.geojson"), "utf8"));
    const bad = geo.features.find((f: { id: string }) => f.id === "QM-bad");
    expect(bad.properties.fc_error).toMatch(/geometry must be a Polygon/);
    expect(bad.properties.fc_rank).toBeUndefined();
    expect(geo.features.filter((f: { properties: { fc_rank?: number } }) => f.properties.fc_rank !== undefined)).toHaveLength(12);
  });
});
