import type { GpModelFile } from "../model-file/gp-model-file-schema.js";
import { GaussianProcess } from "./gaussian-process.js";
import { GpComponent } from "./gp-component.js";
import { checkGpLoadMemory } from "../predict/gp-memory-budget.js";
import type { GpTargetDiagnostics } from "./gp-diagnostics.js";

/**
 * Rebuilds a fitted GaussianProcess from a validated GP model file (shape checks beyond the schema here).
 * @param file - parsed by parseModelFile.
 * @param fileName - named in messages.
 * @returns the GP; its Cholesky factors are recomputed on the first variance request.
 * @throws RangeError naming the file and the inconsistent field.
 */
export function gaussianProcessFromFile(file: GpModelFile, fileName = "model file"): GaussianProcess {
  const fn = "loadSurrogate";
  const d = file.inputs.length;
  const p = file.payload;
  const n = p.trainingInputs.length;
  checkGpLoadMemory(fn, fileName, n, d, file.targets.length);
  if (p.components.length !== file.targets.length) {
    throw new RangeError(`${fn}: ${fileName}: payload.components must have ${file.targets.length} entries, got ${p.components.length}`);
  }
  const x = new Float64Array(n * d);
  p.trainingInputs.forEach((row, i) => {
    if (row.length !== d) throw new RangeError(`${fn}: ${fileName}: payload.trainingInputs.${i} must have ${d} entries, got ${row.length}`);
    x.set(row, i * d);
  });
  const train = { x, n, d };
  const components = p.components.map((c, j) => {
    if (c.alpha.length !== n) throw new RangeError(`${fn}: ${fileName}: payload.components.${j}.alpha must have ${n} entries, got ${c.alpha.length}`);
    if (c.lengthscales.length !== d) throw new RangeError(`${fn}: ${fileName}: payload.components.${j}.lengthscales must have ${d} entries, got ${c.lengthscales.length}`);
    const h = { lengthscales: c.lengthscales, signalVariance: c.signalVariance, noiseVariance: c.noiseVariance };
    return GpComponent.restore(train, p.kernel, h, c.jitter, Float64Array.from(c.alpha), c.logMarginalLikelihood);
  });
  const rawDiagnostics = Array.isArray(file.training.diagnostics) ? (file.training.diagnostics as unknown[]) : [];
  const targets: GpTargetDiagnostics[] = file.targets.map((target, j) => {
    const raw = (rawDiagnostics[j] ?? {}) as Partial<Record<keyof GpTargetDiagnostics, unknown>>;
    return {
      target,
      jitter: p.components[j]!.jitter,
      conditionNumber: typeof raw.conditionNumber === "number" ? raw.conditionNumber : Infinity,
      onBounds: Array.isArray(raw.onBounds) ? raw.onBounds.map(String) : [],
      warnings: Array.isArray(raw.warnings) ? raw.warnings.map(String) : [],
      restartLogMarginalLikelihoods: Array.isArray(raw.restartLogMarginalLikelihoods) ? raw.restartLogMarginalLikelihoods.map(Number) : [],
      ...(typeof raw.polishStart === "string" ? { polishStart: raw.polishStart } : {}),
    };
  });
  return new GaussianProcess({
    inputs: file.inputs,
    targets: file.targets,
    inputScaling: file.inputScaling,
    outputScaling: file.outputScaling,
    kernel: p.kernel,
    ard: p.ard,
    components,
    seed: file.training.seed,
    diagnostics: {
      targets,
      ...(file.training.fitTimeMs === undefined ? {} : { fitTimeMs: file.training.fitTimeMs }),
      hyperparameterRows: typeof file.training.hyperparameterRows === "number" ? file.training.hyperparameterRows : n,
      polishIterations: typeof file.training.polishIterations === "number" ? file.training.polishIterations : 0,
    },
  });
}
