/**
 * The parts of a floorcast model file the predictor reads. Declared here (structurally, without
 * zod) so the predictor imports nothing outside its own directory; the zod schema in
 * `model-file/` is the authority on the full format.
 */
export interface ModelFileShape {
  readonly kind: string;
  readonly formatVersion: number;
  readonly modelType: string;
  /** The caution users see with the model's numbers; files written before it lack it. */
  readonly caution?: string;
  readonly inputs: readonly string[];
  readonly targets: readonly string[];
  readonly inputScaling: { readonly lower: readonly number[]; readonly upper: readonly number[] };
  readonly outputScaling: { readonly mean: readonly number[]; readonly std: readonly number[] };
  readonly payload: unknown;
  readonly training?: unknown;
  readonly checksum?: string;
}
