import type { EnsembleModelFile } from "../model-file/ensemble-model-file-schema.js";
import type { Surrogate } from "../surrogate-types.js";
import { EnsembleSurrogate } from "./ensemble-surrogate.js";
import { sameColumns } from "./same-columns.js";

/**
 * Loader for "ensemble" model files (one line in surrogate-loaders.ts): loads and validates every
 * nested member file with loadSurrogate (errors name `payload.members[i]`).
 * @param file - validated by parseModelFile.
 * @param fileName - named in messages.
 * @param loadNested - loads a nested model file (loadSurrogate passes itself: no import cycle).
 * @throws RangeError naming the file and member.
 */
export function ensembleFromFile(file: EnsembleModelFile, fileName: string, loadNested: (json: unknown, name: string) => Surrogate): EnsembleSurrogate {
  const members = file.payload.members.map((m, i) => loadNested(m, `${fileName} payload.members[${i}]`));
  members.forEach((m, i) => {
    if (!sameColumns(m, file)) {
      throw new RangeError(`loadSurrogate: ${fileName}: payload.members[${i}] must have the ensemble's inputs and targets`);
    }
  });
  const t = file.training as Record<string, unknown>;
  const memberSeeds = Array.isArray(t.memberSeeds) ? (t.memberSeeds as number[]) : [];
  return new EnsembleSurrogate(members, { n: file.training.n, seed: file.training.seed, ...(file.training.fitTimeMs === undefined ? {} : { fitTimeMs: file.training.fitTimeMs }), memberSeeds });
}
