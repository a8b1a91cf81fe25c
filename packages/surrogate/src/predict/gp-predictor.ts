import type { ModelFileShape } from "./model-file-shape.js";
import type { Predictor, PredictorOutput } from "./predictor.js";
import { finiteVector, objectField, packRows } from "./predictor-checks.js";
import { checkGpLoadMemory } from "./gp-memory-budget.js";

const FN = "loadPredictor";
const SQRT3 = Math.sqrt(3);
const SQRT5 = Math.sqrt(5);

/**
 * g(r²) of the three stationary families (Rasmussen & Williams 2006, eqs. 4.9 and 4.17); 0 at r² = +∞ (the limit),
 * so a row whose scaled distance overflows gets the prior mean and variance instead of NaN.
 */
function profile(kernel: string): (r2: number) => number {
  switch (kernel) {
    case "se":
      return (r2) => Math.exp(-0.5 * r2);
    case "matern32":
      return (r2) => {
        if (r2 === Infinity) return 0;
        const s = SQRT3 * Math.sqrt(r2);
        return (1 + s) * Math.exp(-s);
      };
    case "matern52":
      return (r2) => {
        if (r2 === Infinity) return 0;
        const s = SQRT5 * Math.sqrt(r2);
        return (1 + s + (5 / 3) * r2) * Math.exp(-s);
      };
    default:
      throw new RangeError(`${FN}: payload.kernel must be se, matern32 or matern52, got ${JSON.stringify(kernel)}`);
  }
}

interface Component {
  readonly inv: Float64Array;
  readonly s2: number;
  readonly noise: number;
  readonly jitter: number;
  readonly alpha: Float64Array;
  chol: Float64Array | undefined;
}

/**
 * Builds a dependency-free predictor from a "gp" model file: x scaled by inputScaling, mean = k*ᵀα and latent
 * variance σ_f² − |L⁻¹k*|² with K + (σ_n² + jitter)I = LLᵀ refactored from the stored training inputs on the first
 * batch (Rasmussen & Williams 2006, Alg. 2.1); sd includes the noise σ_n², as `GaussianProcess.predict`'s `sd`.
 * Outputs are de-standardised with outputScaling.
 * @param file - a model file whose modelType is "gp".
 * @returns the predictor.
 * @throws TypeError / RangeError naming the faulty field.
 */
export function createGpPredictor(file: ModelFileShape): Predictor {
  const p = objectField(FN, "payload", file.payload);
  const g = profile(String(p.kernel));
  const d = file.inputs.length;
  const t = file.targets.length;
  const lower = finiteVector(FN, "inputScaling.lower", file.inputScaling.lower, d);
  const upper = finiteVector(FN, "inputScaling.upper", file.inputScaling.upper, d);
  const yMean = finiteVector(FN, "outputScaling.mean", file.outputScaling.mean, t);
  const yStd = finiteVector(FN, "outputScaling.std", file.outputScaling.std, t);
  const rows = p.trainingInputs;
  if (!Array.isArray(rows) || rows.length === 0) throw new RangeError(`${FN}: payload.trainingInputs must be a non-empty array`);
  const n = rows.length;
  checkGpLoadMemory(FN, "model file", n, d, t);
  const x = new Float64Array(n * d);
  rows.forEach((r, i) => x.set(finiteVector(FN, `payload.trainingInputs[${i}]`, r, d), i * d));
  const comps = p.components;
  if (!Array.isArray(comps) || comps.length !== t) throw new RangeError(`${FN}: payload.components must have ${t} entries`);
  const components: Component[] = comps.map((raw, j) => {
    const c = objectField(FN, `payload.components[${j}]`, raw);
    const ls = finiteVector(FN, `payload.components[${j}].lengthscales`, c.lengthscales, d);
    const scalars = finiteVector(FN, `payload.components[${j}] variances`, [c.signalVariance, c.noiseVariance, c.jitter], 3);
    return {
      inv: ls.map((l) => 1 / (l * l)),
      s2: scalars[0]!,
      noise: scalars[1]!,
      jitter: scalars[2]!,
      alpha: finiteVector(FN, `payload.components[${j}].alpha`, c.alpha, n),
      chol: undefined,
    };
  });
  const span = new Float64Array(d);
  for (let k = 0; k < d; k++) span[k] = upper[k]! - lower[k]! > 0 ? upper[k]! - lower[k]! : 1;

  const r2 = (a: Float64Array, ao: number, bo: number, inv: Float64Array): number => {
    let s = 0;
    for (let k = 0; k < d; k++) {
      const u = a[ao + k]! - x[bo + k]!;
      s += u * u * inv[k]!;
    }
    return s;
  };
  const factor = (c: Component): Float64Array => {
    if (c.chol) return c.chol;
    const l = new Float64Array(n * n);
    const diag = c.s2 + c.noise + c.jitter;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) {
        let s = c.s2 * g(r2(x, i * d, j * d, c.inv));
        for (let k = 0; k < j; k++) s -= l[i * n + k]! * l[j * n + k]!;
        l[i * n + j] = s / l[j * n + j]!;
      }
      let s = diag;
      for (let k = 0; k < i; k++) s -= l[i * n + k]! * l[i * n + k]!;
      if (!(s > 0)) throw new RangeError(`${FN}: the stored GP's kernel matrix is not positive definite`);
      l[i * n + i] = Math.sqrt(s);
    }
    c.chol = l;
    return l;
  };
  return {
    modelType: "gp",
    inputs: [...file.inputs],
    targets: [...file.targets],
    predict(xq: readonly (readonly number[])[]): PredictorOutput {
      const q = packRows(FN, xq, d);
      const m = xq.length;
      for (let r = 0; r < m; r++) for (let k = 0; k < d; k++) q[r * d + k] = (q[r * d + k]! - lower[k]!) / span[k]!;
      const mean = Array.from({ length: m }, () => new Array<number>(t));
      const sd = Array.from({ length: m }, () => new Array<number>(t));
      const sdLatent = Array.from({ length: m }, () => new Array<number>(t));
      const ks = new Float64Array(n);
      components.forEach((c, j) => {
        const l = factor(c);
        for (let r = 0; r < m; r++) {
          let mu = 0;
          for (let i = 0; i < n; i++) {
            ks[i] = c.s2 * g(r2(q, r * d, i * d, c.inv));
            mu += ks[i]! * c.alpha[i]!;
          }
          let vv = 0;
          for (let i = 0; i < n; i++) {
            let s = ks[i]!;
            for (let k = 0; k < i; k++) s -= l[i * n + k]! * ks[k]!;
            ks[i] = s / l[i * n + i]!;
            vv += ks[i]! * ks[i]!;
          }
          mean[r]![j] = yMean[j]! + yStd[j]! * mu;
          sd[r]![j] = yStd[j]! * Math.sqrt(Math.max(0, c.s2 - vv) + c.noise);
          sdLatent[r]![j] = yStd[j]! * Math.sqrt(Math.max(0, c.s2 - vv));
        }
      });
      return { mean, sd, sdLatent };
    },
  };
}
