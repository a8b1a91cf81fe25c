import { describe, expect, it } from "vitest";
import { mkdtempSync, readFileSync, writeFileSync, statSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { runSuite } from "../../packages/bench/src/harness/run-suite.js";
import { evaluateMassing, FLOORCAST_CAUTION } from "@floorcast/sampler";
import { expectOnlyCaution } from "./helpers/only-caution.js";
import { chromiumAvailable, withOfflinePage } from "./offline-page.js";

/** The repository's problem files (the build copies them into the bench package). */
const PROBLEMS_DIR = fileURLToPath(new URL("../../datasets/problems/", import.meta.url));

const hasChromium = chromiumAvailable();

/** A tiny suite: the Larkspur fit problem (massing) and Forrester (test function), both in suite "tiny". */
function tinySuite(): string {
  const dir = mkdtempSync(join(tmpdir(), "fc-suite-"));
  const fit = JSON.parse(readFileSync(join(PROBLEMS_DIR, "larkspur-fit-gfa.json"), "utf8"));
  fit.scenario = join(PROBLEMS_DIR, "../scenarios/larkspur-terraces.json");
  fit.suites = ["tiny"];
  fit.exact = { gridPoints: 11, refineEvaluations: 40 };
  writeFileSync(join(dir, "fit.json"), JSON.stringify(fit));
  const fo = JSON.parse(readFileSync(join(PROBLEMS_DIR, "standard-forrester.json"), "utf8"));
  fo.suites = ["tiny"];
  fo.exact = { gridPoints: 101, refineEvaluations: 40 };
  writeFileSync(join(dir, "forrester.json"), JSON.stringify(fo));
  return dir;
}

const overrides = {
  trainingSizes: [10],
  seeds: [1],
  testSize: 30,
  refineBudget: 5,
  candidates: 128,
  targets: { search: 40, bo: 6, seeds: 1, boSeeds: 1 },
  peerSizes: [],
  surrogates: ["gp", "plate-stack"] as ("gp" | "nn" | "plate-stack")[],
};

describe("runSuite: report.json structure, resume", () => {
  const problemsDir = tinySuite();
  const out = mkdtempSync(join(tmpdir(), "fc-bench-"));
  it("writes report.json as the README's report.json section describes, with Markdown and HTML beside it", async () => {
    // parcels: the demo's parcel ranking (the Quillmere parcel file, both routes) at a tiny budget
    const parcels = { budget: 10, dir: fileURLToPath(new URL("../../datasets/parcels/", import.meta.url)) };
    const { report, paths } = await runSuite({ suite: "tiny", quick: true, out, peers: false, problemsDir, overrides, parcels });
    const json = JSON.parse(readFileSync(paths.json, "utf8"));
    expect(json.kind).toBe("floorcast.bench-report");
    expect(json.problems.map((p: { name: string }) => p.name)).toEqual(["larkspur-fit-gfa", "standard-forrester"]);
    const p = json.problems[0];
    expect(Object.keys(p.exactOptimum)).toEqual(expect.arrayContaining(["input", "result", "evaluations"]));
    // input is the full MassingInput and result its exact MassingResult
    expect(p.exactOptimum.input.parcel.vertices.length).toBe(4);
    expect(evaluateMassing(p.exactOptimum.input).gfa).toBeCloseTo(p.exactOptimum.result.gfa, 9);
    expect(p.exactOptimum.evaluations).toBe(p.exactOptimum.gridEvaluations + p.exactOptimum.refineEvaluations);
    // plate-stack runs where the evaluator reports plate profiles (the massing problem), not on a test function
    expect(p.surrogateOptimum.map((r: { surrogate: string }) => r.surrogate)).toEqual(["gp", "plate-stack"]);
    expect(json.problems[1].surrogateOptimum.map((r: { surrogate: string }) => r.surrogate)).toEqual(["gp"]);
    const s = p.surrogateOptimum[0];
    for (const k of ["surrogate", "trainingSize", "seed", "input", "result", "gap", "evaluations"]) expect(s).toHaveProperty(k);
    expect(s.surrogate).toBe("gp");
    expect(s.trainingSize).toBe(10);
    // the reported design's result is its exact result, and it satisfies the problem's constraint (height ≤ 10)
    expect(evaluateMassing(s.input).gfa).toBeCloseTo(s.result.gfa, 9);
    expect(s.result.height).toBeLessThanOrEqual(10);
    expect(s.gap).toBeCloseTo((p.exactOptimum.value - s.value) / p.exactOptimum.value, 12);
    expect(p.evaluationsToTarget.map((e: { method: string }) => e.method)).toEqual(["bo", "bo-plate-stack", "ga", "pso", "random", "grid"]);
    expect(json.problems[1].evaluationsToTarget.map((e: { method: string }) => e.method)).toEqual(["bo", "ga", "pso", "random", "grid"]);
    // the bench report's JSON, Markdown and HTML carry the one caution word for word, and no other caution wording
    expect(report.caution).toBe(FLOORCAST_CAUTION);
    const md = readFileSync(paths.markdown, "utf8");
    const html = readFileSync(paths.html, "utf8");
    for (const [kind, text] of [["json", readFileSync(paths.json, "utf8")], ["md", md], ["html", html]] as const) expectOnlyCaution(text, kind);
    expect(html).toMatch(/Plan and section of the optimal massing/);
    expect((html.match(/<svg/g) ?? []).length).toBeGreaterThanOrEqual(4);
    expect(json.parcels.file).toBe("quillmere-parcels.geojson");
    expect(json.parcels.ranking.parcels).toHaveLength(12);
    expect(json.parcels.outlines).toHaveLength(12);
    expect(json.parcels.ranking.evaluations.exact).toBe(12 * 10);
    for (const text of [md, html]) expect(text).toMatch(/Parcels ranked by capacity: quillmere-parcels\.geojson/);
    expect(html).not.toMatch(/<script/);
  });
  it.skipIf(!hasChromium)("the HTML page opens in headless Chromium (Debian chromium) with no errors, every figure drawn, nothing fetched", async () => {
    const file = join(out, "report.html");
    await withOfflinePage(file, async ({ page, errors, requests }) => {
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);
      const figures = await page.locator("figure > svg").count();
      // per problem: gap vs size and evaluations to target; the massing problem adds two plan-and-section drawings;
      // the parcel ranking adds its plan, one polygon per parcel
      expect(figures).toBe(2 + 2 + 2 + 1);
      expect(await page.locator("svg.parcel-capacity-plan polygon").count()).toBe(12);
      expect(await page.locator("figure > figcaption").count()).toBe(figures);
      expect(await page.locator(".caution").innerText()).toBe(`Caution. ${FLOORCAST_CAUTION}`);
    });
  });
  it("re-run with the same options into the same directory, it skips the finished problems", async () => {
    const stamp = statSync(join(out, "problems", "larkspur-fit-gfa.json")).mtimeMs;
    const states: string[] = [];
    const progress = { write: (s: string) => (states.push(s), true) } as unknown as NodeJS.WritableStream;
    const { report } = await runSuite({ suite: "tiny", quick: true, out, force: true, peers: false, problemsDir, overrides, progress: progress as never });
    expect(states.filter((s) => /already finished/.test(s)).length).toBe(2);
    expect(statSync(join(out, "problems", "larkspur-fit-gfa.json")).mtimeMs).toBe(stamp);
    expect(report.problems[0]!.surrogateOptimum[0]!.gap).toBeDefined();
  });
  it("a saved problem whose report was edited is measured again, never trusted", async () => {
    const file = join(out, "problems", "larkspur-fit-gfa.json");
    const saved = JSON.parse(readFileSync(file, "utf8"));
    delete saved.report.summary; // same fingerprint, damaged report
    writeFileSync(file, JSON.stringify(saved));
    const lines: string[] = [];
    const progress = { write: (s: string) => (lines.push(s), true) };
    const { report } = await runSuite({ suite: "tiny", quick: true, out, force: true, peers: false, problemsDir, overrides, progress: progress as never });
    expect(lines.filter((s) => /already finished/.test(s)).length).toBe(1); // only standard-forrester reused
    expect(Array.isArray(report.problems.find((p) => p.name === "larkspur-fit-gfa")!.summary)).toBe(true);
  });
  it("a missing problem file is measured again; other options measure everything again", async () => {
    const { unlinkSync } = await import("node:fs");
    unlinkSync(join(out, "problems", "standard-forrester.json"));
    const lines: string[] = [];
    const progress = { write: (s: string) => (lines.push(s), true) };
    await runSuite({ suite: "tiny", quick: true, out, force: true, peers: false, problemsDir, overrides, progress: progress as never });
    expect(lines.filter((s) => /already finished/.test(s)).length).toBe(1);
    expect(existsSync(join(out, "problems", "standard-forrester.json"))).toBe(true);
    const other: string[] = [];
    await runSuite({ suite: "tiny", quick: true, out, force: true, peers: false, problemsDir, overrides: { ...overrides, refineBudget: 6 }, problem: "standard-forrester", progress: { write: (s: string) => (other.push(s), true) } as never });
    expect(other.filter((s) => /already finished/.test(s)).length).toBe(0);
  });
  it("names an unknown problem", async () => {
    await expect(runSuite({ suite: "tiny", quick: true, out, peers: false, problemsDir, overrides, problem: "nope" })).rejects.toThrow(/no problem "nope" in suite tiny; problems: larkspur-fit-gfa, standard-forrester/);
  });
});
