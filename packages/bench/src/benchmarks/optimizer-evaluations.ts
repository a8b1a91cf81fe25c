/**
 * Benchmark: exact evaluations each optimizer needs to come within 0.5% of the published optimum of
 * four test functions of the Virtual Library of Simulation Experiments (Branin, six-hump camel,
 * Goldstein–Price, Hartmann 3-D), median over seeds, side by side with scipy's
 * differential_evolution (Debian python3-scipy 1.10.1, polish off) in the same run; the last column
 * is each method's median divided by scipy's.
 * Run: `npm run build && npm run bench:optimizers -- [seeds] [budget]`
 * (defaults 5 seeds, 3000 evaluations; Bayesian optimization gets at most 60).
 */
import { functionEvaluator, type Evaluator } from "@floorcast/sampler";
import { spawnSync } from "node:child_process";
import { fileURLToPath } from "node:url";
import type { OptimizationProblem, OptimizationResult } from "../optimize/optimization-problem.js";
import { bayesianOptimization } from "../optimize/bayesian-optimization.js";
import { geneticAlgorithm } from "../optimize/genetic-algorithm.js";
import { particleSwarm } from "../optimize/particle-swarm.js";
import { projectedGradient } from "../optimize/projected-gradient.js";
import { randomSearch } from "../optimize/random-search.js";
import { branin } from "../problem/branin.js";
import { sixHumpCamel } from "../problem/six-hump-camel.js";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const root = fileURLToPath(new URL("../../../../", import.meta.url));
const [seedArg, budgetArg] = process.argv.slice(2).map(Number);
const SEEDS = Number.isInteger(seedArg) && seedArg! > 0 ? seedArg! : 5;
const BUDGET = Number.isInteger(budgetArg) && budgetArg! > 0 ? budgetArg! : 3000;
const BO_BUDGET = Math.min(BUDGET, 60);

function goldsteinPrice(a: number, b: number): number {
  const p = 1 + (a + b + 1) ** 2 * (19 - 14 * a + 3 * a * a - 14 * b + 6 * a * b + 3 * b * b);
  const q = 30 + (2 * a - 3 * b) ** 2 * (18 - 32 * a + 12 * a * a + 48 * b - 36 * a * b + 27 * b * b);
  return p * q;
}
const H3_A = [[3, 10, 30], [0.1, 10, 35], [3, 10, 30], [0.1, 10, 35]];
const H3_P = [[3689, 1170, 2673], [4699, 4387, 7470], [1091, 8732, 5547], [381, 5743, 8828]].map((r) => r.map((v) => v * 1e-4));
const H3_ALPHA = [1, 1.2, 3, 3.2];
function hartmann3(x: readonly number[]): number {
  return -H3_ALPHA.reduce((s, a, i) => s + a * Math.exp(-H3_A[i]!.reduce((t, aij, j) => t + aij * (x[j]! - H3_P[i]![j]!) ** 2, 0)), 0);
}

interface Case {
  readonly name: string;
  /** Published minimum (VLSE). */
  readonly optimum: number;
  readonly bounds: readonly [number, number][];
  readonly f: (x: readonly number[]) => number;
}
const CASES: readonly Case[] = [
  { name: "branin", optimum: 0.397887, bounds: [[-5, 10], [0, 15]], f: (x) => branin(x[0]!, x[1]!) },
  { name: "six-hump-camel", optimum: -1.0316285, bounds: [[-3, 3], [-2, 2]], f: (x) => sixHumpCamel(x[0]!, x[1]!) },
  { name: "goldstein-price", optimum: 3, bounds: [[-2, 2], [-2, 2]], f: (x) => goldsteinPrice(x[0]!, x[1]!) },
  { name: "hartmann3", optimum: -3.86278, bounds: [[0, 1], [0, 1], [0, 1]], f: hartmann3 },
];

type Method = (p: OptimizationProblem, e: Evaluator, seed: number) => Promise<OptimizationResult>;
const METHODS: readonly [string, Method][] = [
  ["random", (p, e, seed) => randomSearch(p, e, { seed, maxEvaluations: BUDGET })],
  ["lhs", (p, e, seed) => randomSearch(p, e, { seed, maxEvaluations: BUDGET, design: "lhs" })],
  ["gradient (FD)", (p, e, seed) => projectedGradient(p, e, { seed, maxEvaluations: BUDGET })],
  ["pso", (p, e, seed) => particleSwarm(p, e, { seed, maxEvaluations: BUDGET })],
  ["ga", (p, e, seed) => geneticAlgorithm(p, e, { seed, maxEvaluations: BUDGET })],
  ["bo (EI)", (p, e, seed) => bayesianOptimization(p, e, { seed, maxEvaluations: BO_BUDGET })],
];

const median = (v: readonly number[]): number => {
  const s = [...v].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};
/** Median over seeds with misses counted as Infinity (so the median is finite only if most seeds hit). */
const summary = (hits: readonly (number | null)[]): { med: number; reached: number } => ({
  med: median(hits.map((h) => h ?? Infinity)),
  reached: hits.filter((h) => h !== null).length,
});

async function main(): Promise<void> {
  const runs = CASES.flatMap((c) =>
    Array.from({ length: SEEDS }, (_, s) => ({ function: c.name, seed: s + 1, target: c.optimum + 0.005 * Math.abs(c.optimum), maxfev: BUDGET })),
  );
  const py = spawnSync("/usr/bin/python3", [`${root}tests/reference/optimizer_scipy.py`], { input: JSON.stringify({ runs }), encoding: "utf8" });
  const peer = py.status === 0 ? (JSON.parse(py.stdout) as { scipy: string; results: { hit: number | null }[] }) : null;
  console.log(`Exact evaluations to within 0.5% of the VLSE optimum; median of ${SEEDS} seeds (reached/seeds); budget ${BUDGET} (BO ${BO_BUDGET}).`);
  console.log(peer ? `Peer: scipy ${peer.scipy} differential_evolution (polish off).` : `Peer unavailable: ${py.stderr || "no /usr/bin/python3 with scipy"}`);
  console.log("function          method           median evals  reached  ratio to scipy DE");
  for (const [ci, c] of CASES.entries()) {
    const names = c.bounds.map((_, i) => `x${i + 1}`);
    const problem: OptimizationProblem = {
      variables: c.bounds.map(([min, max], i) => ({ kind: "continuous" as const, name: names[i]!, min, max })),
      objectives: [{ output: "f", sense: "min" }],
    };
    const evaluator = functionEvaluator((d) => ({ f: c.f(names.map((n) => d[n] as number)) }), { name: c.name });
    const target = c.optimum + 0.005 * Math.abs(c.optimum);
    const de = peer ? summary(peer.results.slice(ci * SEEDS, (ci + 1) * SEEDS).map((r) => r.hit)) : null;
    const row = (method: string, s: { med: number; reached: number }): void => {
      const ratio = de && Number.isFinite(de.med) && Number.isFinite(s.med) ? (s.med / de.med).toFixed(2) : "–";
      console.log(`${c.name.padEnd(18)}${method.padEnd(17)}${String(s.med).padStart(12)}  ${`${s.reached}/${SEEDS}`.padStart(7)}  ${ratio.padStart(17)}`);
    };
    for (const [name, run] of METHODS) {
      const hits: (number | null)[] = [];
      for (let s = 1; s <= SEEDS; s++) {
        const r = await run(problem, evaluator, s);
        const k = r.trace.findIndex((v) => v <= target);
        hits.push(k < 0 ? null : k + 1);
      }
      row(name, summary(hits));
    }
    if (de) row("scipy DE", de);
  }
}

await main();
console.log(`\n${FLOORCAST_CAUTION}`);
