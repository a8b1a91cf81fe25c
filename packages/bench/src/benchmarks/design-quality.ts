/**
 * Quality and cost of space-filling designs for n = 500 points in d = 12 dimensions, side by side in one
 * run: the default design (defaultDesign: lhs-maximin-cd at this size), floorcast's lhs-maximin (ESE on φp) and lhs-maximin-cd (then discrepancy-lowering exchanges under a
 * distance floor) against a plain random LHS and, when Debian's python3-scipy is
 * on /usr/bin/python3, scipy.stats.qmc.LatinHypercube(d, optimization="random-cd", seed) (timed inside
 * Python by tests/reference/scipy_lhs_bench.py; its points are scored here with the same metrics).
 * Prints the default's three ratios against random-cd (aims: minimum distance ≥ 1.0 ×, centred discrepancy ≤ 1.05 ×,
 * CPU time ≤ 1.0 ×). Then times ESE for n = 2,000, d = 12 (aim: under 30 s). Prints medians over seeds and ratios.
 * A script, not a test: `npm run build && npm run bench:design`.
 */
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { centredL2Discrepancy, createDesign, defaultDesign, minPairwiseDistance, phiP } from "@floorcast/sampler";
import type { DesignKind } from "@floorcast/sampler";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const N = 500;
const D = 12;
const SEEDS = (process.env.FLOORCAST_BENCH_SEEDS ?? "1,2,3").split(",").map(Number);
const PYTHON = "/usr/bin/python3";
const SCRIPT = fileURLToPath(new URL("../../../../tests/reference/scipy_lhs_bench.py", import.meta.url));

interface Score {
  phi: number;
  minDist: number;
  cd: number;
  wall: number;
  cpu?: number;
}

function score(points: number[][], wall: number, cpu?: number): Score {
  return { phi: phiP(points), minDist: minPairwiseDistance(points), cd: centredL2Discrepancy(points), wall, ...(cpu === undefined ? {} : { cpu }) };
}

function ours(design: DesignKind, n: number, seed: number, eseIterations?: number): Score {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const points = createDesign({ n, dims: D, design, seed, ...(eseIterations === undefined ? {} : { eseIterations }) });
  const wall = (performance.now() - t0) / 1000;
  return score(points, wall, process.cpuUsage(c0).user / 1e6);
}

function scipy(seed: number): Score | undefined {
  if (!existsSync(PYTHON) || !existsSync(SCRIPT)) return undefined;
  const r = spawnSync(PYTHON, [SCRIPT], { input: JSON.stringify({ n: N, d: D, seed }), encoding: "utf8", maxBuffer: 64 << 20 });
  if (r.status !== 0) return undefined;
  const out = JSON.parse(r.stdout) as { points: number[][]; seconds: number; cpuSeconds: number; cd: number; scipy: string };
  scipyVersion = out.scipy;
  return score(out.points, out.seconds, out.cpuSeconds);
}
let scipyVersion = "";

const median = (v: number[]): number => {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? (s[m] as number) : ((s[m - 1] as number) + (s[m] as number)) / 2;
};

function summarise(name: string, scores: Score[]): Record<string, number | string> {
  return {
    design: name,
    phiP: median(scores.map((s) => s.phi)),
    minDist: median(scores.map((s) => s.minDist)),
    cd2: median(scores.map((s) => s.cd)),
    seconds: median(scores.map((s) => s.wall)),
    cpuSeconds: scores.every((s) => s.cpu !== undefined) ? median(scores.map((s) => s.cpu as number)) : NaN,
  };
}

const rows: Record<string, number | string>[] = [];
const DEFAULT = defaultDesign(N, D);
rows.push(summarise(`default (${DEFAULT})`, SEEDS.map((s) => ours(DEFAULT, N, s))));
rows.push(summarise("lhs-maximin (default)", SEEDS.map((s) => ours("lhs-maximin", N, s))));
rows.push(summarise("lhs-maximin (100 iter.)", SEEDS.map((s) => ours("lhs-maximin", N, s, 100))));
rows.push(summarise("lhs-maximin-cd", SEEDS.map((s) => ours("lhs-maximin-cd", N, s))));
rows.push(summarise("lhs (random)", SEEDS.map((s) => ours("lhs", N, s))));
const sp = SEEDS.map(scipy);
const haveScipy = sp.every((s) => s !== undefined);
if (haveScipy) rows.push(summarise(`scipy ${scipyVersion} random-cd`, sp as Score[]));

const fmt = (v: number | string): string => (typeof v === "string" ? v : Number.isNaN(v) ? "-" : v.toPrecision(4));
console.log(`(wall times depend on machine load; CPU seconds are this process's own, scipy's from time.process_time)`);
console.log(`Design quality, n = ${N}, d = ${D}, medians over seeds ${SEEDS.join(", ")} (cd2 = squared centred L2 discrepancy, as scipy reports it)`);
console.log(["design", "phiP", "minDist", "cd2", "seconds", "cpuSeconds"].map((h) => h.padEnd(26)).join(""));
for (const r of rows) console.log(Object.values(r).map((v) => fmt(v).padEnd(26)).join(""));
const OURS = 4; // the first four rows are floorcast's default and optimized designs
for (const mine of rows.slice(0, OURS)) {
  const m = mine as Record<string, number>;
  for (const other of rows.slice(OURS)) {
    const o = other as Record<string, number>;
    console.log(
      `${mine.design} / ${other.design}: minDist ×${(m.minDist / o.minDist).toFixed(3)} (higher is better), ` +
        `phiP ×${(m.phiP / o.phiP).toFixed(3)}, cd2 ×${(m.cd2 / o.cd2).toFixed(3)} (lower is better), ` +
        `wall time ×${(m.seconds / o.seconds).toFixed(3)}, CPU time ×${(m.cpuSeconds / o.cpuSeconds).toFixed(3)}`,
    );
  }
}
if (haveScipy) {
  const m = rows[0] as Record<string, number>;
  const o = rows.at(-1) as Record<string, number>;
  const ratios = { minDist: m.minDist / o.minDist, cd2: m.cd2 / o.cd2, cpu: m.cpuSeconds / o.cpuSeconds };
  const ok = ratios.minDist >= 1 && ratios.cd2 <= 1.05 && ratios.cpu <= 1;
  console.log(
    `\nDefault design (${DEFAULT}) / scipy random-cd at n = ${N}, d = ${D}: minimum distance ×${ratios.minDist.toFixed(3)} (aim ≥ 1.0), ` +
      `centred discrepancy ×${ratios.cd2.toFixed(3)} (aim ≤ 1.05), CPU time ×${ratios.cpu.toFixed(3)} (aim ≤ 1.0): ${ok ? "all met" : "NOT MET"}`,
  );
}
if (!haveScipy) console.log("scipy not found on /usr/bin/python3: the random-cd column is missing (apt-get install python3-scipy).");

const start = ours("lhs-centred", 2000, SEEDS[0] as number);
const longRun = Number(process.env.FLOORCAST_BENCH_ESE_ITERATIONS ?? "100");
for (const [label, iterations] of [["default", undefined], [String(longRun), longRun]] as const) {
  const big = ours("lhs-maximin", 2000, SEEDS[0] as number, iterations);
  console.log(
    `ESE (${label} outer iterations), n = 2000, d = ${D}: ${big.wall.toFixed(1)} s wall, ${big.cpu?.toFixed(1)} s CPU (aim < 30 s); ` +
      `phiP ${start.phi.toPrecision(4)} → ${big.phi.toPrecision(4)}, minDist ${start.minDist.toPrecision(4)} → ${big.minDist.toPrecision(4)} ` +
      `(×${(big.minDist / start.minDist).toFixed(3)}), cd2 ${start.cd.toPrecision(4)} → ${big.cd.toPrecision(4)}`,
  );
}
console.log(`\n${FLOORCAST_CAUTION}`);
