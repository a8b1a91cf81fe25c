import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  crowdingDistance,
  fastNonDominatedSort,
  gridSearch,
  hypervolume,
  nonDominatedIndices,
  nsga2,
  type OptimizationProblem,
} from "@floorcast/bench";
import { fnEvaluator, zdt1 } from "./optimize-test-functions.js";

/** Independent reference: inclusion–exclusion over subsets of the boxes [p, ref] (minimisation). */
function hvInclusionExclusion(points: number[][], ref: number[]): number {
  const pts = points.filter((p) => p.every((v, k) => v < ref[k]!));
  let total = 0;
  for (let mask = 1; mask < 1 << pts.length; mask++) {
    const corner = ref.map(() => -Infinity);
    let size = 0;
    pts.forEach((p, i) => {
      if (mask & (1 << i)) {
        size++;
        p.forEach((v, k) => (corner[k] = Math.max(corner[k]!, v)));
      }
    });
    const vol = corner.reduce((acc, c, k) => acc * Math.max(0, ref[k]! - c), 1);
    total += size % 2 === 1 ? vol : -vol;
  }
  return total;
}

describe("hypervolume on hand-computed fronts (derived by hand)", () => {
  it("2-D staircase {(1,3), (2,2), (3,1)} below (4,4) is 3 + 2 + 1 = 6; dominated and outside points add nothing", () => {
    const front = [[1, 3], [2, 2], [3, 1]];
    expect(hypervolume(front, [4, 4])).toBe(6);
    expect(hypervolume([...front, [3, 3], [2, 2], [5, 0], [4, 1]], [4, 4])).toBe(6);
    expect(hypervolume([[3, 1], [1, 3], [2, 2]], [4, 4])).toBe(6); // order does not matter
  });
  it("maximised objectives: {(3,1), (2,2), (1,3)} above (0,0) is 6", () => {
    expect(hypervolume([[3, 1], [2, 2], [1, 3]], [0, 0], ["max", "max"])).toBe(6);
    // mixed senses: maximise f1 from 0, minimise f2 below 4: points (3,3), (1,1) → 3·1 + 1·(3 − 1) = 5.
    expect(hypervolume([[3, 3], [1, 1]], [0, 4], ["max", "min"])).toBe(5);
  });
  it("3-D: one box 1·2·3 = 6; two overlapping boxes 4 + 2 − 1 = 5", () => {
    expect(hypervolume([[1, 1, 1]], [2, 3, 4])).toBe(6);
    expect(hypervolume([[0, 0, 1], [1, 1, 0]], [2, 2, 2])).toBe(5);
  });
  it("edge cases: empty is 0; NaN and a wrong length throw; an infinite reference throws", () => {
    expect(hypervolume([], [1, 1])).toBe(0);
    expect(() => hypervolume([[NaN, 1]], [2, 2])).toThrow(/hypervolume: points\[0\] has a NaN/);
    expect(() => hypervolume([[1, 1, 1]], [2, 2])).toThrow(RangeError);
    expect(() => hypervolume([[1, 1]], [Infinity, 2])).toThrow(/reference\[0\] must be finite/);
    expect(() => hypervolume([[1, 1]], [])).toThrow(/must not be empty/);
    expect(hypervolume([[Infinity, 0]], [2, 2])).toBe(0);
  });
  it("equals inclusion–exclusion on random 2-, 3- and 4-D sets (fast-check)", () => {
    const coord = fc.integer({ min: 0, max: 20 }).map((v) => v / 4);
    for (const d of [2, 3, 4]) {
      fc.assert(
        fc.property(fc.array(fc.array(coord, { minLength: d, maxLength: d }), { maxLength: 7 }), (pts) => {
          const ref = new Array<number>(d).fill(5.5);
          expect(hypervolume(pts, ref)).toBeCloseTo(hvInclusionExclusion(pts, ref), 9);
        }),
        { numRuns: 60 },
      );
    }
  });
});

describe("non-dominated sorting (Deb et al. 2002), hand examples", () => {
  it("fronts, constrained domination and crowding distance", () => {
    const pop = [[1, 2], [2, 1], [2, 2], [3, 3], [1, 1]].map((losses) => ({ losses, violation: 0 }));
    expect(fastNonDominatedSort(pop)).toEqual([[4], [0, 1], [2], [3]]);
    const withInfeasible = [...pop, { losses: [0, 0], violation: 2 }, { losses: [9, 9], violation: 1 }];
    expect(fastNonDominatedSort(withInfeasible)).toEqual([[4], [0, 1], [2], [3], [6], [5]]);
    // Crowding: extremes Infinity; inner points (2 − 0)/3 + (3 − 1)/3 = 4/3.
    const cd = crowdingDistance([[0, 3], [1, 2], [2, 1], [3, 0]]);
    expect(cd[0]).toBe(Infinity);
    expect(cd[3]).toBe(Infinity);
    expect(cd[1]).toBeCloseTo(4 / 3, 12);
    expect(cd[2]).toBeCloseTo(4 / 3, 12);
    expect(crowdingDistance([])).toEqual([]);
    expect(fastNonDominatedSort([])).toEqual([]);
  });
  it("nonDominatedIndices drops dominated rows, NaN rows and repeated duplicates", () => {
    expect(nonDominatedIndices([[1, 3], [2, 2], [2, 2], [3, 3], [NaN, 0], [3, 1]])).toEqual([0, 1, 5]);
    expect(nonDominatedIndices([])).toEqual([]);
  });
});

describe("NSGA-II on ZDT1 (Zitzler, Deb & Thiele 2000; Pareto front f2 = 1 − √f1, f1 ∈ [0, 1])", () => {
  // Reference point (1.1, 1.1). True front's hypervolume (derived): ∫₀¹ (1.1 − (1 − √f)) df + 0.1·1.1
  // = 0.1 + 2/3 + 0.11 = 1.21 − 1/3 = 0.876666…
  const HV_TRUE = 1.21 - 1 / 3;
  const nv = 30; // n = 30 as in Zitzler, Deb & Thiele (2000)
  const problem: OptimizationProblem = {
    variables: Array.from({ length: nv }, (_, i) => ({ kind: "continuous" as const, name: `x${i}`, min: 0, max: 1 })),
    objectives: [
      { output: "f1", sense: "min" },
      { output: "f2", sense: "min" },
    ],
  };
  const ev = () =>
    fnEvaluator((d) => {
      const [f1, f2] = zdt1(Array.from({ length: nv }, (_, i) => d[`x${i}`] as number));
      return { f1, f2 };
    });

  it("the derived true-front hypervolume agrees with a 20001-point sampled front to 1e-4", () => {
    const front = Array.from({ length: 20001 }, (_, i) => [i / 20000, 1 - Math.sqrt(i / 20000)]);
    const hv = hypervolume(front, [1.1, 1.1]);
    expect(hv).toBeLessThanOrEqual(HV_TRUE);
    expect(HV_TRUE - hv).toBeLessThan(1e-4);
  });

  it("reaches a hypervolume within 1% of the true front's (two seeds, 20000 evaluations)", async () => {
    for (const seed of [1, 2]) {
      const r = await nsga2(problem, ev(), { seed, populationSize: 100, maxEvaluations: 20000 });
      expect(r.evaluations).toBe(20000);
      const hv = hypervolume(r.front.map((e) => [...e.objectives]), [1.1, 1.1]);
      expect(hv / HV_TRUE).toBeGreaterThan(0.99);
      expect(hv / HV_TRUE).toBeLessThanOrEqual(1);
    }
  }, 60_000);

  it("is deterministic by seed", async () => {
    const a = await nsga2(problem, ev(), { seed: 5, populationSize: 20, maxEvaluations: 400 });
    const b = await nsga2(problem, ev(), { seed: 5, populationSize: 20, maxEvaluations: 400 });
    expect(b.front.map((e) => e.design)).toEqual(a.front.map((e) => e.design));
  });
});

describe("NSGA-II with constraints: CONSTR (Deb et al. 2002, §VI test problem; from memory)", () => {
  // min f1 = x1, f2 = (1 + x2)/x1, s.t. 9x1 + x2 ≥ 6 and 9x1 − x2 ≥ 1, x1 ∈ [0.1, 1], x2 ∈ [0, 5].
  const problem: OptimizationProblem = {
    variables: [
      { kind: "continuous", name: "x1", min: 0.1, max: 1 },
      { kind: "continuous", name: "x2", min: 0, max: 5 },
    ],
    objectives: [
      { output: "f1", sense: "min" },
      { output: "f2", sense: "min" },
    ],
    constraints: [
      { output: "g1", op: ">=", value: 6 },
      { output: "g2", op: ">=", value: 1 },
    ],
  };
  const ev = () =>
    fnEvaluator((d) => {
      const [a, b] = [d.x1 as number, d.x2 as number];
      return { f1: a, f2: (1 + b) / a, g1: 9 * a + b, g2: 9 * a - b };
    });
  it("every front member satisfies both constraints, and the front beats a 101² grid's front in hypervolume", async () => {
    const r = await nsga2(problem, ev(), { seed: 3, populationSize: 60, maxEvaluations: 6000 });
    expect(r.front.length).toBeGreaterThan(20);
    for (const e of r.front) {
      const [a, b] = [e.design.x1 as number, e.design.x2 as number];
      expect(9 * a + b).toBeGreaterThanOrEqual(6);
      expect(9 * a - b).toBeGreaterThanOrEqual(1);
    }
    const grid = await gridSearch(problem, ev(), { resolution: 101 });
    const ref = [1.1, 10];
    const hvN = hypervolume(r.front.map((e) => [...e.objectives]), ref);
    const hvG = hypervolume(grid.front.map((e) => [...e.objectives]), ref);
    expect(hvN).toBeGreaterThan(hvG * 0.999);
  });
});
