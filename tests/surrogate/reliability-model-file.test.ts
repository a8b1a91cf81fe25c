import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import seedrandom from "seedrandom";
import {
  calibrateConformal,
  canonicalJson,
  EnsembleSurrogate,
  fitGaussianProcess,
  loadSurrogate,
  nodeSha256Hex,
  sealModelFile,
} from "@floorcast/surrogate";
import { fitMlp } from "@floorcast/surrogate/nn";
import { loadPredictor, sha256Hex } from "@floorcast/surrogate/predict";

// Small fitted models of each type (the map is arbitrary: derived, any smooth map serves).
const rng = seedrandom("reliability-model-file");
const x = Array.from({ length: 24 }, () => [rng() * 10, rng() * 3]);
const y = x.map((r) => [Math.sin(r[0]!) + r[1]! ** 2]);
const data = { inputs: ["a", "b"], targets: ["f"], x, y };
const gp = fitGaussianProcess(data, { seed: 1, restarts: 1 });
const gp2 = fitGaussianProcess(data, { seed: 2, restarts: 1 });
const mlp = await fitMlp(data, { layers: [4], epochs: 5, seed: 1, backend: "cpu" });
const ensemble = new EnsembleSurrogate([gp, gp2], { n: 24, seed: 0, fitTimeMs: 0, memberSeeds: [1, 2] });
const conformal = calibrateConformal(gp, { x, y }, { coverage: 0.8 });
const files: Record<string, Record<string, unknown>> = {
  gp: JSON.parse(JSON.stringify(gp.toJSON())),
  mlp: JSON.parse(JSON.stringify(mlp.toJSON())),
  ensemble: JSON.parse(JSON.stringify(ensemble.toJSON())),
  conformal: JSON.parse(JSON.stringify(conformal.toJSON())),
};
const kinds = Object.keys(files);
const clone = (v: unknown) => JSON.parse(JSON.stringify(v)) as Record<string, any>;
const loaders = [
  ["loadSurrogate", (v: unknown) => loadSurrogate(v, "m.json")],
  ["loadPredictor", (v: unknown) => loadPredictor(v)],
] as const;

describe("sha256Hex (plain TypeScript, in the dependency-free predictor)", () => {
  it("gives the FIPS 180-4 example digests", () => {
    // NIST, "SHA-256 examples" accompanying FIPS 180-4 (one-block "abc", two-block message), and the digest of the
    // empty string (from memory; it is also checked against node:crypto below).
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(sha256Hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq")).toBe(
      "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
    );
    expect(sha256Hex("")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });

  it("agrees with node:crypto on any text, including the padding boundaries 55/56/63/64 bytes and non-ASCII", () => {
    for (const len of [1, 54, 55, 56, 57, 63, 64, 65, 119, 120, 1000]) {
      const s = "q".repeat(len);
      expect(sha256Hex(s)).toBe(createHash("sha256").update(s).digest("hex"));
    }
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 300 }), (s) => {
        expect(sha256Hex(s)).toBe(createHash("sha256").update(s, "utf8").digest("hex"));
        expect(nodeSha256Hex(s)).toBe(sha256Hex(s));
      }),
      { numRuns: 300 },
    );
  });
});

describe("canonicalJson", () => {
  it("does not depend on key order and reads back to the same value", () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        // fast-check's JSON values may hold a "__proto__" key, which canonicalJson refuses by design.
        if (JSON.stringify(v).includes('"__proto__"')) {
          expect(() => canonicalJson(v, "t")).toThrow(/"__proto__" key/);
          return;
        }
        const text = canonicalJson(v, "t");
        expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(v)));
        const reversed = JSON.parse(JSON.stringify(v), (_k, val) =>
          val && typeof val === "object" && !Array.isArray(val) ? Object.fromEntries(Object.entries(val).reverse()) : val,
        );
        expect(canonicalJson(reversed, "t")).toBe(text);
      }),
      { numRuns: 200 },
    );
  });
  it("refuses NaN, ±Infinity and values JSON cannot hold, naming the path", () => {
    expect(() => canonicalJson({ a: [1, NaN] }, "t")).toThrow(/a\[1\] must be a finite number, got NaN/);
    expect(() => canonicalJson({ a: { b: -Infinity } }, "t")).toThrow(/a\.b must be a finite number/);
    expect(() => canonicalJson({ f: () => 1 }, "t")).toThrow(/f is a function/);
  });
});

describe("model files: checksum, version, truncation, shapes, prototype keys", () => {
  it("every model type's toJSON carries a sha256 checksum that both loaders verify (object and JSON text)", () => {
    for (const k of kinds) {
      const f = files[k]!;
      expect(f.checksum).toMatch(/^sha256:[0-9a-f]{64}$/);
      // The checksum is over the canonical JSON without the checksum field (derived from the stated definition).
      const { checksum: _c, ...rest } = f;
      expect(f.checksum).toBe(`sha256:${createHash("sha256").update(canonicalJson(rest, "t")).digest("hex")}`);
      for (const [, load] of loaders) {
        expect(() => load(f)).not.toThrow();
        expect(() => load(JSON.stringify(f, null, 2))).not.toThrow();
      }
    }
    // Loaded and saved again: the same checksum (sealing is deterministic).
    expect(clone(loadSurrogate(files.mlp).toJSON()).checksum).toBe(files.mlp!.checksum);
    expect(clone(loadSurrogate(files.gp).toJSON()).checksum).toBe(files.gp!.checksum);
  });

  it("an edited number anywhere in the payload, scaling or training summary is refused by both loaders", () => {
    const paths: Record<string, (f: Record<string, any>) => [any, string | number]> = {
      gp: (f) => [f.payload.components[0].alpha, 3],
      mlp: (f) => [f.payload.layers[0].weights, 2],
      ensemble: (f) => [f.payload.members[1].training, "seed"],
      conformal: (f) => [f.payload.quantiles, 0],
    };
    fc.assert(
      fc.property(fc.constantFrom(...kinds), fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), (k, delta) => {
        const f = clone(files[k]);
        const [holder, key] = paths[k]!(f);
        const before = holder[key];
        // A positive edit keeps every field schema-valid (quantiles must be ≥ 0), so only the checksum can catch it.
        holder[key] = before + (delta === 0 ? 1 : Math.abs(delta));
        if (holder[key] === before) return;
        for (const [name, load] of loaders) {
          expect(() => load(f), name).toThrow(/checksum does not match the contents/);
        }
      }),
      { numRuns: 40 },
    );
    const f = clone(files.gp);
    f.inputScaling.upper[0] += 1e-9;
    for (const [, load] of loaders) expect(() => load(f)).toThrow(/checksum does not match/);
    const g = clone(files.gp);
    g.inputs = ["b", "a"]; // swapped column names: same shapes, different meaning
    for (const [, load] of loaders) expect(() => load(g)).toThrow(/checksum does not match/);
  });

  it("a malformed checksum field is refused; a file without one (written before checksums) is accepted", () => {
    for (const k of kinds) {
      for (const [, load] of loaders) {
        expect(() => load({ ...files[k], checksum: "sha256:abc" })).toThrow(/checksum must be "sha256:" and 64/);
        expect(() => load({ ...files[k], checksum: 42 })).toThrow(/checksum/);
        const { checksum: _c, ...legacy } = files[k]!;
        expect(() => load(legacy)).not.toThrow();
      }
    }
  });

  it("a sealed file that repeats an input or target name is refused by both loaders (rows would be ambiguous)", () => {
    for (const k of kinds) {
      const f = files[k]!;
      const dupInputs = sealModelFile({ ...f, inputs: ["a", "a"] });
      expect(() => loadSurrogate(dupInputs, "m.json")).toThrow(/m\.json: inputs: must not repeat a name/);
      expect(() => loadPredictor(dupInputs)).toThrow(/loadPredictor: inputs must not repeat a name, got "a" twice/);
    }
    const two = sealModelFile({ ...files.gp!, targets: ["f", "f"], outputScaling: { mean: [0, 0], std: [1, 1] } });
    expect(() => loadSurrogate(two)).toThrow(/targets: must not repeat a name/);
    expect(() => loadPredictor(two)).toThrow(RangeError);
  });

  it("a newer formatVersion is refused with a message even when the checksum matches", () => {
    for (const k of kinds) {
      const f = sealModelFile({ ...files[k], formatVersion: 2 });
      expect(() => loadSurrogate(f)).toThrow(/formatVersion 2 was written by a newer floorcast/);
      expect(() => loadPredictor(f)).toThrow(/formatVersion 2 is not supported/);
    }
  });

  it("any truncation of the file's text is refused with a TypeError/RangeError, never a model", () => {
    const texts = kinds.map((k) => JSON.stringify(files[k]));
    fc.assert(
      fc.property(fc.constantFrom(...texts), fc.double({ min: 0, max: 1, noNaN: true }), (text, frac) => {
        const cut = text.slice(0, Math.min(text.length - 1, Math.floor(frac * text.length)));
        for (const [, load] of loaders) {
          let error: unknown;
          try {
            load(cut);
          } catch (e) {
            error = e;
          }
          expect(error instanceof RangeError || error instanceof TypeError).toBe(true);
          expect((error as Error).message).toMatch(/^load(Surrogate|Predictor): /);
        }
      }),
      { numRuns: 60 },
    );
  });

  it("weights that do not match their declared shapes are refused (with or without a matching checksum)", () => {
    const f = clone(files.mlp);
    delete f.checksum;
    f.payload.layers[0].weights.pop();
    expect(() => loadSurrogate(f)).toThrow(/weights: must have 8 values \(shape 2×4\), got 7/);
    expect(() => loadPredictor(f)).toThrow(/weights/);
    expect(() => loadSurrogate(sealModelFile(f))).toThrow(/weights/);
    expect(() => loadPredictor(sealModelFile(f))).toThrow(/weights/);
    const g = clone(files.mlp);
    g.payload.layers[1].shape = [5, 1]; // layers that no longer chain from inputs to targets
    g.payload.layers[1].weights = [1, 2, 3, 4, 5];
    for (const [, load] of loaders) expect(() => load(sealModelFile(g))).toThrow(RangeError);
    const h = clone(files.gp);
    h.payload.components[0].alpha.pop();
    for (const [, load] of loaders) expect(() => load(sealModelFile(h))).toThrow(/alpha/);
  });

  it("a model file nested 5,000 deep (conformal around conformal …, or deep JSON in the training summary) is refused, no stack overflow", () => {
    // Built as text (JSON.stringify itself would overflow at this depth); JSON.parse reads it without recursion.
    const [head, tail] = JSON.stringify({ ...files.conformal!, payload: { ...files.conformal!.payload, base: "@@" } }).split('"@@"');
    const deepText = head!.repeat(5000) + JSON.stringify(files.gp) + tail!.repeat(5000);
    const [jHead, jTail] = JSON.stringify({ ...files.gp!, training: { ...files.gp!.training, extra: "@@" } }).split('"@@"');
    const junkText = jHead + "[".repeat(5000) + "1" + "]".repeat(5000) + jTail;
    for (const v of [deepText, JSON.parse(deepText) as unknown, junkText, JSON.parse(junkText) as unknown]) {
      expect(() => loadSurrogate(v, "m.json")).toThrow(/^loadSurrogate: m\.json is nested deeper than 64 levels/);
      expect(() => loadPredictor(v)).toThrow(/^loadPredictor: the model file is nested deeper than 64 levels/);
    }
    // a legitimate nesting (conformal around an ensemble of GPs, about a dozen levels) still loads
    const ens = clone(files.ensemble);
    const wrapped = sealModelFile({ ...files.conformal!, payload: { ...files.conformal!.payload, base: ens } });
    for (const [, load] of loaders) expect(() => load(wrapped)).not.toThrow();
  });

  it('a "__proto__" key anywhere is refused and pollutes nothing', () => {
    const text = JSON.stringify(files.gp);
    const variants = [
      text.replace('"training":{', '"training":{"__proto__":{"polluted":1},'),
      text.replace('{"kind"', '{"__proto__":{"polluted":1},"kind"'),
      text.replace('"payload":{', '"payload":{"__proto__":{"polluted":1},'),
    ];
    for (const v of variants) {
      expect(v).not.toBe(text);
      for (const [, load] of loaders) expect(() => load(v)).toThrow(/"__proto__" key/);
      const legacy = v.replace(/,"checksum":"sha256:[0-9a-f]+"/, "");
      expect(legacy).not.toContain("checksum");
      for (const [, load] of loaders) expect(() => load(legacy)).toThrow(/"__proto__" key/);
    }
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it("arbitrary JSON is refused with a TypeError or RangeError naming the loader", () => {
    fc.assert(
      fc.property(fc.oneof(fc.jsonValue(), fc.record({ kind: fc.constant("floorcast.surrogate"), formatVersion: fc.constant(1), modelType: fc.constantFrom(...kinds), payload: fc.jsonValue() })), (v) => {
        for (const [, load] of loaders) {
          let error: unknown;
          try {
            load(v);
          } catch (e) {
            error = e;
          }
          expect(error instanceof RangeError || error instanceof TypeError).toBe(true);
          expect((error as Error).message).toMatch(/^load(Surrogate|Predictor): /);
        }
      }),
      { numRuns: 150 },
    );
  });

  it("the loaders never execute anything: no eval, Function constructor or dynamic import in model-file/ and predict/", () => {
    for (const dir of ["model-file", "predict"]) {
      const root = fileURLToPath(new URL(`../../packages/surrogate/src/${dir}/`, import.meta.url));
      for (const name of readdirSync(root)) {
        const src = readFileSync(root + name, "utf8");
        expect(src, name).not.toMatch(/\beval\s*\(|new\s+Function\b|\bFunction\s*\(|import\s*\(/);
      }
    }
  });
});
