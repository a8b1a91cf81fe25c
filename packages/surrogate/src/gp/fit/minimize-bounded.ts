/** Objective value and gradient at a point. */
export interface ValueAndGradient {
  readonly value: number;
  readonly gradient: ArrayLike<number>;
}

/** Outcome of {@link minimizeBounded}. */
export interface BoundedMinimum {
  readonly x: Float64Array;
  readonly value: number;
  readonly iterations: number;
  readonly evaluations: number;
  readonly converged: boolean;
  readonly message: string;
}

/** Options of {@link minimizeBounded}; defaults follow scipy's L-BFGS-B (m = 10, pgtol 1e-5, factr 1e7). */
export interface MinimizeBoundedOptions {
  readonly memory?: number;
  readonly maxIterations?: number;
  readonly projectedGradientTolerance?: number;
  readonly relativeReductionTolerance?: number;
}

const clamp = (v: number, lo: number, hi: number): number => (v < lo ? lo : v > hi ? hi : v);

/**
 * Minimises a smooth function on a box by projected L-BFGS: the two-loop recursion (Nocedal & Wright 2006,
 * Alg. 7.4) on the free variables (those not held at a bound by the gradient), a projected backtracking
 * line search with the Armijo condition along x(t) = P(x + t d) (Bertsekas 1982; Byrd, Lu, Nocedal & Zhu 1995
 * for the L-BFGS-B setting), and curvature-safeguarded memory updates.
 * Stops when the projected gradient's ∞-norm falls below the tolerance or the relative reduction of f does.
 * @param f - objective returning value and gradient; a non-finite value makes the line search backtrack.
 * @param x0 - start (clamped into the box).
 * @param lower - lower bounds.
 * @param upper - upper bounds.
 * @param options - memory, iteration cap and tolerances.
 * @returns the best point found and why it stopped.
 */
export function minimizeBounded(
  f: (x: Float64Array) => ValueAndGradient,
  x0: ArrayLike<number>,
  lower: ArrayLike<number>,
  upper: ArrayLike<number>,
  options: MinimizeBoundedOptions = {},
): BoundedMinimum {
  const m = options.memory ?? 10;
  const maxIter = options.maxIterations ?? 200;
  const pgtol = options.projectedGradientTolerance ?? 1e-5;
  const ftol = options.relativeReductionTolerance ?? 1e7 * 2.220446049250313e-16;
  const n = x0.length;
  let x: Float64Array = new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = clamp(x0[i]!, lower[i]!, upper[i]!);
  let fx = f(x);
  let evaluations = 1;
  if (!Number.isFinite(fx.value)) {
    return { x, value: fx.value, iterations: 0, evaluations, converged: false, message: "non-finite value at start" };
  }
  let g: Float64Array = Float64Array.from(fx.gradient);
  const ss: Float64Array[] = [];
  const ys: Float64Array[] = [];
  const rhos: number[] = [];
  const free = new Uint8Array(n);
  const d = new Float64Array(n);
  const alphas = new Float64Array(m);
  for (let iter = 0; iter < maxIter; iter++) {
    let pgMax = 0;
    for (let i = 0; i < n; i++) {
      const atLower = x[i]! <= lower[i]! && g[i]! > 0;
      const atUpper = x[i]! >= upper[i]! && g[i]! < 0;
      free[i] = atLower || atUpper ? 0 : 1;
      if (free[i]) pgMax = Math.max(pgMax, Math.abs(g[i]!));
    }
    if (pgMax < pgtol) {
      return { x, value: fx.value, iterations: iter, evaluations, converged: true, message: "projected gradient below tolerance" };
    }
    for (let i = 0; i < n; i++) d[i] = free[i] ? -g[i]! : 0;
    const k = ss.length;
    for (let j = k - 1; j >= 0; j--) {
      alphas[j] = rhos[j]! * dotFree(ss[j]!, d, free);
      axpyFree(-alphas[j]!, ys[j]!, d, free);
    }
    if (k > 0) {
      const s = ss[k - 1]!;
      const yv = ys[k - 1]!;
      const gamma = dotFree(s, yv, free) / Math.max(dotFree(yv, yv, free), 1e-300);
      for (let i = 0; i < n; i++) d[i] = d[i]! * (gamma > 0 && Number.isFinite(gamma) ? gamma : 1);
    }
    for (let j = 0; j < k; j++) {
      const beta = rhos[j]! * dotFree(ys[j]!, d, free);
      axpyFree(alphas[j]! - beta, ss[j]!, d, free);
    }
    // The recursion is linear, so starting from −g yields d = −H g; fall back to steepest descent if not descending.
    let slope = 0;
    for (let i = 0; i < n; i++) slope += g[i]! * d[i]!;
    if (!(slope < 0)) {
      ss.length = ys.length = rhos.length = 0;
      for (let i = 0; i < n; i++) d[i] = free[i] ? -g[i]! : 0;
    }
    let t = 1;
    if (ss.length === 0) {
      let dmax = 0;
      for (let i = 0; i < n; i++) dmax = Math.max(dmax, Math.abs(d[i]!));
      t = Math.min(1, 1 / dmax);
    }
    let accepted: { x: Float64Array; fx: ValueAndGradient } | undefined;
    for (let ls = 0; ls < 40; ls++) {
      const xt = new Float64Array(n);
      let decrease = 0;
      for (let i = 0; i < n; i++) {
        xt[i] = clamp(x[i]! + t * d[i]!, lower[i]!, upper[i]!);
        decrease += g[i]! * (xt[i]! - x[i]!);
      }
      const ft = f(xt);
      evaluations++;
      if (Number.isFinite(ft.value) && ft.value <= fx.value + 1e-4 * decrease) {
        accepted = { x: xt, fx: ft };
        break;
      }
      t *= 0.5;
    }
    if (!accepted) {
      return { x, value: fx.value, iterations: iter, evaluations, converged: false, message: "line search failed" };
    }
    const s = new Float64Array(n);
    const yv = new Float64Array(n);
    const gNew = Float64Array.from(accepted.fx.gradient);
    for (let i = 0; i < n; i++) {
      s[i] = accepted.x[i]! - x[i]!;
      yv[i] = gNew[i]! - g[i]!;
    }
    let sy = 0;
    let yy = 0;
    for (let i = 0; i < n; i++) {
      sy += s[i]! * yv[i]!;
      yy += yv[i]! * yv[i]!;
    }
    if (sy > 1e-10 * yy) {
      ss.push(s);
      ys.push(yv);
      rhos.push(1 / sy);
      if (ss.length > m) {
        ss.shift();
        ys.shift();
        rhos.shift();
      }
    }
    const reduction = fx.value - accepted.fx.value;
    const scale = Math.max(Math.abs(fx.value), Math.abs(accepted.fx.value), 1);
    x = accepted.x;
    fx = accepted.fx;
    g = gNew;
    if (reduction <= ftol * scale) {
      return { x, value: fx.value, iterations: iter + 1, evaluations, converged: true, message: "relative reduction below tolerance" };
    }
  }
  return { x, value: fx.value, iterations: maxIter, evaluations, converged: false, message: "iteration limit reached" };
}

function dotFree(a: Float64Array, b: Float64Array, free: Uint8Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) if (free[i]) s += a[i]! * b[i]!;
  return s;
}

function axpyFree(c: number, a: Float64Array, out: Float64Array, free: Uint8Array): void {
  for (let i = 0; i < a.length; i++) if (free[i]) out[i] = out[i]! + c * a[i]!;
}
