import type { ConformalModelFile } from "../model-file/conformal-model-file-schema.js";
import type { Surrogate } from "../surrogate-types.js";
import { ConformalSurrogate } from "./conformal-surrogate.js";
import { sameColumns } from "./same-columns.js";

/**
 * Loader for "conformal" model files (one line in surrogate-loaders.ts): loads the nested base file
 * with loadSurrogate and restores the calibration.
 * @param file - validated by parseModelFile.
 * @param fileName - named in messages.
 * @param loadNested - loads a nested model file (loadSurrogate passes itself: no import cycle).
 * @throws RangeError naming the file when the base disagrees with the envelope or the quantiles with the targets.
 */
export function conformalFromFile(file: ConformalModelFile, fileName: string, loadNested: (json: unknown, name: string) => Surrogate): ConformalSurrogate {
  const base = loadNested(file.payload.base, `${fileName} payload.base`);
  if (!sameColumns(base, file)) {
    throw new RangeError(`loadSurrogate: ${fileName}: payload.base must have the file's inputs and targets`);
  }
  const p = file.payload;
  if (p.quantiles.length !== file.targets.length) {
    throw new RangeError(`loadSurrogate: ${fileName}: payload.quantiles must have ${file.targets.length} entries, got ${p.quantiles.length}`);
  }
  return new ConformalSurrogate(
    base,
    { coverage: p.coverage, score: p.score, quantiles: p.quantiles, calibrationSize: p.calibrationSize },
    file.training as Record<string, unknown>,
  );
}
