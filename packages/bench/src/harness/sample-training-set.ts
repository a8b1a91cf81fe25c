import { createDesign } from "@floorcast/sampler";
import type { EvaluatedDesign, OptimisationProblem } from "../optimise/optimisation-problem.js";
import { createDesignCodec } from "../optimise/design-codec.js";
import { scoreOutputs } from "../optimise/evaluation-session.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import { designRow } from "./design-row.js";

/** Exactly evaluated designs over a problem's training variables, ready to fit a surrogate. */
export interface TrainingSet {
  /** Every sampled design, exactly scored against the problem. */
  readonly designs: readonly EvaluatedDesign[];
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  /** Rows whose every target is finite (the rest could not be evaluated). */
  readonly x: readonly (readonly number[])[];
  readonly y: readonly (readonly number[])[];
  readonly seconds: number;
}

/**
 * Samples `n` designs of a problem's training variables and evaluates them exactly. The unit-cube
 * rows come from `@floorcast/sampler`'s createDesign (default maximin Latin hypercube) or are
 * given (e.g. scipy's LHS, the peer sampler); lattice variables take their stratified lattice values.
 * @param problem - the problem.
 * @param n - designs, ≥ 1.
 * @param seed - design seed.
 * @param unitRows - unit-cube rows to use instead of createDesign.
 * @param design - createDesign's design (default "lhs-maximin").
 */
export function sampleTrainingSet(
  problem: BenchProblem,
  n: number,
  seed: number | string,
  unitRows?: readonly (readonly number[])[],
  design: "random" | "lhs" | "lhs-maximin" = "lhs-maximin",
): TrainingSet {
  const t0 = performance.now();
  const variables = problem.trainingVariables;
  const space: OptimisationProblem = { ...problem.optimisation, variables };
  const codec = createDesignCodec(space);
  const rows = unitRows ?? createDesign({ n, dims: variables.length, design, seed: String(seed) });
  const designs = rows.map((u) => {
    const d = codec.toDesign(codec.fromUnit(u));
    return scoreOutputs(problem.optimisation, d, problem.evaluate(d));
  });
  const x: number[][] = [];
  const y: number[][] = [];
  for (const e of designs) {
    const t = problem.outputs.map((o) => e.outputs[o] ?? Number.NaN);
    if (t.every(Number.isFinite)) {
      x.push(designRow(variables, e.design));
      y.push(t);
    }
  }
  return {
    designs,
    inputs: variables.map((v) => v.name),
    targets: problem.outputs,
    x,
    y,
    seconds: (performance.now() - t0) / 1000,
  };
}
