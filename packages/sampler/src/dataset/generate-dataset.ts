import { createDesign, type DesignKind } from "../design/create-design.js";
import { designRows } from "../design/design-rows.js";
import { isStreamedDesign } from "../design/is-streamed-design.js";
import { createPointMapper } from "../space/point-mapper.js";
import { createUnitRowMapper } from "../space/unit-row-mapper.js";
import type { Scenario } from "../scenario/scenario.js";
import type { Evaluator, EvaluatorFunction, EvaluatorInput, EvaluatorOutput } from "../evaluator/evaluator.js";
import { resolveEvaluator } from "../evaluator/resolve-evaluator.js";
import { EvaluatorProtocolError } from "../evaluator/evaluator-protocol-error.js";
import type { DatasetRow } from "./dataset-row.js";
import type { Shard } from "./shard.js";
import { shardRange } from "./shard-range.js";

/** Options of {@link generateDataset}. */
export interface GenerateDatasetOptions {
  /** Size of the whole design (all shards together). */
  readonly n: number;
  /** Design family (createDesign). */
  readonly design: DesignKind;
  /** Seed of the design. */
  readonly seed: number | string;
  /** Generate only the k-th contiguous slice of the same design (default: all of it). */
  readonly shard?: Shard;
  /** Skip this many rows at the start of the (shard's) slice, e.g. to resume (default 0). */
  readonly skip?: number;
  /** Evaluator (default: the exact massing evaluator of the scenario). */
  readonly evaluator?: Evaluator | EvaluatorFunction;
  /** Progress of an optimized design's search (createDesign's onProgress), before the first row. */
  readonly onDesignProgress?: (done: number, total: number) => void;
}

function checkOutput(out: unknown, sample: number, reserved: ReadonlySet<string>, columns: string[] | undefined): string[] {
  const fn = "generateDataset";
  if (typeof out !== "object" || out === null || Array.isArray(out)) {
    throw new EvaluatorProtocolError(`${fn}: sample ${sample}: the evaluator must return an object, got ${JSON.stringify(out)}`, sample);
  }
  const keys = Object.keys(out);
  if (columns === undefined) {
    if (keys.length === 0) throw new EvaluatorProtocolError(`${fn}: sample ${sample}: the evaluator returned no outputs`, sample);
    for (const k of keys) {
      if (reserved.has(k)) throw new EvaluatorProtocolError(`${fn}: sample ${sample}: output ${JSON.stringify(k)} clashes with an input column`, sample);
      // a record key that JavaScript objects treat as their prototype: it would vanish from the row
      if (k === "__proto__") throw new EvaluatorProtocolError(`${fn}: sample ${sample}: output name "__proto__" is not allowed`, sample);
    }
  } else if (keys.length !== columns.length || keys.some((k, j) => k !== columns[j])) {
    throw new EvaluatorProtocolError(
      `${fn}: sample ${sample}: outputs ${JSON.stringify(keys)} differ from the first sample's ${JSON.stringify(columns)}`,
      sample,
    );
  }
  for (const k of keys) {
    const v = (out as Record<string, unknown>)[k];
    const ok = typeof v === "string" || typeof v === "boolean" || (typeof v === "number" && Number.isFinite(v));
    if (!ok) throw new EvaluatorProtocolError(`${fn}: sample ${sample}: output ${k} must be a finite number, string or boolean, got ${String(v)}`, sample);
  }
  return keys;
}

/**
 * Generates a dataset: the design (createDesign over the scenario's parameters, mapped by mapUnitToSpace), each
 * sample evaluated — by default with the exact massing rule — and yielded as a row in design order: `sample`,
 * every parameter, then every output (for the massing rule: every scalar of MassingResult, `limitedBy` as a
 * string, `coverageCapped` as 0/1). Streamed designs ("random", "sobol"; isStreamedDesign) are generated row by row
 * from the shard's first row, in memory that does not grow with n, their integer and categorical levels taken per
 * point (createPointMapper); the other designs (Latin or optimized over all n rows) are computed whole first, then
 * only the shard's slice is evaluated. Up to `evaluator.concurrency` evaluations run at once, answers kept in order.
 * Rows are produced one at a time and never held.
 * @param scenario - a validated scenario.
 * @param options - n, design, seed, optional shard, skip and evaluator.
 * @returns an async iterable of rows.
 * @throws TypeError/RangeError (when iteration starts) for bad options; EvaluatorProtocolError naming the sample
 *   for a bad evaluator answer (not an object, no outputs, a reserved or changed name, a non-finite value).
 */
export async function* generateDataset(scenario: Scenario, options: GenerateDatasetOptions): AsyncGenerator<DatasetRow> {
  const fn = "generateDataset";
  if (typeof scenario !== "object" || scenario === null || !Array.isArray(scenario.parameters)) {
    throw new TypeError(`${fn}: scenario must be a parsed scenario`);
  }
  if (typeof options !== "object" || options === null) throw new TypeError(`${fn}: options must be an object`);
  const { start, end } = shardRange(options.n, options.shard);
  const skip = options.skip ?? 0;
  if (!Number.isSafeInteger(skip) || skip < 0 || skip > end - start) {
    throw new RangeError(`${fn}: skip must be an integer in [0, ${end - start}], got ${skip}`);
  }
  const evaluator = resolveEvaluator(scenario, options.evaluator);
  const dims = scenario.parameters.length;
  const design = {
    n: options.n,
    dims,
    design: options.design,
    seed: options.seed,
    ...(options.onDesignProgress === undefined ? {} : { onProgress: options.onDesignProgress }),
  };
  let recordAt: (i: number) => Record<string, number | string>;
  if (isStreamedDesign(options.design)) {
    // Rows come in order, one per call, never held.
    const rows = designRows({ ...design, start: start + skip, end });
    const map = createPointMapper({ parameters: scenario.parameters }, "mapUnitToSpace");
    recordAt = () => map(rows.next().value as number[]);
  } else {
    const unit = createDesign(design);
    // Records are mapped row by row when needed (the rule of mapUnitToSpace): only the unit rows are held whole.
    const recordOf = createUnitRowMapper({ parameters: scenario.parameters }, unit, "mapUnitToSpace");
    recordAt = (i) => {
      const record = recordOf(i);
      unit[i] = RELEASED; // row i is never read again: free its coordinates as the run goes
      return record;
    };
  }
  const names = scenario.parameters.map((p) => p.name);
  const reserved = new Set(["sample", ...names]);
  const inFlight: { record: Record<string, number | string>; answer: Promise<EvaluatorOutput> }[] = [];
  const concurrency = Math.max(1, evaluator.concurrency);
  let next = start + skip;
  let columns: string[] | undefined;
  // Object.assign, not {...a, ...b}: V8 spreads two objects into one far more slowly (measured ~20×)
  const inputOf = (record: Record<string, number | string>): EvaluatorInput => Object.assign({}, scenario.fixed, record);
  const launch = (i: number): void => {
    const record = recordAt(i);
    const answer = Promise.resolve()
      .then(() => evaluator.evaluate([inputOf(record)], { samples: [i] }))
      .then((a) => onlyAnswer(a, i));
    answer.catch(() => {});
    inFlight.push({ record, answer });
  };
  for (let i = next; i < end; i++) {
    let out: EvaluatorOutput;
    let record: Record<string, number | string>;
    if (concurrency === 1) {
      // in-process evaluators: no promise per row unless the evaluator returns one
      record = recordAt(i);
      const answer = evaluator.evaluate([inputOf(record)], { samples: [i] });
      out = onlyAnswer(typeof (answer as { then?: unknown }).then === "function" ? await answer : (answer as readonly EvaluatorOutput[]), i);
    } else {
      while (next < end && inFlight.length < concurrency) launch(next++);
      const first = inFlight.shift()!;
      record = first.record;
      out = await first.answer;
    }
    columns = checkOutput(out, i, reserved, columns);
    const row: Record<string, number | string | boolean> = { sample: i };
    for (const name of names) row[name] = record[name]!;
    for (const k of columns) row[k] = out[k]!;
    yield row;
  }
}

/** The one answer of a one-design batch, or a RangeError naming the sample. */
function onlyAnswer(answers: readonly EvaluatorOutput[], sample: number): EvaluatorOutput {
  if (!Array.isArray(answers) || answers.length !== 1) {
    const got = Array.isArray(answers) ? `${answers.length} answers` : typeof answers;
    throw new RangeError(`generateDataset: evaluator.evaluate must answer a batch of 1 with 1 output record, got ${got} for sample ${sample}`);
  }
  return answers[0] as EvaluatorOutput;
}

/** Stands in for a unit row once its dataset row has been yielded. */
const RELEASED: number[] = [];
