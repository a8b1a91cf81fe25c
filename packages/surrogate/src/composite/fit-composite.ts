import { fitGaussianProcess } from "../gp/fit-gaussian-process.js";
import { MODEL_FILE_KIND, MODEL_FORMAT_VERSION } from "../model-file/model-file-version.js";
import { qmcNormalDraws } from "../plate-stack/qmc-normal-draws.js";
import type { Surrogate, SurrogateTrainer } from "../surrogate-types.js";
import { CompositeSurrogate, type Combiner } from "./composite-surrogate.js";

/** Training rows of a composite: inputs and one column per named intermediate output. */
export interface CompositeData {
  readonly inputs: readonly string[];
  readonly x: readonly (readonly number[])[];
  readonly intermediates: Readonly<Record<string, readonly number[]>>;
}

/**
 * Fits a general composite surrogate: one surrogate per intermediate output (a GP by default), combined at
 * prediction time by `combiner` (see CompositeSurrogate). The model file records the combiner's name; loading it
 * (loadCompositeSurrogate) asks the caller for the function.
 * @param data - inputs, rows and intermediate columns.
 * @param combiner - the named function and its outputs.
 * @param options - trainer (default fitGaussianProcess), seed, QMC draws for the sd (default 64; at most 10 intermediates).
 * @returns the fitted composite.
 */
export async function fitComposite(
  data: CompositeData,
  combiner: Combiner,
  options: { readonly trainer?: SurrogateTrainer; readonly seed?: number; readonly draws?: number } = {},
): Promise<CompositeSurrogate> {
  const fn = "fitComposite";
  if (typeof combiner !== "object" || combiner === null || typeof combiner.combine !== "function" || typeof combiner.name !== "string") {
    throw new TypeError(`${fn}: combiner must be { name, outputs, combine }`);
  }
  const names = Object.keys(data.intermediates);
  if (names.length === 0) throw new RangeError(`${fn}: data.intermediates must name at least one column`);
  const started = performance.now();
  const seed = options.seed ?? 0;
  const trainer = options.trainer ?? ((d, s) => Promise.resolve(fitGaussianProcess(d, { seed: s })));
  const inner: Surrogate[] = [];
  for (const [j, name] of names.entries()) {
    const y = data.intermediates[name]!;
    if (y.length !== data.x.length) throw new RangeError(`${fn}: data.intermediates.${name} must have one value per row`);
    inner.push(await trainer({ inputs: data.inputs, targets: [name], x: data.x, y: y.map((v) => [v]) }, seed + j));
  }
  const drawCount = options.draws ?? 64;
  const uncertain = inner.some((m) => m.kind === "gp");
  if (uncertain && drawCount > 0 && names.length > 10) throw new RangeError(`${fn}: draws need at most 10 intermediates, got ${names.length}`);
  const draws = uncertain && drawCount > 0 ? qmcNormalDraws(drawCount, names.length, seed) : [];
  const lower = data.inputs.map((_, j) => Math.min(...data.x.map((r) => r[j]!)));
  const upper = data.inputs.map((_, j) => Math.max(...data.x.map((r) => r[j]!)));
  const file = {
    kind: MODEL_FILE_KIND as "floorcast.surrogate",
    formatVersion: MODEL_FORMAT_VERSION as 1,
    modelType: "composite" as const,
    inputs: [...data.inputs],
    targets: [...combiner.outputs],
    inputScaling: { lower, upper },
    outputScaling: { mean: combiner.outputs.map(() => 0), std: combiner.outputs.map(() => 1) },
    payload: {
      combine: combiner.name,
      intermediates: names.map((name, j) => ({ name, model: inner[j]!.toJSON() as { modelType: string } })),
      draws,
    },
    training: { n: data.x.length, seed, fitTimeMs: performance.now() - started },
  };
  return new CompositeSurrogate(file, inner, combiner);
}
