import { describe, expect, it } from "vitest";
import fc from "fast-check";
import seedrandom from "seedrandom";
import { buildValidityDomain, checkDomain, collectDiagnostics, DomainError, domainOfModel, nearestDistance, scaleToDomain } from "@floorcast/surrogate";
import { olsModel } from "./trust-toy-trainer.js";

const grid = (): number[][] => {
  const x: number[][] = [];
  for (let i = 0; i <= 10; i++) for (let j = 0; j <= 10; j++) x.push([10 * i, 100 + j]);
  return x;
};

describe("buildValidityDomain", () => {
  it("on an 11×11 grid: bounds are the grid's, every LOO NN distance is 0.1 so the threshold is 0.1 (derived)", () => {
    const d = buildValidityDomain(["frontage", "depth"], grid());
    expect(d.lower).toEqual([0, 100]);
    expect(d.upper).toEqual([100, 110]);
    expect(d.nnThreshold).toBeCloseTo(0.1, 14);
    expect(d.percentile).toBe(0.99);
    expect(d.points[12]).toEqual([0.1, 0.1]);
    expect(d.kind).toBe("floorcast.validity-domain");
    expect(JSON.parse(JSON.stringify(d))).toEqual(d);
  });
  it("rejects too few rows, ragged rows, NaN and a bad percentile", () => {
    expect(() => buildValidityDomain(["a"], [[1]])).toThrow(/at least two rows/);
    expect(() => buildValidityDomain(["a"], [[1], [NaN]])).toThrow(/x\[1\]\[0\] must be finite/);
    expect(() => buildValidityDomain(["a", "b"], [[1, 2], [3]])).toThrow(/x\[1\] must have 2 values/);
    expect(() => buildValidityDomain(["a"], [[1], [2]], { percentile: 0 })).toThrow(/percentile must be in \(0, 1\]/);
    expect(() => buildValidityDomain(["a"], [[Infinity], [2]])).toThrow(RangeError);
  });
  it("constant input: scaled to 0 and any other value is out of bounds", () => {
    const d = buildValidityDomain(["a", "b"], [[1, 5], [2, 5], [3, 5]]);
    const c = checkDomain(d, [[2, 5], [2, 5.1]]);
    expect(c.rows[0]!.inDomain).toBe(true);
    expect(c.rows[1]!.outOfBounds).toEqual(["b"]);
  });
});

describe("checkDomain", () => {
  const d = buildValidityDomain(["frontage", "depth"], grid());
  it("flags rows outside the bounds and rows in a gap wider than the threshold", () => {
    const c = checkDomain(d, [
      [50, 105], // a grid point: distance 0
      [55, 105.5], // centre of a cell: distance √(0.05² + 0.05²) ≈ 0.0707 ≤ 0.1 (derived)
      [101, 105], // frontage above the training maximum
      [50, 99], // depth below the minimum
      [100, 110], // the corner, exactly on the bound: inside
    ]);
    expect(c.rows.map((r) => r.inDomain)).toEqual([true, true, false, false, true]);
    expect(c.rows[1]!.nnDistance).toBeCloseTo(Math.hypot(0.05, 0.05), 14);
    expect(c.rows[2]!.outOfBounds).toEqual(["frontage"]);
    expect(c.rows[3]!.outOfBounds).toEqual(["depth"]);
    expect(c.outside).toEqual([2, 3]);
  });
  it("flags a row inside the box but far from every training row", () => {
    // Training rows on two opposite corners clusters; the centre of the box is far from both.
    const rng = seedrandom("clusters");
    const x = Array.from({ length: 60 }, (_, i) => (i % 2 ? [rng() * 0.1, rng() * 0.1] : [0.9 + rng() * 0.1, 0.9 + rng() * 0.1]));
    const dom = buildValidityDomain(["a", "b"], x);
    const c = checkDomain(dom, [[0.5, 0.5], x[3]!]);
    expect(c.rows[0]!.inBounds).toBe(true);
    expect(c.rows[0]!.inDomain).toBe(false);
    expect(c.rows[1]!.inDomain).toBe(true);
    expect(nearestDistance(dom.points, dom.points[3]!, 3)).toBeGreaterThan(0);
  });
  it("strict mode refuses rows outside with a DomainError naming them", () => {
    expect(() => checkDomain(d, [[50, 105], [200, 105], [50, 50]], { strict: true })).toThrow(/checkDomain: rows 1, 2 \(0-based\) are outside/);
    try {
      checkDomain(d, [[200, 105]], { strict: true });
    } catch (e) {
      expect(e).toBeInstanceOf(DomainError);
      expect(e).toBeInstanceOf(RangeError);
      expect((e as DomainError).rows).toEqual([0]);
    }
    expect(checkDomain(d, [[50, 105]], { strict: true }).outside).toEqual([]);
    expect(checkDomain(d, []).rows).toEqual([]);
  });
  it("reads a domain from a model's file (training.domain) or its validityDomain() capability", () => {
    const base = olsModel({ inputs: ["frontage", "depth"], targets: ["gfa"], x: grid(), y: grid().map((r) => [r[0]! * r[1]!]) });
    expect(domainOfModel(base)).toBeNull();
    expect(() => checkDomain(base, [[1, 2]])).toThrow(/carries no validity domain/);
    const withFile = { ...base, toJSON: () => ({ training: { domain: JSON.parse(JSON.stringify(d)) } }) };
    expect(checkDomain(withFile, [[200, 105]]).outside).toEqual([0]);
    const aware = { ...base, validityDomain: () => d };
    expect(checkDomain(aware, [[50, 105]]).outside).toEqual([]);
    const broken = { ...base, toJSON: () => ({ training: { domain: { ...d, nnThreshold: "x" } } }) };
    expect(() => domainOfModel(broken)).toThrow(/training\.domain\.nnThreshold/);
    expect(() => checkDomain(d, [[NaN, 1]])).toThrow(/x\[0\]\[0\] must be finite/);
    expect(() => checkDomain(null as never, [])).toThrow(TypeError);
  });
});

describe("collectDiagnostics", () => {
  it("finds GP and NN diagnostics anywhere in a model file, with warnings", () => {
    const file = {
      modelType: "ensemble",
      training: { n: 400 },
      payload: {
        members: [
          { training: { diagnostics: { jitter: 1e-8, conditionNumber: 3e11, hyperparametersOnBounds: ["lengthscale[2]"] } } },
          { training: { diagnostics: { earlyStoppingEpoch: 312 } } },
        ],
      },
    };
    const dg = collectDiagnostics(file, { minDistance: 0.05, centredDiscrepancy: 0.002 });
    expect(dg.modelType).toBe("ensemble");
    expect(dg.trainingRows).toBe(400);
    expect(dg.jitter).toEqual([{ path: "payload.members[0].training.diagnostics.jitter", value: 1e-8 }]);
    expect(dg.earlyStoppingEpoch[0]!.value).toBe(312);
    expect(dg.design).toEqual({ minDistance: 0.05, centredDiscrepancy: 0.002 });
    expect(dg.warnings).toHaveLength(3);
    expect(dg.warnings.join(" ")).toMatch(/lengthscale\[2\]/);
  });
  it("tolerates anything: null, arrays, files without diagnostics", () => {
    for (const f of [null, 3, [], {}, { training: null }]) {
      const dg = collectDiagnostics(f);
      expect(dg.warnings).toEqual([]);
      expect(dg.design).toBeNull();
      expect(dg.modelType).toBeNull();
    }
    expect(collectDiagnostics({ training: { hyperparametersOnBounds: [] } }).warnings).toEqual([]);
  });
});

describe("scaleToDomain and nearestDistance", () => {
  it("scale by the training range, constant inputs by offset; nearest distance skips the given row", () => {
    expect(scaleToDomain({ lower: [0, 5], upper: [10, 5] }, [2.5, 7])).toEqual([0.25, 2]);
    expect(nearestDistance([[0, 0], [3, 4]], [0, 0])).toBe(0);
    expect(nearestDistance([[0, 0], [3, 4]], [0, 0], 0)).toBe(5); // 3-4-5 triangle
    expect(nearestDistance([], [1, 2])).toBe(Infinity);
    expect(nearestDistance([[0, 0]], [NaN, 0])).toBe(Infinity); // NaN never compares below the best
  });
});

describe("validity-domain properties", () => {
  it("every training row is inside its own domain, and a row beyond any bound is outside (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -1e3, max: 1e3, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 2, maxLength: 30 }),
        (rows) => {
          const x = rows.map(([a, b]) => [a, b]);
          const d = buildValidityDomain(["a", "b"], x);
          expect(checkDomain(d, x).outside).toEqual([]);
          const w = Math.max(d.upper[0]! - d.lower[0]!, 1);
          expect(checkDomain(d, [[d.upper[0]! + w, x[0]![1]!]]).rows[0]!.inBounds).toBe(false);
        },
      ),
      { numRuns: 50 },
    );
  });
});
