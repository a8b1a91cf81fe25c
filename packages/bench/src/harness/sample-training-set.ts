import { join } from "node:path";
import { createCsvWriter, createVariableCodec, readTable, writeDataset, type DesignKind } from "@floorcast/sampler";
import type { EvaluatedDesign } from "../optimize/optimization-problem.js";
import { scoreOutputs } from "../optimize/evaluation-session.js";
import type { BenchProblem } from "../problem/bench-problem.js";
import { exactEvaluator } from "./exact-evaluator.js";

/** Exactly evaluated designs over a problem's training variables, as a dataset file and its rows. */
export interface TrainingSet {
  /** Every sampled design, exactly scored against the problem. */
  readonly designs: readonly EvaluatedDesign[];
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  /** Model rows (the sampler's coding: a numeric categorical level as its value) and targets, as read from `csv`. */
  readonly x: readonly (readonly number[])[];
  readonly y: readonly (readonly number[])[];
  /** The dataset CSV (with its manifest beside it unless the unit rows were given). */
  readonly csv: string;
  readonly seconds: number;
}

/**
 * Samples `n` designs of a problem's training variables and evaluates them exactly, the way a user does:
 * writeDataset over the problem's scenario (`floorcast sample`: the same design kinds, CSV columns and manifest),
 * then the CSV is read back with the CSV reader `fit` uses. Given unit rows (another sampler's design, e.g.
 * scipy's LHS) are mapped by the sampler's codec, evaluated and written as a CSV of the same columns, without a
 * manifest (no `sample` run produced them).
 * @param problem - the problem.
 * @param n - designs, ≥ 1.
 * @param seed - design seed.
 * @param dir - folder the CSV (and manifest) is written to.
 * @param unitRows - unit-cube rows to use instead of a design of `design`.
 * @param design - the design kind (default "lhs-maximin", as `sample`).
 * @returns the training set.
 */
export async function sampleTrainingSet(
  problem: BenchProblem,
  n: number,
  seed: number | string,
  dir: string,
  unitRows?: readonly (readonly number[])[],
  design: DesignKind = "lhs-maximin",
): Promise<TrainingSet> {
  const t0 = performance.now();
  const variables = problem.trainingVariables;
  const inputs = variables.map((v) => v.name);
  const targets = problem.outputs;
  const csv = join(dir, `${String(seed)}-${unitRows ? "given" : design}-${n}.csv`);
  const codec = createVariableCodec(variables);
  if (unitRows) {
    const writer = createCsvWriter(csv, ["sample", ...inputs, ...targets]);
    const designs = unitRows.map((u) => codec.toDesign(codec.fromUnit(u)));
    const outs = await exactEvaluator(problem).evaluate(designs);
    for (const [i, d] of designs.entries()) {
      await writer.write([i, ...inputs.map((k) => d[k]!), ...targets.map((t) => outs[i]![t] ?? Number.NaN)]);
    }
    await writer.close();
  } else {
    const evaluator = problem.dataset.evaluator();
    try {
      await writeDataset(problem.dataset.scenario, { out: csv, n, design, seed, evaluator, force: true });
    } finally {
      await evaluator.close();
    }
  }
  const table = await readTable(csv, { inputs, targets: [...targets] });
  const designs = table.x.map((row, i) => {
    const outputs = Object.fromEntries(targets.map((t, j) => [t, table.y[i]![j]!]));
    return scoreOutputs(problem.optimization, codec.fromRow("sampleTrainingSet", row), outputs);
  });
  return { designs, inputs, targets, x: table.x, y: table.y, csv, seconds: (performance.now() - t0) / 1000 };
}

