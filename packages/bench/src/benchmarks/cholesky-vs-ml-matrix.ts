/**
 * Benchmark: floorcast's flat Float64Array Cholesky (choleskyWithJitter) against ml-matrix's
 * CholeskyDecomposition on the same SPD kernel-like matrix at n = 1,000 (and 500), side by side in one run.
 * Run: `node packages/bench/dist/benchmarks/cholesky-vs-ml-matrix.js [n ...]`.
 */
import { CholeskyDecomposition, Matrix } from "ml-matrix";
import { choleskyWithJitter } from "@floorcast/surrogate";
import { FLOORCAST_CAUTION } from "../floorcast-caution.js";

const sizes = process.argv.slice(2).map(Number).filter((n) => Number.isInteger(n) && n > 0);
const ns = sizes.length ? sizes : [500, 1000];
const reps = 3;

function matrix(n: number): Float64Array {
  // Matérn-5/2-like correlation of n points on a line plus a small nugget: SPD, realistically conditioned.
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      const r = (Math.sqrt(5) * Math.abs(i - j)) / (0.2 * n);
      a[i * n + j] = (1 + r + (r * r) / 3) * Math.exp(-r) + (i === j ? 1e-6 : 0);
    }
  return a;
}

const median = (v: number[]): number => [...v].sort((x, y) => x - y)[Math.floor(v.length / 2)]!;

console.log("Cholesky factorisation, median of 3 runs (wall-clock ms)");
console.log("n      floorcast   ml-matrix   ml-matrix / floorcast   max |L_ours − L_ml|");
for (const n of ns) {
  const a = matrix(n);
  const ours: number[] = [];
  const theirs: number[] = [];
  let diff = 0;
  for (let r = 0; r < reps; r++) {
    const copy = a.slice();
    let t = performance.now();
    const f = choleskyWithJitter(copy, n);
    ours.push(performance.now() - t);
    const m = new Matrix(n, n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, a[i * n + j]!);
    t = performance.now();
    const c = new CholeskyDecomposition(m);
    theirs.push(performance.now() - t);
    if (r === 0) {
      const l = c.lowerTriangularMatrix;
      for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) diff = Math.max(diff, Math.abs(l.get(i, j) - f.factor[i * n + j]!));
    }
  }
  const o = median(ours);
  const t = median(theirs);
  console.log(`${String(n).padEnd(6)} ${o.toFixed(0).padStart(9)}   ${t.toFixed(0).padStart(9)}   ${(t / o).toFixed(2).padStart(21)}   ${diff.toExponential(1)}`);
}
console.log(`\n${FLOORCAST_CAUTION}`);
