/**
 * What a user installs and ships for the dependency-free predictor: @floorcast/surrogate packed and
 * installed offline into a fresh project alone, then with its optional tfjs peers (what every
 * install pulled while tfjs was a dependency), side by side in one run: node_modules size, package
 * count and wall time of `npm ci`; and `@floorcast/surrogate/predict` bundled for a browser by vite
 * (minified and gzipped bytes). A script, not a test: `npm run bench:predictor` after a build.
 */
import { mkdtempSync, readdirSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import { installTarballs, packWorkspace } from "./pack-workspace.js";
import { bundlePredictor } from "./bundle-predictor.js";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

/** Bytes of every file under a folder (symbolic links not followed) and the number of package.json files in it. */
function footprint(dir: string): { bytes: number; packages: number } {
  let bytes = 0;
  let packages = 0;
  const walk = (d: string, depth: number): void => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const p = join(d, e.name);
      if (e.isDirectory()) walk(p, depth + 1);
      else if (e.isFile()) {
        bytes += statSync(p).size;
        if (e.name === "package.json" && /node_modules\/(@[^/]+\/)?[^/@]+$/.test(d)) packages++;
      }
    }
  };
  walk(dir, 0);
  return { bytes, packages };
}

const MB = (b: number): string => (b / 1e6).toFixed(1);

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), "floorcast-footprint-"));
  try {
    const tarballs = packWorkspace(dir);
    const rows: string[][] = [];
    for (const [label, optionalPeers] of [["@floorcast/surrogate alone", false], ["with the optional tfjs peers", true]] as const) {
      const app = join(dir, optionalPeers ? "with-tfjs" : "alone");
      const t0 = performance.now();
      installTarballs(app, { "@floorcast/surrogate": tarballs.surrogate }, optionalPeers);
      const seconds = (performance.now() - t0) / 1000;
      const f = footprint(join(app, "node_modules"));
      rows.push([label, MB(f.bytes), String(f.packages), seconds.toFixed(1)]);
    }
    const alone = join(dir, "alone");
    const code = await bundlePredictor(alone);
    const base = Number(rows[0]![1]);
    console.log("Installing the predictor (npm ci --offline from the packed tarball; wall time on a shared machine)\n");
    console.log("| install | node_modules (MB) | packages | npm ci (s) | size ÷ alone |");
    console.log("|---|---|---|---|---|");
    for (const r of rows) console.log(`| ${r.join(" | ")} | ${(Number(r[1]) / base).toFixed(1)} |`);
    const bytes = Buffer.byteLength(code);
    console.log(`\n@floorcast/surrogate/predict bundled by vite (IIFE, minified): ${(bytes / 1000).toFixed(1)} kB, ${(gzipSync(code).length / 1000).toFixed(1)} kB gzipped`);
    console.log(`\n${FLOORCAST_CAUTION}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
