// Installs floorcast as a user would: the three packages packed with `npm pack`, installed into a
// fresh project offline (npm ci --offline from the tarballs and npm's cache), then the command, the
// README's library quick start and the predictor bundled for a browser are run from that project.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { installTarballs, packWorkspace } from "../../packages/bench/src/benchmarks/pack-workspace.js";
import { bundlePredictor } from "../../packages/bench/src/benchmarks/bundle-predictor.js";
import { chromiumAvailable, withOfflinePage } from "./offline-page.js";
import { checkQuickStartOutput, runQuickStart } from "./readme-code.js";

const root = fileURLToPath(new URL("../../", import.meta.url));
const version = (JSON.parse(readFileSync(join(root, "packages/bench/package.json"), "utf8")) as { version: string }).version;
const hasChromium = chromiumAvailable();

/** Files of a tarball. */
function tarList(file: string): string[] {
  return execFileSync("tar", ["-tzf", file], { encoding: "utf8" }).trim().split("\n").map((f) => f.replace(/^package\//, ""));
}

let dir = "";
let tarballs: ReturnType<typeof packWorkspace>;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "floorcast-install-"));
  tarballs = packWorkspace(dir);
}, 300_000);
afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe("the packed packages, installed into a fresh project", () => {
  let app = "";
  beforeAll(() => {
    app = join(dir, "app");
    installTarballs(app, { "@floorcast/sampler": tarballs.sampler, "@floorcast/surrogate": tarballs.surrogate, "@floorcast/bench": tarballs.bench });
  }, 900_000);

  it("ship README and LICENSE, no build info, no source maps, no benchmarks; bench ships the demo files and the peer script", () => {
    for (const [name, file] of Object.entries(tarballs)) {
      const files = tarList(file);
      expect(files, name).toContain("README.md");
      expect(files, name).toContain("LICENSE");
      expect(files.filter((f) => f.endsWith(".map") || f.includes("tsbuildinfo")), name).toEqual([]);
      expect(files.filter((f) => !/^(dist\/|bin\/|python\/|README\.md$|LICENSE$|package\.json$)/.test(f)), name).toEqual([]);
    }
    const bench = tarList(tarballs.bench);
    expect(bench.filter((f) => f.startsWith("dist/benchmarks/"))).toEqual([]);
    expect(bench).toContain("python/peer_surrogates.py");
    const shipped = (folder: string) => bench.filter((f) => f.startsWith(`dist/demo/${folder}/`)).map((f) => f.slice(`dist/demo/${folder}/`.length)).sort();
    expect(shipped("problems")).toEqual(readdirSync(join(root, "datasets/problems")).sort());
    expect(shipped("scenarios")).toEqual(readdirSync(join(root, "datasets/scenarios")).sort());
    // the demo's parcel file, its zoning table and streets (the generator script stays in the repository)
    expect(shipped("parcels")).toEqual(readdirSync(join(root, "datasets/parcels")).filter((f) => !f.endsWith(".mjs")).sort());
    const surrogate = JSON.parse(readFileSync(join(app, "node_modules/@floorcast/surrogate/package.json"), "utf8"));
    expect(surrogate.dependencies["@tensorflow/tfjs"]).toBeUndefined();
    expect(surrogate.peerDependenciesMeta["@tensorflow/tfjs"]).toEqual({ optional: true });
  });

  it("floorcast --version prints the package version", () => {
    const out = execFileSync(join(app, "node_modules/.bin/floorcast"), ["--version"], { cwd: app, encoding: "utf8" });
    expect(out.trim()).toBe(version);
  });

  it("floorcast demo --quick --no-peers runs in an empty folder with the problems shipped in the package", () => {
    const work = join(dir, "elsewhere");
    mkdirSync(work);
    const run = spawnSync(join(app, "node_modules/.bin/floorcast"), ["demo", "--quick", "--no-peers", "--out", "demo"], { cwd: work, encoding: "utf8" });
    expect(run.status, run.stderr).toBe(0);
    expect(run.stderr).not.toMatch(/ENOENT|cannot read/);
    expect(run.stdout).toMatch(/not a zoning determination/);
    for (const f of ["report.html", "report.md", "report.json"]) expect(existsSync(join(work, "demo", f)), f).toBe(true);
    const report = JSON.parse(readFileSync(join(work, "demo/report.json"), "utf8")) as { problems: { name: string; notes: string[] }[] };
    const demoProblems = readdirSync(join(root, "datasets/problems"))
      .map((f) => JSON.parse(readFileSync(join(root, "datasets/problems", f), "utf8")) as { name: string; suites: string[] })
      .filter((p) => p.suites.includes("demo"))
      .map((p) => p.name)
      .sort();
    expect(report.problems.map((p) => p.name).sort()).toEqual(demoProblems);
    for (const p of report.problems) expect(p.notes.join(" ")).toMatch(/turned off \(--no-peers\)/);
    // the shipped parcel file is ranked and drawn as a plan coloured by capacity
    const parcels = (JSON.parse(readFileSync(join(work, "demo/report.json"), "utf8")) as { parcels: { file: string; ranking: { parcels: unknown[] } } }).parcels;
    expect(parcels.file).toBe("quillmere-parcels.geojson");
    expect(parcels.ranking.parcels).toHaveLength(12);
    expect(readFileSync(join(work, "demo/report.html"), "utf8")).toMatch(/class="parcel-capacity-plan"/);
  }, 900_000);

  it("the README's library quick start runs against the installed packages", () => {
    checkQuickStartOutput(runQuickStart(app));
  }, 300_000);

  it.skipIf(!hasChromium)("the predictor, bundled from the installed package, predicts in headless Chromium exactly as in Node", async () => {
    if (!existsSync(join(app, "gfa-model.json"))) runQuickStart(app);
    const model = readFileSync(join(app, "gfa-model.json"), "utf8");
    const rows = [
      [12, 11],
      [16, 7],
      [8.5, 13.9],
    ];
    writeFileSync(join(app, "rows.json"), JSON.stringify(rows));
    const script = 'import { readFileSync } from "node:fs"; import { loadPredictor } from "@floorcast/surrogate/predict"; ' +
      'console.log(JSON.stringify(loadPredictor(readFileSync("gfa-model.json", "utf8")).predict(JSON.parse(readFileSync("rows.json", "utf8")))));';
    writeFileSync(join(app, "predict-node.mjs"), script);
    const inNode = JSON.parse(execFileSync(process.execPath, ["predict-node.mjs"], { cwd: app, encoding: "utf8" })) as { mean: number[][]; sd: number[][] };
    const bundle = await bundlePredictor(app);
    expect(bundle).not.toMatch(/require\(|node:/);
    const page = join(app, "predictor.html");
    writeFileSync(page, `<!doctype html><meta charset="utf-8"><title>predictor</title><script>${bundle.replace(/<\/script/gi, "<\\/script")}</script>`);
    await withOfflinePage(page, async ({ page: p, errors, requests }) => {
      const inBrowser = (await p.evaluate(
        ([json, x]) => (globalThis as unknown as { floorcastPredict: (j: string, r: number[][]) => unknown }).floorcastPredict(json, x),
        [model, rows] as const,
      )) as { mean: number[][]; sd: number[][] };
      // Same code on IEEE-754 doubles in two V8 engines: equal to the last bits (derived; 1e-12
      // relative leaves room only for a differing Math.exp in the kernel).
      for (let i = 0; i < rows.length; i++) {
        expect(Math.abs(inBrowser.mean[i]![0]! - inNode.mean[i]![0]!)).toBeLessThanOrEqual(1e-12 * Math.abs(inNode.mean[i]![0]!));
        expect(Math.abs(inBrowser.sd[i]![0]! - inNode.sd[i]![0]!)).toBeLessThanOrEqual(1e-12 * Math.abs(inNode.sd[i]![0]!));
      }
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);
    });
  }, 300_000);
});

describe("@floorcast/surrogate installed alone", () => {
  let app = "";
  beforeAll(() => {
    app = join(dir, "surrogate-only");
    installTarballs(app, { "@floorcast/surrogate": tarballs.surrogate });
  }, 600_000);

  it("brings no tfjs; the GP and the predictor work; the nn subpath says how to add tfjs", () => {
    expect(existsSync(join(app, "node_modules/@tensorflow"))).toBe(false);
    const gp = 'import { fitGaussianProcess } from "@floorcast/surrogate"; import { loadPredictor } from "@floorcast/surrogate/predict"; ' +
      'const x = [[0], [0.25], [0.5], [0.75], [1]]; const gp = fitGaussianProcess({ inputs: ["x"], targets: ["y"], x, y: x.map(([v]) => [v * v]) }); ' +
      "console.log(loadPredictor(gp.toJSON()).predict([[0.5]]).mean[0][0]);";
    writeFileSync(join(app, "gp.mjs"), gp);
    const mean = Number(execFileSync(process.execPath, ["gp.mjs"], { cwd: app, encoding: "utf8" }));
    // An interpolating GP returns a training target at its own input (R&W 2006 eq. 2.25 with small noise): 0.25.
    expect(mean).toBeCloseTo(0.25, 3);
    writeFileSync(join(app, "nn.mjs"), 'await import("@floorcast/surrogate/nn");');
    const nn = spawnSync(process.execPath, ["nn.mjs"], { cwd: app, encoding: "utf8" });
    expect(nn.status).not.toBe(0);
    expect(nn.stderr).toMatch(/@floorcast\/surrogate\/nn needs @tensorflow\/tfjs, an optional peer dependency/);
    expect(nn.stderr).toMatch(/npm install @tensorflow\/tfjs/);
  });
});
