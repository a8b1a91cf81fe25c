import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { createDesign, mapUnitToSpace, validateDesignSpace } from "@floorcast/sampler";
import type { DesignSpace, Parameter } from "@floorcast/sampler";

const frontage: Parameter = { kind: "continuous", name: "frontage", min: 8, max: 20, unit: "m", description: "Lot frontage." };
const far: Parameter = { kind: "continuous", name: "maxFar", min: 0.5, max: 8, log: true, unit: "", description: "Floor area ratio cap." };
const storeys: Parameter = { kind: "integer", name: "storeys", min: 2, max: 6, unit: "", description: "Storey cap." };
const use: Parameter = { kind: "categorical", name: "use", levels: ["residential", "mixed", "office"], unit: "", description: "Use class." };
const space: DesignSpace = { parameters: [frontage, far, storeys, use] };

function counts(values: (string | number)[]): number[] {
  const m = new Map<string | number, number>();
  for (const v of values) m.set(v, (m.get(v) ?? 0) + 1);
  return [...m.values()];
}

describe("mapUnitToSpace", () => {
  it("maps continuous coordinates linearly and on a log scale, ends included", () => {
    const [lo, mid, hi] = mapUnitToSpace(space, [
      [0, 0, 0, 0],
      [0.5, 0.5, 0.5, 0.5],
      [1, 1, 1, 1],
    ]) as Record<string, number | string>[];
    expect(lo).toMatchObject({ frontage: 8, maxFar: 0.5 });
    expect(hi).toMatchObject({ frontage: 20, maxFar: 8 });
    expect(mid?.frontage).toBeCloseTo(14, 12);
    // Log scale: the midpoint is the geometric mean √(0.5 · 8) = 2 (derived).
    expect(mid?.maxFar as number).toBeCloseTo(2, 12);
  });

  it("balances integer and categorical levels on LHS columns: ⌊n/L⌋ or ⌈n/L⌉ each (property test)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 200 }), fc.integer({ min: 0, max: 1e6 }), fc.constantFrom("lhs" as const, "lhs-centred" as const), (n, seed, design) => {
        const rows = mapUnitToSpace(space, createDesign({ n, dims: 4, design, seed }));
        for (const [name, levels] of [["storeys", 5], ["use", 3]] as const) {
          const c = counts(rows.map((r) => r[name] as string | number));
          for (const k of c) expect(k === Math.floor(n / levels) || k === Math.ceil(n / levels)).toBe(true);
          expect(c.length).toBe(Math.min(n, levels));
        }
        for (const r of rows) {
          expect(Number.isInteger(r.storeys)).toBe(true);
          expect((r.storeys as number) >= 2 && (r.storeys as number) <= 6).toBe(true);
          expect(r.frontage as number).toBeGreaterThanOrEqual(8);
          expect(r.maxFar as number).toBeLessThanOrEqual(8);
        }
      }),
      { numRuns: 100 },
    );
  });

  it("uses ⌊x·L⌋ on non-Latin columns, balanced for a Sobol' net of a multiple of L points", () => {
    const rows = mapUnitToSpace({ parameters: [storeys, { ...use, levels: ["a", "b", "c", "d"] }] }, createDesign({ n: 64, dims: 2, design: "sobol", seed: 3 }));
    expect(counts(rows.map((r) => r.use as string))).toEqual([16, 16, 16, 16]);
    const single = mapUnitToSpace({ parameters: [storeys] }, [[0.99], [0.99]]);
    expect(single.map((r) => r.storeys)).toEqual([6, 6]); // not Latin (both in one stratum): ⌊0.99·5⌋ = 4 → 6
  });

  it("maps a single row (always Latin) by its own coordinate: ⌊x·L⌋", () => {
    const levelOf = (x: number) => (mapUnitToSpace({ parameters: [storeys, use] }, [[x, x]])[0] as Record<string, number | string>);
    expect(levelOf(0.1)).toEqual({ storeys: 2, use: "residential" });
    expect(levelOf(0.5)).toEqual({ storeys: 4, use: "mixed" });
    expect(levelOf(0.95)).toEqual({ storeys: 6, use: "office" });
    expect(levelOf(1)).toEqual({ storeys: 6, use: "office" });
  });

  it("uses every level over seeds when n < L (the stratum rule is shifted by the column's own offset)", () => {
    const seen = new Set<number>();
    for (let seed = 0; seed < 40; seed++) {
      for (const r of mapUnitToSpace({ parameters: [storeys] }, createDesign({ n: 2, dims: 1, design: "lhs", seed }))) seen.add(r.storeys as number);
    }
    expect([...seen].sort()).toEqual([2, 3, 4, 5, 6]);
  });

  it("returns no records for no rows, and rejects bad rows naming the parameter", () => {
    expect(mapUnitToSpace(space, [])).toEqual([]);
    expect(() => mapUnitToSpace(space, [[0.1, 0.2, 0.3]])).toThrow(/^mapUnitToSpace: unitRows\[0\] must have 4/);
    for (const bad of [NaN, Infinity, -Infinity, -0.1, 1.5]) {
      expect(() => mapUnitToSpace(space, [[0.1, bad, 0.3, 0.4]])).toThrow(/^mapUnitToSpace: unitRows\[0\]\[1\] \(maxFar\) must be in \[0, 1\]/);
    }
    expect(() => mapUnitToSpace(space, "rows" as unknown as number[][])).toThrow(TypeError);
  });
});

describe("validateDesignSpace", () => {
  const bad: [string, DesignSpace, RegExp][] = [
    ["empty", { parameters: [] }, /parameters must not be empty/],
    ["duplicate", { parameters: [frontage, frontage] }, /"frontage" is defined twice/],
    ["min ≥ max", { parameters: [{ ...frontage, min: 20, max: 8 }] }, /"frontage": min must be < max/],
    ["NaN bound", { parameters: [{ ...frontage, max: NaN }] }, /"frontage": min and max must be finite/],
    ["infinite bound", { parameters: [{ ...frontage, min: -Infinity }] }, /must be finite/],
    ["log from 0", { parameters: [{ ...far, min: 0 }] }, /"maxFar": a log-scale parameter needs min > 0/],
    ["fractional integer", { parameters: [{ ...storeys, max: 6.5 }] }, /"storeys": min and max must be integers/],
    ["reversed integer", { parameters: [{ ...storeys, min: 7 }] }, /"storeys": min must be ≤ max/],
    ["no levels", { parameters: [{ ...use, levels: [] }] }, /"use": levels must not be empty/],
    ["repeated level", { parameters: [{ ...use, levels: ["a", "a"] }] }, /"use": level a is repeated/],
    ["NaN level", { parameters: [{ ...use, levels: [1, NaN] }] }, /level NaN is not finite/],
    ["unknown kind", { parameters: [{ ...frontage, kind: "ordinal" } as unknown as Parameter] }, /kind must be/],
  ];
  for (const [label, s, message] of bad) {
    it(`rejects ${label} with a RangeError naming the parameter`, () => {
      expect(() => validateDesignSpace(s)).toThrow(RangeError);
      expect(() => validateDesignSpace(s)).toThrow(message);
    });
  }
  it("rejects wrong types with TypeError and accepts a good space", () => {
    expect(() => validateDesignSpace({} as DesignSpace)).toThrow(TypeError);
    expect(() => validateDesignSpace({ parameters: [{ ...frontage, unit: 3 } as unknown as Parameter] })).toThrow(TypeError);
    expect(() => validateDesignSpace({ parameters: [{ ...frontage, name: "" }] })).toThrow(TypeError);
    expect(() => validateDesignSpace(space)).not.toThrow();
    expect(() => validateDesignSpace({ parameters: [{ ...storeys, min: 3, max: 3 }] })).not.toThrow(); // one level
  });
});
