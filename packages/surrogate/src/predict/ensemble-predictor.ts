import type { ModelFileShape } from "./model-file-shape.js";
import type { Predictor, PredictorOutput } from "./predictor.js";
import { objectField } from "./predictor-checks.js";
import { mixtureOfMembers } from "./mixture-of-members.js";

/**
 * Builds a predictor for an "ensemble" model file (see ensemble-payload.ts): every member is
 * loaded with `load` and their predictions combined as a uniform mixture.
 * @param file - the ensemble's model file.
 * @param load - loads one member file (the dispatching loader).
 * @throws RangeError when the members disagree with the envelope's inputs or targets.
 */
export function createEnsemblePredictor(file: ModelFileShape, load: (member: unknown) => Predictor): Predictor {
  const payload = objectField("loadPredictor", "payload", file.payload);
  if (!Array.isArray(payload.members) || payload.members.length === 0) {
    throw new RangeError("loadPredictor: payload.members must be a non-empty array of model files");
  }
  const members = (payload.members as unknown[]).map((m, i) => {
    const p = load(m);
    if (p.inputs.join("\u0000") !== file.inputs.join("\u0000") || p.targets.join("\u0000") !== file.targets.join("\u0000")) {
      throw new RangeError(`loadPredictor: payload.members[${i}] must have the ensemble's inputs and targets`);
    }
    return p;
  });
  return {
    modelType: "ensemble",
    inputs: [...file.inputs],
    targets: [...file.targets],
    predict(x: readonly (readonly number[])[]): PredictorOutput {
      return mixtureOfMembers(members.map((m) => m.predict(x)));
    },
  };
}
