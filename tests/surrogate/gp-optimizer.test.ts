import { describe, expect, it } from "vitest";
import { minimizeBounded } from "@floorcast/surrogate";

describe("minimizeBounded (projected L-BFGS)", () => {
  it("finds the Rosenbrock minimum (1, 1) from (−1.2, 1) (Rosenbrock 1960; standard start, Nocedal & Wright 2006 §9)", () => {
    const f = (x: Float64Array) => {
      const [a, b] = [x[0]!, x[1]!];
      return {
        value: 100 * (b - a * a) ** 2 + (1 - a) ** 2,
        gradient: [-400 * a * (b - a * a) - 2 * (1 - a), 200 * (b - a * a)],
      };
    };
    const r = minimizeBounded(f, [-1.2, 1], [-5, -5], [5, 5], { maxIterations: 500, relativeReductionTolerance: 0 });
    expect(r.converged).toBe(true);
    // A projected-gradient tolerance of 1e-5 at the minimum (Hessian eigenvalues ~0.4 and ~1000) bounds the
    // error by about 1e-5/0.4 ≈ 3e-5 (derived), so 1e-4 per coordinate.
    expect(Math.abs(r.x[0]! - 1)).toBeLessThan(1e-4);
    expect(Math.abs(r.x[1]! - 1)).toBeLessThan(1e-4);
    expect(r.value).toBeLessThan(1e-8);
  });

  it("stops on the bound when the unconstrained optimum is outside the box (derived: optimum (2, −1) → (1, −1))", () => {
    // f = (x − 2)² + 3(y + 1)² + xy/2 on [−3, 1] × [−3, 3]: with x held at 1, ∂f/∂y = 6(y + 1) + 1/2 = 0 → y = −13/12.
    const f = (v: Float64Array) => {
      const [x, y] = [v[0]!, v[1]!];
      return { value: (x - 2) ** 2 + 3 * (y + 1) ** 2 + 0.5 * x * y, gradient: [2 * (x - 2) + 0.5 * y, 6 * (y + 1) + 0.5 * x] };
    };
    const r = minimizeBounded(f, [-2, 2], [-3, -3], [1, 3]);
    expect(r.converged).toBe(true);
    expect(r.x[0]).toBe(1);
    expect(r.x[1]!).toBeCloseTo(-13 / 12, 6);
  });

  it("clamps an outside start, and survives a non-finite value by backtracking", () => {
    const f = (v: Float64Array) => (v[0]! > 2.5 ? { value: NaN, gradient: [0] } : { value: (v[0]! - 3) ** 2, gradient: [2 * (v[0]! - 3)] });
    const r = minimizeBounded(f, [-10], [0], [10]);
    expect(r.x[0]!).toBeLessThanOrEqual(2.5);
    expect(r.x[0]!).toBeGreaterThan(2);
    const s = minimizeBounded((v) => ({ value: v[0]! * v[0]!, gradient: [2 * v[0]!] }), [7], [-1], [1]);
    expect(Math.abs(s.x[0]!)).toBeLessThan(1e-5);
  });

  it("reports a non-finite start value instead of looping", () => {
    const r = minimizeBounded(() => ({ value: Infinity, gradient: [0] }), [0], [-1], [1]);
    expect(r.converged).toBe(false);
    expect(r.message).toMatch(/non-finite/);
  });
});
