import { describe, expect, it } from "vitest";
import seedrandom from "seedrandom";
import { fitEnsemble, fitGaussianProcess, loadSurrogate } from "@floorcast/surrogate";
import type { Surrogate, TrainingData } from "@floorcast/surrogate";
import { fitMlp } from "@floorcast/surrogate/nn";
import { loadPredictor } from "@floorcast/surrogate/predict";

const rng = seedrandom("reliability-degenerate");
const base = Array.from({ length: 12 }, () => [rng() * 10, rng() * 4]);
const smooth = (r: number[]) => Math.sin(r[0]!) + r[1]!;
const make = (x: number[][], y: number[]): TrainingData => ({ inputs: ["a", "b"], targets: ["y"], x, y: y.map((v) => [v]) });

/** Degenerate training sets a user can produce; `exact` is what a correct model must predict at the training rows. */
const cases: { name: string; data: TrainingData; check?: (pred: number[], data: TrainingData) => void }[] = [
  {
    name: "constant target",
    data: make(base, base.map(() => 42.5)),
    check: (p) => p.forEach((v) => expect(v).toBeCloseTo(42.5, 6)), // the only value the data allow (derived)
  },
  {
    name: "one distinct input (every row the same x, y varying)",
    data: make(base.map(() => [3, 1]), base.map((_, i) => 10 + (i % 3))),
    // The least-squares answer at that x is the mean of y, 11 (derived); a smoother may not go outside [10, 12].
    check: (p) => p.forEach((v) => expect(v).toBeGreaterThanOrEqual(10 - 1e-6) && expect(v).toBeLessThanOrEqual(12 + 1e-6)),
  },
  { name: "duplicated rows (each row three times)", data: make([...base, ...base, ...base], [...base, ...base, ...base].map(smooth)) },
  { name: "a zero-variance input column", data: make(base.map((r) => [7, r[1]!]), base.map((r) => 2 * r[1]!)) },
  {
    name: "targets near 1e12 (relative spread 1e-9)",
    data: make(base, base.map((r) => 1e12 + 100 * r[0]! + r[1]!)),
    check: (p, d) => p.forEach((v) => expect(Math.abs(v - 1e12)).toBeLessThan(2e3)), // within the data's range ± its spread (derived)
  },
  { name: "targets spanning 0 to 1e12", data: make(base, base.map((r) => 1e11 * r[0]!)) },
  { name: "inputs near 1e15 with a span of 10", data: make(base.map((r) => [1e15 + r[0]!, r[1]!]), base.map(smooth)) },
  { name: "inputs of order 1e-300", data: make(base.map((r) => [r[0]! * 1e-300, r[1]!]), base.map(smooth)) },
  { name: "targets of order 1e300 (their squares overflow)", data: make(base, base.map((r) => 1e299 * r[0]! - 5e299)) },
  { name: "targets of both signs near 1e200", data: make(base, base.map((r) => (r[1]! - 2) * 1e200)) },
  { name: "two identical rows", data: make([[1, 1], [1, 1]], [5, 5]), check: (p) => p.forEach((v) => expect(v).toBeCloseTo(5, 6)) },
];

/** New rows inside, at the edge of and well outside the data's box. */
function probes(d: TrainingData): number[][] {
  const lo = [0, 1].map((j) => Math.min(...d.x.map((r) => r[j]!)));
  const hi = [0, 1].map((j) => Math.max(...d.x.map((r) => r[j]!)));
  const at = (t: number) => [0, 1].map((j) => lo[j]! + t * (hi[j]! - lo[j]! || 1));
  return [at(0.5), at(0), at(1), at(-3), at(4), ...d.x.slice(0, 3)];
}

function expectWorking(model: Surrogate, d: TrainingData, check?: (pred: number[], data: TrainingData) => void): void {
  const rows = probes(d);
  const p = model.predict(rows);
  for (const r of p.mean) expect(Number.isFinite(r[0]), `mean ${r[0]}`).toBe(true);
  for (const r of p.sd ?? []) expect(Number.isFinite(r[0]) && r[0]! >= 0, `sd ${r[0]}`).toBe(true);
  check?.(model.predict(d.x).mean.map((r) => r[0]!), d);
  // The saved file loads in both loaders and predicts the same, finite values.
  const text = JSON.stringify(model.toJSON());
  const again = loadSurrogate(text).predict(rows).mean;
  const pred = loadPredictor(text).predict(rows).mean;
  // Tolerance: GP files reload bit for bit; MLP files are predicted in float64 from float32 tfjs weights, which the
  // predictor's own tests allow 1e-5 relative (README, "Embedding the predictor"); here 1e-5 of the target's scale.
  const scale = Math.max(...d.y.map((r) => Math.abs(r[0]!)), 1);
  rows.forEach((_, i) => {
    for (const other of [again[i]![0]!, pred[i]![0]!]) {
      expect(Number.isFinite(other)).toBe(true);
      if (model.kind === "gp") expect(other).toBe(p.mean[i]![0]);
      else expect(Math.abs(other - p.mean[i]![0]!)).toBeLessThanOrEqual(1e-5 * scale);
    }
  });
}

/** Fitting ends with a working model, or a RangeError naming the fitting function: never NaN predictions. */
async function fitsOrRefuses(fit: () => Promise<Surrogate> | Surrogate, fn: RegExp, d: TrainingData, check?: (p: number[], d: TrainingData) => void) {
  let model: Surrogate;
  try {
    model = await fit();
  } catch (error) {
    expect(error).toBeInstanceOf(RangeError);
    expect((error as Error).message).toMatch(fn);
    return "refused";
  }
  expectWorking(model, d, check);
  return "fitted";
}

describe("numerical health on degenerate data", () => {
  it.each(cases)("GP: $name", async ({ data, check }) => {
    expect(await fitsOrRefuses(() => fitGaussianProcess(data, { seed: 1, restarts: 2 }), /^fitGaussianProcess: /, data, check)).toBe("fitted");
  });

  it.each(cases)("NN: $name", async ({ data, check }) => {
    const outcome = await fitsOrRefuses(() => fitMlp(data, { layers: [8], epochs: 30, seed: 1, backend: "cpu" }), /^fitMlp: /, data, check);
    expect(outcome).toBe("fitted");
  });

  it("a GP ensemble on duplicated rows near 1e12 gives finite means and sds", async () => {
    const d = cases[4]!.data;
    const e = await fitEnsemble(async (data, seed) => fitGaussianProcess(data, { seed, restarts: 1 }), make([...d.x, ...d.x], [...d.y, ...d.y].map((r) => r[0]!)), { members: 2, seed: 1 });
    expectWorking(e, d);
  });
});

describe("rows far outside the data: finite, the prior's limit, never NaN", () => {
  // At a scaled distance whose square overflows (|x| ≳ 1e155 here), every correlation with the training rows is 0,
  // the limit of the Matérn and SE profiles as r → ∞ (Rasmussen & Williams 2006, eqs. 4.9 and 4.17); the posterior
  // is then the prior: mean = the output scaling's mean, sd = σ_y·√(σ_f² + σ_n²) (R&W Alg. 2.1 with k* = 0; derived).
  it.each(["se", "matern32", "matern52"] as const)("%s kernel, in loadSurrogate and loadPredictor", (kernel) => {
    const d = make(base, base.map(smooth));
    const gp = fitGaussianProcess(d, { seed: 1, restarts: 1, kernel });
    const far = [[1e160, 30], [-1e200, 1e180], [3, 1e300]];
    const text = JSON.stringify(gp.toJSON());
    const file = gp.toJSON() as unknown as { outputScaling: { mean: number[]; std: number[] } };
    const mean = file.outputScaling.mean[0]!;
    const h = gp.hyperparameters()[0]!;
    const priorSd = file.outputScaling.std[0]! * Math.sqrt(h.signalVariance + h.noiseVariance);
    for (const p of [gp.predict(far), loadSurrogate(text).predict(far), loadPredictor(text).predict(far)]) {
      for (let i = 0; i < far.length; i++) {
        expect(Number.isFinite(p.mean[i]![0]), `mean ${p.mean[i]![0]}`).toBe(true);
        expect(p.mean[i]![0]).toBeCloseTo(mean, 9);
        const sd = p.sd![i]![0]!;
        expect(Number.isFinite(sd)).toBe(true);
        expect(Math.abs(sd - priorSd)).toBeLessThanOrEqual(1e-9 * priorSd);
      }
    }
    for (const g of gp.gradient(far[0]!)) for (const v of g) expect(Number.isFinite(v)).toBe(true);
  });
});
