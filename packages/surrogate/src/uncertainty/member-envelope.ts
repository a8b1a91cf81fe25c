/** The envelope fields a wrapper copies from the model it wraps. */
export interface MemberEnvelope {
  readonly file: Record<string, unknown>;
  readonly inputScaling: { readonly lower: readonly number[]; readonly upper: readonly number[] };
  readonly outputScaling: { readonly mean: readonly number[]; readonly std: readonly number[] };
}

/**
 * Reads a wrapped surrogate's model file (its `toJSON()`), checking that it is an object carrying
 * the shared envelope's scalings, so the wrapper can nest it and repeat those scalings.
 * @param fn - caller named in messages.
 * @param label - which member, e.g. "members[2]".
 * @param json - the member's `toJSON()` value.
 * @throws TypeError when it is not a floorcast model file.
 */
export function memberEnvelope(fn: string, label: string, json: unknown): MemberEnvelope {
  const file = JSON.parse(JSON.stringify(json)) as unknown;
  if (typeof file !== "object" || file === null || Array.isArray(file)) {
    throw new TypeError(`${fn}: ${label}.toJSON() must give a model file object`);
  }
  const rec = file as Record<string, unknown>;
  const inputScaling = rec.inputScaling as MemberEnvelope["inputScaling"] | undefined;
  const outputScaling = rec.outputScaling as MemberEnvelope["outputScaling"] | undefined;
  if (rec.kind !== "floorcast.surrogate" || !inputScaling || !outputScaling) {
    throw new TypeError(`${fn}: ${label}.toJSON() must give a floorcast model file (kind, inputScaling, outputScaling)`);
  }
  return { file: rec, inputScaling, outputScaling };
}
