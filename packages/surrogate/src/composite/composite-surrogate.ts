import type { Prediction, Surrogate } from "../surrogate-types.js";
import { checkMatrix } from "../check-training-data.js";
import { sealModelFile } from "../model-file/seal-model-file.js";
import type { CompositeModelFile } from "../model-file/composite-model-file-schema.js";

/** Combines predicted intermediate outputs (and the row's inputs) into the final outputs; a plain function. */
export type CombineFunction = (
  intermediates: Readonly<Record<string, number>>,
  inputs: Readonly<Record<string, number>>,
) => Readonly<Record<string, number>>;

/** A named combining function and the outputs it returns (the name is what the model file records). */
export interface Combiner {
  readonly name: string;
  readonly outputs: readonly string[];
  readonly combine: CombineFunction;
}

/**
 * A general composite surrogate: one fitted surrogate per named intermediate output, combined exactly by a known
 * function (composite structure: Astudillo & Frazier 2019, "Bayesian optimization of composite functions", ICML).
 * `predict` gives the combination of the intermediates' means and, when they give an sd, the sd of the
 * combination over quasi-Monte Carlo draws of the intermediates. The plate stack is floorcast's built-in instance.
 */
export class CompositeSurrogate implements Surrogate {
  readonly kind = "composite";
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly #file: Omit<CompositeModelFile, "checksum">;
  readonly #inner: readonly Surrogate[];
  readonly #combiner: Combiner;

  /**
   * @param file - the model file (its intermediates' files are the inner models' own).
   * @param inner - the fitted intermediate surrogates, in the file's order.
   * @param combiner - the function the file names.
   */
  constructor(file: Omit<CompositeModelFile, "checksum">, inner: readonly Surrogate[], combiner: Combiner) {
    if (combiner.name !== file.payload.combine) {
      throw new RangeError(`CompositeSurrogate: the file names the function ${file.payload.combine}, got ${combiner.name}`);
    }
    this.#file = file;
    this.#inner = inner;
    this.#combiner = combiner;
    this.inputs = file.inputs;
    this.targets = file.targets;
  }

  /**
   * Predicts a batch of rows.
   * @param x - rows × inputs, original units.
   * @returns mean (the function of the intermediates' means) and, with draws, sd; rows × targets.
   */
  predict(x: readonly (readonly number[])[]): Prediction {
    checkMatrix("CompositeSurrogate.predict", "x", x, this.inputs.length);
    const names = this.#file.payload.intermediates.map((i) => i.name);
    const preds = this.#inner.map((m) => {
      const p = m.predict(x);
      const sd = (p as { sdLatent?: number[][] }).sdLatent ?? p.sd;
      return { mean: p.mean.map((r) => r[0]!), sd: sd ? sd.map((r) => r[0]!) : x.map(() => 0) };
    });
    const draws = this.#file.payload.draws;
    const apply = (i: number, z: readonly number[] | null): number[] => {
      const values = Object.fromEntries(names.map((n, j) => [n, preds[j]!.mean[i]! + (z ? preds[j]!.sd[i]! * z[j]! : 0)]));
      const inputs = Object.fromEntries(this.inputs.map((n, j) => [n, x[i]![j]!]));
      const out = this.#combiner.combine(values, inputs);
      return this.targets.map((t) => out[t] ?? Number.NaN);
    };
    const mean = x.map((_, i) => apply(i, null));
    if (draws.length === 0) return { mean };
    const sd = x.map((_, i) => {
      const s = draws.map((z) => apply(i, z));
      return this.targets.map((_, t) => {
        const m = s.reduce((a, r) => a + r[t]!, 0) / s.length;
        return Math.sqrt(s.reduce((a, r) => a + (r[t]! - m) ** 2, 0) / s.length);
      });
    });
    return { mean, sd };
  }

  /** The versioned model file: the intermediates' own files and the combining function's name. */
  toJSON(): CompositeModelFile {
    return sealModelFile({ ...this.#file });
  }
}
