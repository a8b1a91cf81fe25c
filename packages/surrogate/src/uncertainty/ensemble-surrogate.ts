import type { Prediction, Surrogate } from "../surrogate-types.js";
import { mixtureOfMembers } from "../predict/mixture-of-members.js";
import { memberEnvelope } from "./member-envelope.js";
import { sameColumns } from "./same-columns.js";
import { sealModelFile } from "../model-file/seal-model-file.js";

/** Training summary of an ensemble file. */
export interface EnsembleTraining {
  readonly n: number;
  readonly seed: number;
  /** Only in files written before fit times left the file. */
  readonly fitTimeMs?: number;
  readonly memberSeeds: readonly number[];
}

/**
 * A deep ensemble (Lakshminarayanan, Pritzel & Blundell 2017): k fitted members, predicting the
 * uniform mixture's mean and sd, σ² = (1/k) Σ (σ_m² + (μ_m − μ)²) with σ_m = 0 for members that
 * give no sd (then σ is the spread of the members' means, divisor k). Wraps any surrogates with the
 * same inputs and targets; its model file nests the members' files.
 */
export class EnsembleSurrogate implements Surrogate {
  readonly kind = "ensemble";
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly members: readonly Surrogate[];
  /** Gradient of the ensemble mean (average of the members' gradients); present when every member has one. */
  readonly gradient?: (x: readonly number[]) => number[][];
  readonly #file: Record<string, unknown>;

  /**
   * @param members - k ≥ 1 fitted surrogates with identical inputs and targets.
   * @param training - summary stored in the file.
   * @throws RangeError when members is empty or the members disagree on inputs or targets.
   */
  constructor(members: readonly Surrogate[], training: EnsembleTraining) {
    const fn = "EnsembleSurrogate";
    if (!Array.isArray(members) || members.length === 0) throw new RangeError(`${fn}: members must hold at least one surrogate`);
    const first = members[0]!;
    members.forEach((m, i) => {
      if (!sameColumns(m, first)) {
        throw new RangeError(`${fn}: members[${i}] must have the inputs and targets of members[0]`);
      }
    });
    this.members = [...members];
    this.inputs = [...first.inputs];
    this.targets = [...first.targets];
    const envelopes = members.map((m, i) => memberEnvelope(fn, `members[${i}]`, m.toJSON()));
    this.#file = {
      kind: "floorcast.surrogate",
      formatVersion: 1,
      modelType: "ensemble",
      inputs: [...this.inputs],
      targets: [...this.targets],
      inputScaling: envelopes[0]!.inputScaling,
      outputScaling: envelopes[0]!.outputScaling,
      payload: { members: envelopes.map((e) => e.file) },
      training: { ...training, memberSeeds: [...training.memberSeeds], members: members.length },
    };
    const grads = members.map((m) => (m as { gradient?: (x: readonly number[]) => number[][] }).gradient);
    if (grads.every((g) => typeof g === "function")) {
      this.gradient = (x) => {
        const all = grads.map((g, i) => g!.call(members[i], x));
        return all[0]!.map((row, j) => row.map((_, k) => all.reduce((s, gm) => s + gm[j]![k]!, 0) / all.length));
      };
    }
  }

  /** Mixture mean and sd, rows × targets. @throws RangeError (from the members) for bad rows. */
  predict(x: readonly (readonly number[])[]): Prediction {
    return mixtureOfMembers(this.members.map((m) => m.predict(x)));
  }

  /** The "ensemble" model file, nesting every member's file. */
  toJSON(): Record<string, unknown> {
    return sealModelFile(this.#file);
  }
}
