import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { z } from "zod";
import { inputSchemaEntrySchema } from "@floorcast/sampler";
import { inputSchemaSchema } from "@floorcast/surrogate";

// The input schema is written by the sampler (dataset manifests) and checked again by the surrogate package (model
// files), which does not import the sampler, so it keeps its own zod schema of the same shape. These checks pin the
// two together: the same JSON Schema (zod 4's toJSONSchema) and the same verdict on random entries (derived).
const samplerList = z.array(inputSchemaEntrySchema);

describe("the sampler's and the surrogate's input schema agree", () => {
  it("have the same JSON Schema", () => {
    expect(z.toJSONSchema(inputSchemaSchema)).toEqual(z.toJSONSchema(samplerList));
  });
  it("accept and refuse the same entries", () => {
    const value = fc.oneof(fc.double(), fc.integer(), fc.string({ maxLength: 3 }), fc.constant(undefined), fc.constant(Number.NaN));
    const entry = fc.record(
      {
        name: fc.oneof(fc.constant(""), fc.string({ minLength: 1, maxLength: 4 })),
        kind: fc.constantFrom("continuous", "integer", "categorical", "other"),
        min: value,
        max: value,
        scale: fc.constantFrom("linear", "log", "ln"),
        step: value,
        levels: fc.oneof(fc.array(fc.oneof(fc.string({ maxLength: 2 }), fc.double()), { maxLength: 3 }), fc.constant("a")),
        extra: fc.integer(),
      },
      { requiredKeys: ["kind"] },
    );
    fc.assert(
      fc.property(fc.array(entry, { maxLength: 3 }), (list) => {
        expect(inputSchemaSchema.safeParse(list).success).toBe(samplerList.safeParse(list).success);
      }),
      { numRuns: 2000, seed: 11 },
    );
  });
});
