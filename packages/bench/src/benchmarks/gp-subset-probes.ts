/**
 * Benchmark: how often a GP fitted on a small maximin subset and polished on all rows reaches the all-row
 * likelihood optimum, with and without the shorter-lengthscale probes, against scikit-learn's
 * GaussianProcessRegressor (Debian python3-sklearn 1.2.1 through tests/reference/gp_sklearn.py; Matérn 5/2 ARD +
 * white noise, 3 starts on all rows, the same bounds and first start). Data: a stepped response of three inputs
 * (a capped sum with five whole steps along x2, as FAR or whole-floor steps are), 300 seeded uniform rows per seed,
 * hyperparameters on a 60-row subset (defaults otherwise), log marginal likelihood on all rows side by side.
 * Run: `npm run build && npm run bench:gp-probes -- [first seed] [last seed]` (default 1 20).
 */
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const first = Number(process.argv[2] ?? "1");
const last = Number(process.argv[3] ?? "20");
if (!Number.isInteger(first) || !Number.isInteger(last) || first < 1 || last < first) {
  console.error("usage: bench:gp-probes -- [first seed ≥ 1] [last seed ≥ first]");
  process.exit(2);
}
/** Reached: within 1e-3·|LML| of scikit-learn's optimum, or above it (the tests' criterion). */
const REACH = 1e-3;

const stepped = (r: readonly number[]): number => Math.min(2 + 2 * r[0]! + Math.sin(3 * r[2]!), (Math.floor(5 * r[1]!) / 5) * 4 + 0.5);
function rows(n: number, seed: number): number[][] {
  // Park–Miller minimal standard generator (Park & Miller 1988).
  let s = seed;
  const u = (): number => (s = (s * 48271) % 2147483647) / 2147483647;
  return Array.from({ length: n }, () => [u(), u(), u()]);
}

const seeds = Array.from({ length: last - first + 1 }, (_, i) => first + i);
const cases = seeds.map((seed) => {
  const x = rows(300, seed);
  return { seed, x, y: x.map((r) => [stepped(r)]) };
});
const request = {
  batch: cases.map(({ x, y }) => ({
    mode: "fit",
    kernel: "matern52",
    x,
    y: y.map((r) => r[0]),
    xTest: [],
    start: { lengthscale: Math.sqrt(0.15), signalVariance: 1, noiseVariance: 1e-4 },
    bounds: { lengthscale: [1e-2, 1e3], signalVariance: [1e-3, 1e6], noiseVariance: [1e-6, 1] },
    restarts: 3,
    seed: 5,
  })),
};
const r = spawnSync("/usr/bin/python3", [`${root}tests/reference/gp_sklearn.py`], { input: JSON.stringify(request), encoding: "utf8", maxBuffer: 64 << 20 });
if (r.status !== 0) {
  console.error(`scikit-learn failed or is missing: ${r.stderr.trim().split("\n").pop()}`);
  process.exit(1);
}
const sk = JSON.parse(r.stdout) as { lml: number }[];
console.log("GP on a stepped 3-input response, 300 rows, hyperparameters on a 60-row maximin subset polished on all rows (10 iterations).");
console.log("Log marginal likelihood on all rows (standardised target); reached = within 1e-3·|LML| of scikit-learn's 3-start all-row fit, or above.\n");
console.log("| seed | scikit-learn | with probes | polish start | without probes |");
console.log("|---|---|---|---|---|");
let withReached = 0;
let withoutReached = 0;
cases.forEach(({ seed, x, y }, k) => {
  const data = { inputs: ["x1", "x2", "x3"], targets: ["f"], x, y };
  const options = { seed: 5, hyperparameterSubset: 60, inputBounds: { lower: [0, 0, 0], upper: [1, 1, 1] } };
  const probed = fitGaussianProcess(data, options);
  const plain = fitGaussianProcess(data, { ...options, probeLengthscales: false });
  const ref = sk[k]!.lml;
  const reached = (v: number): boolean => v >= ref - REACH * Math.abs(ref);
  const a = probed.logMarginalLikelihood()[0]!;
  const b = plain.logMarginalLikelihood()[0]!;
  if (reached(a)) withReached++;
  if (reached(b)) withoutReached++;
  const cell = (v: number): string => `${v.toFixed(2)}${reached(v) ? " ✓" : ""}`;
  console.log(`| ${seed} | ${ref.toFixed(2)} | ${cell(a)} | ${probed.diagnostics.targets[0]!.polishStart} | ${cell(b)} |`);
});
console.log(`\nreached scikit-learn's all-row optimum: ${withReached} of ${cases.length} with the probes, ${withoutReached} without`);
console.log(`\n${FLOORCAST_CAUTION}`);
