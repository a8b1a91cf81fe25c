import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { fitMlp } from "@floorcast/surrogate/nn";
import { createMlpPredictor, loadPredictor } from "@floorcast/surrogate/predict";

const distPredict = fileURLToPath(new URL("../../packages/surrogate/dist/predict/", import.meta.url));

function rows(n: number, d: number, seed: string): number[][] {
  const rng = seedrandom(seed);
  return Array.from({ length: n }, () => Array.from({ length: d }, () => rng() * 10));
}

describe("@floorcast/surrogate/predict is dependency-free", () => {
  it("every built dist/predict file imports only sibling files (no tfjs, ml-matrix, zod, node:*)", () => {
    const files = readdirSync(distPredict).filter((f) => f.endsWith(".js"));
    expect(files).toContain("index.js");
    expect(files).toContain("gp-predictor.js");
    const specifier = /(?:import|export)\s[^;]*?from\s*["']([^"']+)["']|import\s*["']([^"']+)["']|import\s*\(\s*["']([^"']+)["']|require\s*\(\s*["']([^"']+)["']/g;
    for (const f of files) {
      const src = readFileSync(distPredict + f, "utf8");
      for (const m of src.matchAll(specifier)) {
        const spec = m[1] ?? m[2] ?? m[3] ?? m[4]!;
        expect(spec, `${f} imports ${spec}`).toMatch(/^\.\/[a-z0-9-]+\.js$/);
      }
      expect(src, f).not.toMatch(/\brequire\(|process\.|globalThis\.process/);
    }
  });
});

describe("loadPredictor matches the trainers", () => {
  it("GP files to 1e-9 relative (mean and sd)", () => {
    const x = rows(40, 3, "gp-x");
    const y = x.map(([a, b, c]) => [Math.sin(a!) + 0.1 * b! * c!, a! - c!]);
    const gp = fitGaussianProcess({ inputs: ["a", "b", "c"], targets: ["s", "d"], x, y }, { seed: 0, restarts: 1 });
    const q = rows(50, 3, "gp-q");
    const want = gp.predict(q);
    const got = loadPredictor(JSON.stringify(gp.toJSON())).predict(q);
    want.mean.forEach((r, i) => r.forEach((v, j) => {
      expect(Math.abs(got.mean[i]![j]! - v)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(v)));
      expect(Math.abs(got.sd![i]![j]! - want.sd![i]![j]!)).toBeLessThanOrEqual(1e-9 * Math.max(1, want.sd![i]![j]!));
    }));
  });

  it("MLP 64-64 files to 1e-5 relative", async () => {
    const x = rows(64, 12, "mlp-x");
    const y = x.map((r) => [r.reduce((s, v) => s + Math.sin(v), 0), r[0]! * r[1]!, r[2]!]);
    const m = await fitMlp({ inputs: x[0]!.map((_, i) => `x${i}`), targets: ["a", "b", "c"], x, y }, { layers: [64, 64], epochs: 3 });
    const q = rows(300, 12, "mlp-q");
    const want = m.predict(q).mean;
    const got = loadPredictor(m.toJSON()).predict(q).mean;
    const std = m.toJSON().outputScaling.std;
    want.forEach((r, i) => r.forEach((v, j) => expect(Math.abs(got[i]![j]! - v) / Math.max(Math.abs(v), std[j]!)).toBeLessThan(1e-5)));
  });
});

describe.each(["elu", "relu"] as const)("blocked MLP kernel (%s)", (activation) => {
  // 7 inputs, widths 9 and 14, 3 targets: the 3-row × 4-output tile's last panel has 1, 2 and 3 real columns,
  // and batch sizes not multiples of 3 pad the last row panel (every remainder path of the kernel).
  const rng = seedrandom(`kernel-${activation}`);
  const widths = [7, 9, 14, 3];
  const file = {
    kind: "floorcast.surrogate",
    formatVersion: 1,
    modelType: "mlp",
    inputs: Array.from({ length: 7 }, (_, i) => `x${i}`),
    targets: ["a", "b", "c"],
    inputScaling: { lower: Array(7).fill(0), upper: Array(7).fill(10) },
    outputScaling: { mean: [1, 2, 3], std: [2, 3, 4] },
    payload: {
      activation,
      layers: widths.slice(1).map((w, l) => ({
        shape: [widths[l]!, w] as [number, number],
        weights: Array.from({ length: widths[l]! * w }, () => rng() * 2 - 1),
        bias: Array.from({ length: w }, () => rng() - 0.5),
      })),
    },
    training: { n: 0, seed: 0, fitTimeMs: 0 },
  };
  const p = createMlpPredictor(file);
  const hidden = (v: number) => (activation === "relu" ? Math.max(v, 0) : v > 0 ? v : Math.expm1(v));

  /** Naive reference: the textbook forward pass, one row at a time (derived from mlp-payload.ts). */
  function naive(x: number[]): number[] {
    let h = x.map((v) => 2 * (v / 10) - 1);
    file.payload.layers.forEach((l, li) => {
      const out = l.bias.slice();
      for (let k = 0; k < l.shape[0]; k++) for (let j = 0; j < l.shape[1]; j++) out[j]! += h[k]! * l.weights[k * l.shape[1] + j]!;
      h = li === file.payload.layers.length - 1 ? out : out.map(hidden);
    });
    return h.map((v, j) => file.outputScaling.mean[j]! + file.outputScaling.std[j]! * v);
  }

  it("property: any batch (sizes across the 192-row block edges) equals the naive per-row pass", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 600 }), fc.integer({ min: 0, max: 1e6 }), (n, s) => {
        const x = rows(n, 7, `batch-${s}`);
        const got = p.predict(x).mean;
        return x.every((r, i) => naive(r).every((v, j) => Math.abs(got[i]![j]! - v) <= 1e-12 * Math.max(1, Math.abs(v))));
      }),
      { numRuns: 25 },
    );
  });

  it("predictInto fills a caller's buffer with the same values", () => {
    const x = rows(9, 7, "into");
    const flat = Float64Array.from(x.flat());
    const out = new Float64Array(27);
    p.predictInto(flat, 9, out);
    expect(Array.from(out)).toEqual(p.predict(x).mean.flat());
  });

  it("rejects unknown model types, bad JSON text and non-objects", () => {
    expect(() => loadPredictor({ ...file, modelType: "forest" })).toThrow(/modelType must be gp, mlp, ensemble, conformal or plate-stack, got "forest"/);
    expect(() => loadPredictor("{not json")).toThrow(/loadPredictor: the model file is not valid JSON/);
    expect(() => loadPredictor(42)).toThrow(TypeError);
    expect(() => loadPredictor({ ...file, inputs: [] })).toThrow(/inputs must be a non-empty array/);
  });
});
