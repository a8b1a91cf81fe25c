import type { Surrogate } from "../surrogate-types.js";
import type { PlateStackModelFile } from "../model-file/plate-stack-model-file-schema.js";
import { PlateStackSurrogate, type FittedQuantity } from "./plate-stack-surrogate.js";

/**
 * Loader for "plate-stack" model files (one line in surrogate-loaders.ts): loads each inner model file with
 * loadSurrogate (errors name `payload.quantities.<name>`) and checks its inputs against the payload.
 * @param file - validated by parseModelFile.
 * @param fileName - named in messages.
 * @param loadNested - loads a nested model file (loadSurrogate passes itself: no import cycle).
 * @throws RangeError naming the file and quantity.
 */
export function plateStackFromFile(file: PlateStackModelFile, fileName: string, loadNested: (json: unknown, name: string) => Surrogate): PlateStackSurrogate {
  const { quantities, ...rest } = file.payload;
  const fitted: Record<string, FittedQuantity | undefined> = {};
  for (const [name, q] of Object.entries(quantities)) {
    if (q === undefined) continue;
    if ("constant" in q) {
      fitted[name] = q;
      continue;
    }
    const model = loadNested(q.model, `${fileName} payload.quantities.${name}`);
    if (model.targets.length !== 1) throw new RangeError(`loadSurrogate: ${fileName}: payload.quantities.${name} must have one target`);
    fitted[name] = q.trend === undefined ? { model } : { model, trend: q.trend };
  }
  for (const name of [...rest.geometryInputs, ...(rest.coverageInput === null ? [] : [rest.coverageInput])]) {
    if (!file.inputs.includes(name)) throw new RangeError(`loadSurrogate: ${fileName}: payload names ${name}, not an input`);
  }
  const { checksum: _checksum, payload: _payload, ...envelope } = file;
  return new PlateStackSurrogate({ file: { ...envelope, payload: rest }, quantities: fitted });
}
