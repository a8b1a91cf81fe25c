/** The hostile external evaluator's source (see packages/bench/src/benchmarks/hostile-evaluator-program.ts). */
export { HOSTILE_PROGRAM } from "../../../packages/bench/src/benchmarks/hostile-evaluator-program.js";
