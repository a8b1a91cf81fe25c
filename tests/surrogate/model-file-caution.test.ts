import { describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import seedrandom from "seedrandom";
import { calibrateConformal, canonicalJson, fitGaussianProcess, loadSurrogate, withCaution } from "@floorcast/surrogate";
import { loadPredictor } from "@floorcast/surrogate/predict";

// A model file carries the caution users see with its numbers: written by withCaution (the CLI and the benchmark
// pass the one caution constant), covered by the checksum, and optional on loading (files written before it).
const rng = seedrandom("model-file-caution");
const x = Array.from({ length: 20 }, () => [rng() * 10, rng() * 3]);
const y = x.map((r) => [Math.sin(r[0]!) + r[1]! ** 2]); // an arbitrary smooth map (derived: any serves)
const gp = fitGaussianProcess({ inputs: ["a", "b"], targets: ["f"], x, y }, { seed: 1, restarts: 1 });
const conformal = calibrateConformal(gp, { x, y }, { coverage: 0.8 });
const CAUTION = "Estimates only: not a zoning determination.";
const plain = (v: unknown) => JSON.parse(JSON.stringify(v)) as Record<string, any>;
const loaders = [
  ["loadSurrogate", (v: unknown) => loadSurrogate(v, "m.json")],
  ["loadPredictor", (v: unknown) => loadPredictor(v)],
] as const;
const probe = [[2.5, 1], [7, 0.3]];

describe("withCaution", () => {
  for (const [kind, model] of [["gp", gp], ["conformal", conformal]] as const) {
    it(`${kind}: places the caution after formatVersion and re-seals; both loaders verify it and predict as without it`, () => {
      const bare = plain(model.toJSON());
      const file = plain(withCaution(bare, CAUTION));
      expect(Object.keys(file).slice(0, 3)).toEqual(["kind", "formatVersion", "caution"]);
      expect(file.caution).toBe(CAUTION);
      // the checksum is over the canonical JSON of everything but the checksum (README "Model file format"), caution included
      const { checksum, ...rest } = file;
      expect(checksum).toBe(`sha256:${createHash("sha256").update(canonicalJson(rest, "t")).digest("hex")}`);
      expect(checksum).not.toBe(bare.checksum);
      for (const [name, load] of loaders) {
        expect(load(file).predict(probe).mean, name).toEqual(load(bare).predict(probe).mean);
        expect(load(JSON.stringify(file)).predict(probe).mean, name).toEqual(load(bare).predict(probe).mean);
      }
    });
  }

  it("a file without a caution (as written before it existed) loads in both loaders", () => {
    const bare = plain(gp.toJSON());
    expect("caution" in bare).toBe(false);
    for (const [name, load] of loaders) expect(() => load(bare), name).not.toThrow();
  });

  it("a caution edited after sealing is refused by both loaders (the checksum covers it)", () => {
    const file = plain(withCaution(gp.toJSON(), CAUTION));
    file.caution = "Exact figures, rely on them.";
    for (const [name, load] of loaders) expect(() => load(file), name).toThrow(/checksum does not match the contents/);
  });

  it("a caution that is not a non-empty string is refused on loading (zod schema), even when sealed", () => {
    const unsealed = plain(gp.toJSON());
    delete unsealed.checksum;
    expect(() => loadSurrogate({ ...unsealed, caution: 3 }, "m.json")).toThrow(/caution/);
    expect(() => loadSurrogate({ ...unsealed, caution: "" }, "m.json")).toThrow(/caution/);
  });

  it("replaces an earlier caution rather than adding a second one; an unsealed file stays unsealed", () => {
    const unsealed = plain(gp.toJSON());
    delete unsealed.checksum;
    const once = withCaution(unsealed, "first");
    const twice = withCaution(once, CAUTION) as Record<string, unknown>;
    expect(twice.caution).toBe(CAUTION);
    expect(Object.keys(twice).filter((k) => k === "caution")).toHaveLength(1);
    expect("checksum" in twice).toBe(false);
  });

  it("wrong types are TypeErrors, an empty caution a RangeError, each naming the field", () => {
    expect(() => withCaution(null as unknown as object, CAUTION)).toThrow(TypeError);
    expect(() => withCaution([] as unknown as object, CAUTION)).toThrow(/withCaution: file/);
    expect(() => withCaution(gp.toJSON(), 5 as unknown as string)).toThrow(/withCaution: caution must be a string/);
    expect(() => withCaution(gp.toJSON(), "  ")).toThrow(RangeError);
    expect(() => withCaution(gp.toJSON(), "")).toThrow(/withCaution: caution must not be empty/);
  });
});
