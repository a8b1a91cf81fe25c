import { describe, expect, it } from "vitest";
import { evaluateMassing, quadParcel } from "@floorcast/sampler";
import type { MassingInput, Parcel, Point } from "@floorcast/sampler";

const rect = (w: number, d: number): Parcel => quadParcel({ frontage: w, depth: d });
const noYards = { front: 0, side: 0, rear: 0 };
const shoelace = (pts: readonly Point[]): number =>
  Math.abs(pts.reduce((s, p, i) => { const q = pts[(i + 1) % pts.length]!; return s + p[0] * q[1] - q[0] * p[1]; }, 0)) / 2;

describe("yards (rectangles)", () => {
  // Source: yards extend along the full lot line and their depth is measured at right angles to it —
  // Town of Woodway WA 14.08.350 "Yard" (front yard "measured horizontally from the front lot line to a
  // line parallel thereto"), La Puente CA 10.132.260 ("measured at right angles"). Hence a W × D
  // rectangle with front f, rear r and sides s has footprint (W − 2s)(D − f − r).
  it.each([
    [20, 30, 5, 3, 6],
    [15, 40, 6, 1.5, 7.5],
    [50, 25, 0, 0, 0],
    [12.5, 33.3, 4.2, 2.1, 9.9],
  ])("W=%d D=%d f=%d s=%d r=%d → (W − 2s)(D − f − r)", (w, d, f, s, r) => {
    const res = evaluateMassing({ parcel: rect(w, d), setbacks: { front: f, side: s, rear: r }, floorHeight: 3, maxHeight: 10 });
    const expected = (w - 2 * s) * (d - f - r);
    expect(res.buildableArea).toBeCloseTo(expected, 9);
    expect(res.footprintArea).toBeCloseTo(expected, 9);
    expect(res.facadeLength).toBeCloseTo(2 * (w - 2 * s) + 2 * (d - f - r), 9);
    expect(res.lotArea).toBeCloseTo(w * d, 9);
    expect(res.openSpace).toBeCloseTo(w * d - expected, 9);
  });

  // Hand-worked example (derived): 20 × 30 m lot, front 5, sides 3, rear 6 → 14 × 19 = 266 m²;
  // 3.5 m floors under 24 m → ⌊24 / 3.5⌋ = 6 floors; with FAR 2.5 (max 1,500 m², DC Zoning Handbook
  // "Floor Area Ratio": max GFA = FAR × lot area) the 6th floor would make 1,596 > 1,500 → 5 floors, 1,330 m².
  const example: MassingInput = {
    parcel: rect(20, 30),
    setbacks: { front: 5, side: 3, rear: 6 },
    floorHeight: 3.5,
    maxHeight: 24,
  };
  it("20 × 30 worked example: 266 m², 6 floors, height-limited", () => {
    const r = evaluateMassing(example);
    expect(r.footprintArea).toBeCloseTo(266, 10);
    expect(r.floors).toBe(6);
    expect(r.height).toBeCloseTo(21, 12);
    expect(r.gfa).toBeCloseTo(1596, 9);
    expect(r.limitedBy).toBe("height");
    expect(r.coverageCapped).toBe(false);
    expect(r.coverage).toBeCloseTo(266 / 600, 12);
  });
  it("20 × 30 worked example with FAR 2.5: 5 floors, 1,330 m², FAR-limited", () => {
    const r = evaluateMassing({ ...example, maxFar: 2.5 });
    expect(r.floors).toBe(5);
    expect(r.gfa).toBeCloseTo(1330, 9);
    expect(r.far).toBeCloseTo(1330 / 600, 12);
    expect(r.limitedBy).toBe("far");
  });
  it("a street setback defaults to the front setback; a given one is used", () => {
    const corner = quadParcel({ frontage: 20, depth: 30, corner: "right" });
    const dflt = evaluateMassing({ ...example, parcel: corner });
    expect(dflt.footprintArea).toBeCloseTo((20 - 3 - 5) * 19, 9);
    const own = evaluateMassing({ ...example, parcel: corner, setbacks: { ...example.setbacks, street: 4 } });
    expect(own.footprintArea).toBeCloseTo((20 - 3 - 4) * 19, 9);
  });
  it("clockwise order and collinear extra vertices give the same result (derived)", () => {
    const cw: Parcel = { vertices: [[0, 0], [0, 30], [20, 30], [20, 0]], lotLines: ["side", "rear", "side", "front"] };
    const split: Parcel = {
      vertices: [[0, 0], [8, 0], [20, 0], [20, 30], [0, 30]],
      lotLines: ["front", "front", "side", "rear", "side"],
    };
    for (const parcel of [cw, split]) {
      const r = evaluateMassing({ ...example, parcel, maxFar: 2.5 });
      expect(r.footprintArea).toBeCloseTo(266, 9);
      expect(r.floors).toBe(5);
    }
  });
});

describe("FAR and lot coverage (published glossary examples)", () => {
  // Metropolis magazine, "When is floor area not floor area?" (2019): a 5,000 sq ft lot at FAR 3.0 allows
  // 15,000 sq ft. The rule is unit-free in plan, so the lot is drawn in feet (50 × 100).
  it("5,000 sq ft lot at FAR 3.0 → 15,000 sq ft", () => {
    const r = evaluateMassing({ parcel: rect(50, 100), setbacks: noYards, floorHeight: 10, maxHeight: 400, maxFar: 3 });
    expect(r.gfa).toBeCloseTo(15000, 6);
    expect(r.floors).toBe(3);
    expect(r.limitedBy).toBe("far");
  });
  // metaglossary.com "floor area ratio": a 50 ft × 100 ft lot at FAR 2.0 allows 10,000 sq ft.
  it("50 × 100 ft lot at FAR 2.0 → 10,000 sq ft", () => {
    const r = evaluateMassing({ parcel: rect(50, 100), setbacks: noYards, floorHeight: 10, maxHeight: 400, maxFar: 2 });
    expect(r.gfa).toBeCloseTo(10000, 6);
  });
  // Carlin NV code, Figure 2 (FAR 1.0): half the lot covered with 2 floors, or a quarter with 4, both comply.
  it.each([
    [0.5, 2],
    [0.25, 4],
  ])("FAR 1.0 with coverage %d → %d floors, exactly the lot area", (cov, floors) => {
    const r = evaluateMassing({
      parcel: rect(100, 100), setbacks: noYards, floorHeight: 3, maxHeight: 60, maxFar: 1, maxCoverage: cov,
    });
    expect(r.floors).toBe(floors);
    expect(r.gfa).toBeCloseTo(10000, 5);
    expect(r.limitedBy).toBe("far");
    expect(r.coverageCapped).toBe(true);
  });
  // Zonewire zoning glossary, "lot coverage": 10,000 sq ft at 60 % coverage → 6,000 sq ft footprint.
  it("10,000 sq ft lot at 60 % coverage → 6,000 sq ft footprint (solved to 1e-9 × lot area)", () => {
    const r = evaluateMassing({ parcel: rect(100, 100), setbacks: noYards, floorHeight: 10, maxHeight: 30, maxCoverage: 0.6 });
    expect(Math.abs(r.footprintArea - 6000)).toBeLessThanOrEqual(1e-9 * 10000);
    expect(r.coverage).toBeCloseTo(0.6, 9);
    expect(r.coverageCapped).toBe(true);
  });
  // Inner parallel polygon of a 30 × 40 rectangle at d = 5: (30 − 10) × (40 − 10) = 600 (derived).
  it("coverage inset of a 30 × 40 lot at 50 % moves every edge in by 5 m", () => {
    const r = evaluateMassing(
      { parcel: rect(30, 40), setbacks: noYards, floorHeight: 3, maxHeight: 3, maxCoverage: 0.5 },
      { plates: true },
    );
    const xs = r.plates![0]!.map((p) => p[0]);
    const ys = r.plates![0]!.map((p) => p[1]);
    expect(Math.min(...xs)).toBeCloseTo(5, 9);
    expect(Math.max(...xs)).toBeCloseTo(25, 9);
    expect(Math.min(...ys)).toBeCloseTo(5, 9);
    expect(Math.max(...ys)).toBeCloseTo(35, 9);
  });
  // A polygon with an inscribed circle of radius r: A(d) = A(1 − d/r)² (derived: the inset is the polygon scaled by 1 − d/r about the centre);
  // a square of side 40 (r = 20) capped at 36 % needs d with (1 − d/20)² = 0.36 → d = 8, plate 24 × 24.
  it("square with an incircle: coverage 36 % → inset by 8, perimeter 96", () => {
    const r = evaluateMassing({ parcel: rect(40, 40), setbacks: noYards, floorHeight: 3, maxHeight: 3, maxCoverage: 0.36 });
    expect(r.footprintArea).toBeCloseTo(576, 6);
    expect(r.facadeLength).toBeCloseTo(96, 6);
  });
  it("coverage at or above the buildable share does not cap", () => {
    const r = evaluateMassing({ ...{ parcel: rect(20, 30), setbacks: { front: 5, side: 3, rear: 6 } }, floorHeight: 3, maxHeight: 9, maxCoverage: 266 / 600 });
    expect(r.coverageCapped).toBe(false);
    expect(r.footprintArea).toBeCloseTo(266, 9);
  });
});

describe("floors under a height limit", () => {
  // Typical floor-to-floor heights in a tall-building height calculator's assumptions (office 3.9 m,
  // residential 3.1 m, mixed use 3.5 m; secondary copies allaboutconstruction.blogspot.com 2013/10 and
  // onlinecivil.net 2014/05): floors = ⌊H / f⌋, at 30 m: 9 residential, 7 office, 8 mixed use.
  it.each([
    [3.1, 9],
    [3.9, 7],
    [3.5, 8],
  ])("floor-to-floor %d m under 30 m → %d floors", (f, floors) => {
    const r = evaluateMassing({ parcel: rect(30, 30), setbacks: noYards, floorHeight: f, maxHeight: 30 });
    expect(r.floors).toBe(floors);
    expect(r.limitedBy).toBe("height");
  });
  it("a floor exactly reaching the limit counts (k × floorHeight ≤ maxHeight + 1e-9)", () => {
    // 0.1 × 30 is 3.0000000000000004 in binary floating point; the 1e-9 m allowance keeps floor 30.
    const r = evaluateMassing({ parcel: rect(30, 30), setbacks: noYards, floorHeight: 0.1, maxHeight: 3 });
    expect(r.floors).toBe(30);
  });
  it("no floor fits: floors 0 and limitedBy height, even when the setbacks also leave nothing", () => {
    const r = evaluateMassing({ parcel: rect(20, 30), setbacks: noYards, floorHeight: 4, maxHeight: 3.5 });
    expect([r.floors, r.gfa, r.footprintArea, r.facadeLength, r.height, r.limitedBy]).toEqual([0, 0, 0, 0, 0, "height"]);
    const both = evaluateMassing({ parcel: rect(20, 30), setbacks: { front: 20, side: 0, rear: 20 }, floorHeight: 4, maxHeight: 3.5 });
    expect(both.limitedBy).toBe("height");
  });
});

describe("sky exposure plane", () => {
  // Definition: New York City Zoning Resolution §12-10 "sky exposure plane"; values §23-736/§24-522
  // (planes from 85 ft, slope 2.7:1). Check value (arithmetic, derived): at 200 ft on a plane
  // starting at 85 ft with slope 2.7:1 the plate stands (200 − 85)/2.7 = 42.59 ft back from the street line.
  it("the plate at 200 ft stands 42.59 ft back from the street line", () => {
    const r = evaluateMassing(
      { parcel: rect(100, 150), setbacks: noYards, floorHeight: 10, maxHeight: 200, skyPlane: { startHeight: 85, ratio: 2.7 } },
      { plates: true },
    );
    expect(r.floors).toBe(20);
    const top = r.plates![19]!;
    expect(Math.min(...top.map((p) => p[1]))).toBeCloseTo(42.59, 2);
    // Floors whose top is at or below 85 ft are uncut.
    expect(shoelace(r.plates![7]!)).toBeCloseTo(15000, 6);
    expect(shoelace(r.plates![8]!)).toBeCloseTo(100 * (150 - 5 / 2.7), 6);
  });
  it("a corner lot is cut from both street lines; the front setback is not added to the cut", () => {
    const r = evaluateMassing(
      {
        parcel: quadParcel({ frontage: 40, depth: 40, corner: "left" }),
        setbacks: { front: 3, side: 0, rear: 0, street: 3 },
        floorHeight: 3, maxHeight: 30, skyPlane: { startHeight: 12, ratio: 1 },
      },
      { plates: true },
    );
    // Floor 5 (z = 15): 3 m from both street lines — the setback already gives that; floor 6 (z = 18): 6 m.
    expect(shoelace(r.plates![4]!)).toBeCloseTo(37 * 37, 9);
    expect(shoelace(r.plates![5]!)).toBeCloseTo(34 * 34, 9);
  });
  it("the plane can empty the plate: limitedBy plate", () => {
    const r = evaluateMassing({ parcel: rect(20, 20), setbacks: noYards, floorHeight: 3, maxHeight: 300, skyPlane: { startHeight: 0, ratio: 1 } });
    // Floor k is cut to depth 20 − 3k: floors 1..6 have plates, floor 7 would have none.
    expect(r.floors).toBe(6);
    expect(r.limitedBy).toBe("plate");
    expect(r.gfa).toBeCloseTo([17, 14, 11, 8, 5, 2].reduce((s, d) => s + 20 * d, 0), 9);
  });
});

describe("plate limits and stops", () => {
  const base: MassingInput = { parcel: rect(20, 30), setbacks: { front: 5, side: 3, rear: 6 }, floorHeight: 3.5, maxHeight: 24 };
  it("setbacks that leave nothing: limitedBy setbacks, all zero", () => {
    const r = evaluateMassing({ ...base, setbacks: { front: 15, side: 0, rear: 15 } });
    expect([r.floors, r.gfa, r.footprintArea, r.buildableArea, r.limitedBy]).toEqual([0, 0, 0, 0, "setbacks"]);
    expect(r.openSpace).toBeCloseTo(600, 12);
  });
  it("minPlateArea: equal passes, larger stops at floor 1", () => {
    expect(evaluateMassing({ ...base, minPlateArea: 266 }).floors).toBe(6);
    const r = evaluateMassing({ ...base, minPlateArea: 266.01 });
    expect([r.floors, r.limitedBy]).toEqual([0, "plate"]);
  });
  it("minPlateWidth: the 14 × 19 plate has width 14", () => {
    expect(evaluateMassing({ ...base, minPlateWidth: 14 }).floors).toBe(6);
    expect(evaluateMassing({ ...base, minPlateWidth: 14.001 }).limitedBy).toBe("plate");
  });
  it("the plate test wins over the FAR cap on the same floor", () => {
    // Floors 1–2 hold 400 + 340 m²; floor 3 (z = 9) is cut to 20 × 14 = 280 < 300 and would also take
    // the total to 1,020 > FAR 2 × 400 = 800 m².
    const input: MassingInput = {
      parcel: rect(20, 20), setbacks: noYards, floorHeight: 3, maxHeight: 30, maxFar: 2,
      minPlateArea: 300, skyPlane: { startHeight: 3, ratio: 1 },
    };
    const r = evaluateMassing(input);
    expect(r.floors).toBe(2);
    expect(r.limitedBy).toBe("plate");
    expect(evaluateMassing({ ...input, minPlateArea: 0 }).limitedBy).toBe("far");
  });
  it("plates only when asked, one per floor, floor 1 = footprint", () => {
    expect("plates" in evaluateMassing(base)).toBe(false);
    expect("plates" in evaluateMassing(base, { plates: false })).toBe(false);
    const r = evaluateMassing(base, { plates: true });
    expect(r.plates).toHaveLength(r.floors);
    expect(shoelace(r.plates![0]!)).toBeCloseTo(r.footprintArea, 9);
  });
});

describe("quadParcel", () => {
  it("builds (0,0), (W,0), (x0+R, D), (x0, D) with x0 = (W − R)/2 + D·tan(skew)", () => {
    const p = quadParcel({ frontage: 20, depth: 30, rearWidth: 10, skew: 10, corner: "right" });
    const x0 = 5 + 30 * Math.tan((10 * Math.PI) / 180);
    expect(p.vertices[0]).toEqual([0, 0]);
    expect(p.vertices[1]).toEqual([20, 0]);
    expect(p.vertices[2]![0]).toBeCloseTo(x0 + 10, 12);
    expect(p.vertices[3]![0]).toBeCloseTo(x0, 12);
    expect(p.vertices[3]![1]).toBe(30);
    expect(p.lotLines).toEqual(["front", "street", "rear", "side"]);
    expect(quadParcel({ frontage: 1, depth: 1, corner: "left" }).lotLines).toEqual(["front", "side", "rear", "street"]);
    expect(quadParcel({ frontage: 1, depth: 1 }).lotLines).toEqual(["front", "side", "rear", "side"]);
  });
  it("a trapezoid's area is D (W + R) / 2 whatever the skew (derived)", () => {
    const r = evaluateMassing({ parcel: quadParcel({ frontage: 24, depth: 35, rearWidth: 16, skew: -20 }), setbacks: noYards, floorHeight: 3, maxHeight: 3 });
    expect(r.lotArea).toBeCloseTo((35 * 40) / 2, 9);
  });
  it.each([
    [{ frontage: 0, depth: 1 }, RangeError, /quadParcel: frontage/],
    [{ frontage: 1, depth: -1 }, RangeError, /quadParcel: depth/],
    [{ frontage: 1, depth: 1, rearWidth: NaN }, RangeError, /quadParcel: rearWidth/],
    [{ frontage: 1, depth: 1, skew: 90 }, RangeError, /quadParcel: skew/],
    [{ frontage: 1, depth: 1, skew: -Infinity }, RangeError, /quadParcel: skew/],
    [{ frontage: Infinity, depth: 1 }, RangeError, /quadParcel: frontage/],
    [{ frontage: "1", depth: 1 }, TypeError, /quadParcel: frontage/],
    [{ frontage: 1, depth: 1, corner: "top" }, RangeError, /quadParcel: corner/],
    [{ frontage: 1, depth: 1, corner: 3 }, TypeError, /quadParcel: corner/],
  ])("rejects %j", (opts, kind, msg) => {
    expect(() => quadParcel(opts as never)).toThrow(kind);
    expect(() => quadParcel(opts as never)).toThrow(msg);
  });
  it("rejects a non-object", () => {
    expect(() => quadParcel(null as never)).toThrow(TypeError);
  });
});

describe("map coordinates", () => {
  it("a parcel at UTM-like coordinates (x ≈ 5e5, y ≈ 5.6e6) gives the same result as at the origin (derived)", () => {
    const input: MassingInput = {
      parcel: quadParcel({ frontage: 24, depth: 30, rearWidth: 22, skew: 6, corner: "right" }),
      setbacks: { front: 2, side: 3, rear: 5 },
      floorHeight: 3.5, maxHeight: 40, maxCoverage: 0.55, skyPlane: { startHeight: 12, ratio: 2.7 }, minPlateArea: 60,
    };
    const far: Parcel = { ...input.parcel, vertices: input.parcel.vertices.map(([x, y]) => [x + 512345.25, y + 5612345.75] as Point) };
    const a = evaluateMassing(input, { plates: true });
    const b = evaluateMassing({ ...input, parcel: far }, { plates: true });
    // Tolerance: coordinates near 5.6e6 m carry ~1e-9 m of rounding, so areas agree to ~1e-7 m².
    for (const k of ["lotArea", "buildableArea", "footprintArea", "gfa"] as const) expect(Math.abs(b[k] - a[k])).toBeLessThan(1e-6);
    expect([b.floors, b.limitedBy, b.coverageCapped]).toEqual([a.floors, a.limitedBy, a.coverageCapped]);
    expect(b.plates![0]![0]![0] - 512345.25).toBeCloseTo(a.plates![0]![0]![0], 6);
  });
});
