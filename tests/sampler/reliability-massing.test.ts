import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { evaluateMassing, quadParcel } from "@floorcast/sampler";

const base = () => ({
  parcel: { vertices: [[0, 0], [20, 0], [20, 30], [0, 30]], lotLines: ["front", "side", "rear", "side"] },
  setbacks: { front: 5, side: 3, rear: 6 },
  floorHeight: 3,
  maxHeight: 15,
  maxFar: 2,
  maxCoverage: 0.6,
  skyPlane: { startHeight: 9, ratio: 2 },
  minPlateWidth: 2,
  minPlateArea: 20,
}) as Record<string, any>;

const paths = [
  "floorHeight", "maxHeight", "maxFar", "maxCoverage", "minPlateWidth", "minPlateArea", "setbacks.front", "setbacks.side",
  "setbacks.rear", "setbacks.street", "skyPlane.startHeight", "skyPlane.ratio", "skyPlane", "setbacks", "parcel",
  "parcel.vertices", "parcel.vertices.0", "parcel.vertices.1.0", "parcel.vertices.2.1", "parcel.lotLines", "parcel.lotLines.0",
  "parcel.lotLines.2", "maxFAR", "__proto__",
];
const hostile = fc.oneof(
  fc.constantFrom(NaN, Infinity, -Infinity, 0, -0, -1, 1e308, -1e308, 1e-308, 5e-324, 1e9, 1e12, 2 ** 53, null, undefined, "", "3", "front", true, [], {}, [0, 0], [[0, 0]]),
  fc.double(),
  fc.anything({ maxDepth: 2 }),
);

function set(o: Record<string, any>, path: string, v: unknown): void {
  const keys = path.split(".");
  let t = o;
  for (const k of keys.slice(0, -1)) t = t[k];
  Object.defineProperty(t, keys.at(-1)!, { value: v, enumerable: true, writable: true, configurable: true });
}

describe("evaluateMassing under hostile input", () => {
  it("gives a consistent finite result or a TypeError/RangeError that starts with evaluateMassing: and names a field", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.constantFrom(...paths), hostile), { minLength: 1, maxLength: 3 }), (edits) => {
        const input = base();
        for (const [p, v] of edits) {
          try {
            set(input, p, v);
          } catch {
            return; // the path no longer exists after an earlier edit
          }
        }
        let r;
        try {
          r = evaluateMassing(input as never, { plates: true });
        } catch (e) {
          expect(e instanceof TypeError || e instanceof RangeError, String(e)).toBe(true);
          // The message names the field path first (an unknown key is named as it was written).
          expect((e as Error).message).toMatch(/^evaluateMassing: (input|parcel|setbacks|floorHeight|maxHeight|maxFar|maxCoverage|skyPlane|minPlateWidth|minPlateArea)\b|^evaluateMassing: [^ ]+ is not a known field/);
          return;
        }
        for (const [k, v] of Object.entries(r)) if (typeof v === "number") expect(Number.isFinite(v), k).toBe(true);
        expect(Number.isInteger(r.floors)).toBe(true);
        expect(r.gfa).toBeGreaterThanOrEqual(0);
        expect(r.footprintArea).toBeLessThanOrEqual(r.lotArea * (1 + 1e-9));
        expect(r.plates).toHaveLength(r.floors);
        expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      }),
      { numRuns: 800, seed: 31 },
    );
  });

  it("refuses parcels too large for double arithmetic with a message naming the vertex (not 'zero area')", () => {
    const input = base();
    input.parcel.vertices = [[0, 0], [1e308, 0], [1e308, 1e308], [0, 1e308]];
    expect(() => evaluateMassing(input as never)).toThrow(/^evaluateMassing: parcel\.vertices\[1\]\[0\] must be within ±1e9 m, got 1e\+308$/);
    // Just inside the bound a huge lot still evaluates to finite numbers (its area is 1e18 m², derived).
    input.parcel.vertices = [[0, 0], [1e9, 0], [1e9, 1e9], [0, 1e9]];
    const r = evaluateMassing(input as never);
    expect(r.lotArea).toBe(1e18);
    expect(Number.isFinite(r.gfa)).toBe(true);
  });

  it("duplicated points and degenerate lots are refused naming parcel.vertices", () => {
    const cases = [
      [[0, 0], [0, 0], [20, 30], [0, 30]],
      [[0, 0], [20, 0], [20, 0], [20, 0]],
      [[0, 0], [10, 0], [20, 0], [30, 0]],
      [[0, 0], [20, 0], [0, 30], [20, 30]],
    ];
    for (const v of cases) {
      const input = base();
      input.parcel.vertices = v;
      expect(() => evaluateMassing(input as never)).toThrow(/^evaluateMassing: parcel\.vertices /);
    }
  });

  it("tiny lots (a millimetre) and huge ones (10 km) give finite results that scale as the square of the length (derived: similarity)", () => {
    fc.assert(
      fc.property(fc.double({ min: -3, max: 4, noNaN: true }), (e) => {
        const s = 10 ** e;
        const lot = (k: number) => ({
          parcel: quadParcel({ frontage: 20 * k, depth: 30 * k }),
          setbacks: { front: 5 * k, side: 3 * k, rear: 6 * k },
          floorHeight: 3,
          maxHeight: 15,
          maxCoverage: 0.6,
        });
        const a = evaluateMassing(lot(1));
        const b = evaluateMassing(lot(s));
        expect(b.floors).toBe(a.floors);
        // Relative 1e-9: the coverage inset is solved to 1e-9 of the lot area (README, massing rule step 2).
        expect(Math.abs(b.gfa / (s * s) - a.gfa)).toBeLessThanOrEqual(1e-9 * a.lotArea * a.floors);
      }),
      { numRuns: 60, seed: 32 },
    );
  });
});
