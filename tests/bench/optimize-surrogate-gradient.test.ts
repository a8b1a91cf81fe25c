// Projected gradient on a surrogate with the surrogate's own analytic gradient, and Pareto filtering properties.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { fitGaussianProcess } from "@floorcast/surrogate";
import { createDesign } from "@floorcast/sampler";
import { dominates, nonDominatedIndices, projectedGradient, type Design, type Evaluator } from "@floorcast/bench";
import { branin, braninProblem } from "./optimize-test-functions.js";

describe("projected gradient with a GP's analytic mean gradient (Branin surrogate)", () => {
  // A GP fitted to 60 Latin-hypercube Branin points (VLSE function) stands in for a surrogate.
  const unit = createDesign({ n: 60, dims: 2, design: "lhs", seed: 11 });
  const x = unit.map(([a, b]) => [-5 + 15 * a!, 15 * b!]);
  const gp = fitGaussianProcess({ inputs: ["x1", "x2"], targets: ["f"], x, y: x.map(([a, b]) => [branin(a!, b!)]) }, { seed: 1 });
  const evaluate = async (batch: readonly Design[]) => gp.predict(batch.map((d) => [d.x1 as number, d.x2 as number])).mean.map((m) => ({ f: m[0]! }));
  const withGradient: Evaluator = {
    evaluate,
    async gradient(batch) {
      return batch.map((d) => {
        const g = gp.gradient([d.x1 as number, d.x2 as number]);
        return { f: { x1: g[0]![0]!, x2: g[0]![1]! } };
      });
    },
  };
  it("reaches the same surrogate optimum as finite differences, with fewer evaluations, at a stationary point", async () => {
    const an = await projectedGradient(braninProblem, withGradient, { seed: 2, maxEvaluations: 3000 });
    const fd = await projectedGradient(braninProblem, { evaluate }, { seed: 2, maxEvaluations: 3000 });
    expect(an.gradientCalls).toBeGreaterThan(0);
    expect(an.evaluations).toBeLessThan(fd.evaluations);
    // Both minimise the same smooth mean: agreement to 1e-6 of the function's scale (common practice).
    expect(Math.abs(an.best!.objectives[0]! - fd.best!.objectives[0]!)).toBeLessThan(1e-6 * 300);
    // The optimum lies on the surrogate's minimum: its analytic gradient there is ≈ 0 unless on a bound.
    const d = an.best!.design;
    const g = gp.gradient([d.x1 as number, d.x2 as number])[0]!;
    const onBound = [d.x1 === -5 || d.x1 === 10, d.x2 === 0 || d.x2 === 15];
    g.forEach((v, k) => {
      if (!onBound[k]) expect(Math.abs(v)).toBeLessThan(1e-3);
    });
  });
});

describe("nonDominatedIndices properties (fast-check)", () => {
  it("keeps exactly the points no other point dominates (one copy of duplicates)", () => {
    const pt = fc.array(fc.integer({ min: 0, max: 6 }), { minLength: 3, maxLength: 3 });
    fc.assert(
      fc.property(fc.array(pt, { maxLength: 25 }), (pts) => {
        const keep = new Set(nonDominatedIndices(pts));
        pts.forEach((p, i) => {
          const dominated = pts.some((q) => dominates(q, p));
          const earlierCopy = pts.slice(0, i).some((q) => q.every((v, k) => v === p[k]));
          expect(keep.has(i)).toBe(!dominated && !earlierCopy);
        });
      }),
    );
  });
});
