// Ranking a parcel file: the parcel descriptors (against Shapely), the design mapping, and rankParcels on the
// demo parcel file of Quillmere with small budgets (both routes), checked against the exact rule and the rank
// statistics already checked against scipy (harness-rank-correlation.test.ts).
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { evaluateMassing, type MassingInput } from "@floorcast/sampler";
import {
  evaluateParcelFile,
  kendallTau,
  PARCEL_DESCRIPTOR_NAMES,
  PARCEL_DESIGN_VARIABLES,
  parcelDescriptors,
  parcelDesignInput,
  parcelEvaluator,
  rankParcels,
  rankedParcelCollection,
  spearmanRho,
  topKOverlap,
  type ParcelRanking,
} from "@floorcast/bench";
import { referenceAvailable, runReference } from "../reference/python.js";
import { simpleLotCases } from "../sampler/simple-lot-cases.js";

const hasShapely = referenceAvailable(["shapely", "numpy"]);
const hasScipy = referenceAvailable(["scipy"]);
const DEMO = fileURLToPath(new URL("../../datasets/parcels/", import.meta.url));
const json = (name: string): unknown => JSON.parse(readFileSync(join(DEMO, name), "utf8"));

/** The demo parcel file read as `floorcast parcels` reads it (street distance 8 m, as the README's example). */
function demoParcels(): { collection: unknown; evaluated: ReturnType<typeof evaluateParcelFile>; parcels: { id: string; input: MassingInput }[] } {
  const collection = json("quillmere-parcels.geojson") as { features: { id: string }[] };
  const streets = (json("quillmere-streets.geojson") as { features: { geometry: { coordinates: [number, number][] } }[] }).features.map((f) => f.geometry.coordinates);
  const evaluated = evaluateParcelFile(collection, { coordinates: "lonlat", zoning: json("quillmere-zoning.json") as never, streets, streetDistance: 8, plates: false });
  const parcels = evaluated.evaluated.map((e) => ({ id: collection.features[e.index]!.id, input: e.input }));
  return { collection, evaluated, parcels };
}

const L_LOT: MassingInput = {
  parcel: { vertices: [[0, 0], [20, 0], [20, 10], [10, 10], [10, 20], [0, 20]], lotLines: ["front", "side", "rear", "side", "rear", "side"] },
  setbacks: { front: 2, side: 1, rear: 3 },
  floorHeight: 3,
  maxHeight: 12,
};

describe("parcelDescriptors", () => {
  it("the L-shaped lot of the README's worked check, derived by hand", () => {
    const d = parcelDescriptors(L_LOT);
    // Derived: 20 × 20 minus the 10 × 10 notch = 300 m²; perimeter 20+10+10+10+10+20 = 80 m; hull (0,0)(20,0)(20,10)(10,20)(0,20)
    // has area 400 − 50 = 350 m², so convexity 300/350; least width 20 m (the hull's edge x = 20 faces x = 0);
    // the front is y = 0, the farthest vertex y = 20; six corners; frontage 20 m.
    expect(d.parcelArea).toBeCloseTo(300, 12);
    expect(d.perimeter).toBeCloseTo(80, 12);
    expect(d.convexity).toBeCloseTo(6 / 7, 12);
    expect(d.leastWidth).toBeCloseTo(20, 12);
    expect(d.frontDepth).toBeCloseTo(20, 12);
    expect(d.corners).toBe(6);
    expect(d.frontage).toBeCloseTo(20, 12);
    // absent controls take the value with the same effect (derived): no FAR cap → 12 m ÷ 2.9 m, no coverage cap → 1,
    // no sky plane → a start at the height cap, no plate minimums → 0
    expect(d.farCap).toBeCloseTo(12 / 2.9, 12);
    expect(d.coverageCap).toBe(1);
    expect(d.skyPlaneStart).toBe(12);
    expect(d.minPlateArea).toBe(0);
    expect(Object.keys(d)).toEqual([...PARCEL_DESCRIPTOR_NAMES]);
  });

  it.skipIf(!hasShapely)("area, perimeter, convexity and least width agree with Shapely on 80 random non-convex lots", () => {
    const cases = (["L-shaped", "flag", "notched", "star-shaped"] as const).flatMap((f) => simpleLotCases(f, 20, "descriptors"));
    const ref = runReference<{ results: { area: number; perimeter: number; hullArea: number; width: number }[] }>("parcel_descriptors_shapely.py", {
      polygons: cases.map((c) => c.parcel.vertices),
    });
    cases.forEach((c, i) => {
      const d = parcelDescriptors(c);
      const r = ref.results[i]!;
      // areas and lengths: both sides sum the same few products in double precision; 1e-9 relative
      expect(Math.abs(d.parcelArea - r.area) / r.area).toBeLessThan(1e-9);
      expect(Math.abs(d.perimeter - r.perimeter) / r.perimeter).toBeLessThan(1e-9);
      expect(Math.abs(d.convexity - r.area / r.hullArea)).toBeLessThan(1e-9);
      // the reference's direction scan overshoots by at most D·π/200,000/2 (D ≤ the perimeter / 2); never undershoots
      const slack = ((d.perimeter / 2) * Math.PI) / 200_000 / 2;
      expect(d.leastWidth).toBeLessThanOrEqual(r.width + 1e-9);
      expect(r.width - d.leastWidth).toBeLessThanOrEqual(slack + 1e-9);
    });
  });

  it("property: descriptors are finite and do not change when the lot is moved or its vertex order reversed", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }), (tx, ty) => {
        const v = L_LOT.parcel.vertices;
        const n = v.length;
        const moved: MassingInput = {
          ...L_LOT,
          parcel: {
            vertices: [...v].reverse().map(([x, y]) => [x + tx, y + ty] as [number, number]),
            lotLines: L_LOT.parcel.lotLines.map((_, i) => L_LOT.parcel.lotLines[(n - 2 - i + n) % n]!),
          },
        };
        const a = parcelDescriptors(L_LOT);
        const b = parcelDescriptors(moved);
        for (const k of PARCEL_DESCRIPTOR_NAMES) {
          expect(Number.isFinite(b[k])).toBe(true);
          expect(Math.abs(a[k] - b[k])).toBeLessThan(1e-6 * Math.max(1, Math.abs(a[k])));
        }
      }),
      { numRuns: 50 },
    );
  });
});

describe("parcelDesignInput", () => {
  it("adds the yard extras to the minimums and scales the caps by their shares (derived)", () => {
    const zone: MassingInput = { ...L_LOT, setbacks: { front: 2, side: 1, rear: 3, street: 4 }, maxCoverage: 0.6 };
    const m = parcelDesignInput(zone, { frontYardExtra: 1, sideYardExtra: 0.5, rearYardExtra: 2, heightShare: 0.75, coverageShare: 0.5, floorHeight: 3.3 });
    expect(m.setbacks).toEqual({ front: 3, side: 1.5, rear: 5, street: 5 });
    expect(m.maxHeight).toBe(9);
    expect(m.maxCoverage).toBeCloseTo(0.3, 15);
    expect(m.floorHeight).toBe(3.3);
    // no coverage cap: the share of 1
    expect(parcelDesignInput(L_LOT, { frontYardExtra: 0, sideYardExtra: 0, rearYardExtra: 0, heightShare: 1, coverageShare: 0.8, floorHeight: 3 }).maxCoverage).toBe(0.8);
  });
  it("parcelEvaluator: the exact rule's numeric outputs; a design the rule refuses gives no outputs (infeasible), never a throw", async () => {
    const ev = parcelEvaluator(L_LOT);
    const good = { frontYardExtra: 0, sideYardExtra: 0, rearYardExtra: 0, heightShare: 1, coverageShare: 1, floorHeight: 3 };
    const [out, refused] = await ev.evaluate([good, { ...good, heightShare: 0 }]);
    // derived (README's worked check): B = 173 m² at these yards; 12 m ÷ 3 m = 4 storeys of 173 m² with no caps
    expect(out!.buildableArea).toBeCloseTo(173, 9);
    expect(out!.gfa).toBeCloseTo(4 * 173, 9);
    expect(out!.limitedBy).toBeUndefined();
    expect(refused).toEqual({});
    expect(ev.count).toBe(2);
  });

  it("names a missing or non-finite design value", () => {
    expect(() => parcelDesignInput(L_LOT, { frontYardExtra: Number.NaN })).toThrow(/parcelDesignInput: design\.frontYardExtra must be a finite number/);
    expect(() => parcelDesignInput(L_LOT, { frontYardExtra: 0, sideYardExtra: 0, rearYardExtra: 0, heightShare: 1, coverageShare: 1 })).toThrow(/design\.floorHeight/);
  });
});

describe("rankParcels on the Quillmere demo parcels (small budgets)", () => {
  const { collection, evaluated, parcels } = demoParcels();
  let dir = "";
  let ranking: ParcelRanking;
  const budget = 40;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), "floorcast-rank-"));
    ranking = await rankParcels(parcels, { route: "both", budget, seed: 3, surrogate: { dir, rows: 48, fitOptions: { restarts: "1" } } });
  }, 120_000);
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("every reported value is the exact rule at the reported design", () => {
    expect(parcels).toHaveLength(12);
    for (const [i, p] of ranking.parcels.entries()) {
      for (const route of [p.exact!, p.surrogate!]) {
        expect(route.value).not.toBeNull();
        const exact = evaluateMassing(parcelDesignInput(parcels[i]!.input, route.design!));
        expect(route.value).toBe(exact.gfa);
        expect(route.outputs!.floors).toBe(exact.floors);
      }
    }
  });

  it("no best gfa exceeds the FAR cap × lot area of its zone (the rule's own bound)", () => {
    for (const [i, p] of ranking.parcels.entries()) {
      const z = parcels[i]!.input;
      if (z.maxFar !== undefined) expect(p.exact!.value!).toBeLessThanOrEqual(z.maxFar * evaluated.evaluated[i]!.result.lotArea * (1 + 1e-12));
    }
  });

  it("ranks are 1…n by value; the agreement is the checked rank statistics on the values", () => {
    const exact = ranking.parcels.map((p) => p.exact!.value!);
    const surr = ranking.parcels.map((p) => p.surrogate!.value!);
    const pred = ranking.parcels.map((p) => p.surrogate!.predicted!);
    const ranks = ranking.parcels.map((p) => p.exact!.rank);
    expect([...ranks].sort((a, b) => a - b)).toEqual(parcels.map((_, i) => i + 1));
    for (const p of ranking.parcels) for (const q of ranking.parcels) if (p.exact!.value! > q.exact!.value!) expect(p.exact!.rank).toBeLessThan(q.exact!.rank);
    const zone = ranking.parcels.map((p) => p.zoneValue!);
    const a = ranking.agreement!;
    expect(a.reevaluated!.spearman).toBe(spearmanRho(exact, surr));
    expect(a.reevaluated!.kendall).toBe(kendallTau(exact, surr));
    expect(a.reevaluated!.topOverlap).toBe(topKOverlap(exact, surr, 3));
    expect(a.predicted!.spearman).toBe(spearmanRho(exact, pred));
    expect(a.zone.spearman).toBe(spearmanRho(exact, zone));
    expect(a.zone.kendall).toBe(kendallTau(exact, zone));
  });

  it.skipIf(!hasScipy)("the reported rho and tau-b match scipy.stats on the reported values", () => {
    const exact = ranking.parcels.map((p) => p.exact!.value!);
    const surr = ranking.parcels.map((p) => p.surrogate!.value!);
    const ref = runReference<{ results: { spearman: number; kendall: number }[] }>("rank_correlation.py", { cases: [{ x: exact, y: surr }] });
    // scipy 1.10 (Debian python3-scipy); both compute in double precision from the same ranks: 1e-12
    expect(Math.abs(ranking.agreement!.reevaluated!.spearman - ref.results[0]!.spearman)).toBeLessThan(1e-12);
    expect(Math.abs(ranking.agreement!.reevaluated!.kendall - ref.results[0]!.kendall)).toBeLessThan(1e-12);
  });

  it("the baseline is the exact rule at the zone's own controls, and no search finds less", () => {
    for (const [i, p] of ranking.parcels.entries()) {
      const z = parcels[i]!.input;
      expect(p.zoneValue).toBe(evaluateMassing(z).gfa);
      // the zone's own controls are one design of the box (no extra yards, full shares, the zone's floor height)
      // the optimizer may miss it, so only the optimum over the box is bounded: within 1% of it or above (measured 0.2%)
      expect(p.exact!.value!).toBeGreaterThanOrEqual(0.99 * p.zoneValue!);
    }
  });

  it("the surrogate's own predictions rank the parcels (rho ≥ 0.8) and the re-evaluated top parcel is the exact one", () => {
    // The predictions alone are the test of what the surrogate learned across parcels: measured 0.97 with budget 150
    // (README) and 0.39 below zero when trained on one parcel only; the bar sits between. The re-evaluated ranking is
    // not such a test: the exact value of any reasonable design already ranks these parcels (the zone baseline).
    console.log(`rank agreement (budget ${budget}): ${JSON.stringify(ranking.agreement)}`);
    expect(ranking.agreement!.predicted!.spearman).toBeGreaterThanOrEqual(0.8);
    const top = (key: "exact" | "surrogate") => ranking.parcels.find((p) => p[key]!.rank === 1)!.id;
    expect(top("surrogate")).toBe(top("exact"));
  });

  it("counts the exact evaluations each route spent", () => {
    const e = ranking.evaluations;
    // particle swarm spends exactly its budget on each parcel
    expect(e.exact).toBe(budget * parcels.length);
    expect(e.zone).toBe(parcels.length);
    expect(e.surrogate!.training).toBe(48);
    // at least the chosen design per parcel, at most the 3 candidates
    expect(e.surrogate!.reevaluation).toBeGreaterThanOrEqual(parcels.length);
    expect(e.surrogate!.reevaluation).toBeLessThanOrEqual(3 * parcels.length);
    expect(e.surrogate!.total).toBe(e.surrogate!.training + e.surrogate!.reevaluation);
    expect(ranking.surrogate!.trainingParcels).toHaveLength(8);
    expect(ranking.parcels.filter((p) => p.surrogate!.trained).map((p) => p.id)).toEqual(ranking.surrogate!.trainingParcels);
    expect(ranking.caution).toMatch(/not a zoning determination/);
  });

  it("the ranked GeoJSON carries rank and capacity on every parcel", () => {
    const out = rankedParcelCollection(evaluated.collection, evaluated.evaluated, ranking) as { fc_caution: string; features: { id: string; properties: Record<string, unknown> }[] };
    expect(out.fc_caution).toMatch(/not a zoning determination/);
    expect(out.features).toHaveLength((collection as { features: unknown[] }).features.length);
    for (const [i, f] of out.features.entries()) {
      const p = ranking.parcels[i]!;
      expect(f.id).toBe(p.id);
      expect(f.properties.fc_rank).toBe(p.exact!.rank);
      expect(f.properties.fc_capacity).toBe(p.exact!.value);
      expect(f.properties.fc_rankSurrogate).toBe(p.surrogate!.rank);
      expect(f.properties.fc_rankPredicted).toBe(p.surrogate!.predictedRank);
      expect(f.properties.fc_gfa).toBeDefined(); // the massing results stay
    }
  });
});

describe("rankParcels: the exact route alone", () => {
  const { parcels } = demoParcels();
  it("is reproducible from its seed and does not depend on the parcels' order", async () => {
    const some = parcels.slice(0, 4);
    const a = await rankParcels(some, { route: "exact", budget: 15, seed: 7, optimizer: "random" });
    const b = await rankParcels([...some].reverse(), { route: "exact", budget: 15, seed: 7, optimizer: "random" });
    expect(a.surrogate).toBeNull();
    expect(a.agreement!.reevaluated).toBeNull();
    expect(a.agreement!.predicted).toBeNull();
    expect(a.evaluations.zone).toBe(4);
    for (const p of a.parcels) {
      const q = b.parcels.find((x) => x.id === p.id)!;
      expect(q.exact!.value).toBe(p.exact!.value);
      expect(q.exact!.rank).toBe(p.exact!.rank);
    }
  });
});

describe("rankParcels: a minimised objective", () => {
  const { parcels } = demoParcels();
  it("ranks the least value first", async () => {
    const r = await rankParcels(parcels.slice(0, 5), { route: "exact", budget: 10, seed: 1, optimizer: "lhs", objective: { output: "coverage", sense: "min" } });
    const byRank = [...r.parcels].sort((a, b) => a.exact!.rank - b.exact!.rank).map((p) => p.exact!.value!);
    for (let i = 1; i < byRank.length; i++) expect(byRank[i]!).toBeGreaterThanOrEqual(byRank[i - 1]!);
    expect(r.objective).toEqual({ output: "coverage", sense: "min" });
  });
});

describe("rankParcels: bad options name the field", () => {
  const { parcels } = demoParcels();
  it.each([
    [[parcels[0]!], { route: "exact" }, RangeError, /rankParcels: parcels must hold at least 2 parcels/],
    [parcels, { route: "fast" }, RangeError, /rankParcels: route must be exact, surrogate or both/],
    [parcels, { route: "exact", budget: 0 }, RangeError, /rankParcels: budget must be an integer in \[1/],
    [parcels, { route: "exact", budget: Number.NaN }, RangeError, /rankParcels: budget/],
    [parcels, { route: "exact", budget: "9" }, TypeError, /rankParcels: budget must be a number/],
    [parcels, { route: "exact", shortlist: 13 }, RangeError, /rankParcels: shortlist must be an integer in \[1, 12\]/],
    [parcels, { route: "exact", optimizer: "nsga2" }, RangeError, /rankParcels: optimizer must optimize one objective/],
    [parcels, { route: "surrogate" }, TypeError, /rankParcels: surrogate\.dir/],
    [parcels, { route: "exact", objective: { output: "limitedBy", sense: "max" } }, RangeError, /rankParcels: objective\.output must be one of lotArea/],
    [parcels, { route: "exact", objective: { output: "gfa", sense: "up" } }, RangeError, /rankParcels: objective\.sense must be max or min/],
    [parcels, { route: "exact", constraints: [{ output: "storeys", op: "<=", value: 3 }] }, RangeError, /rankParcels: constraints\.0\.output/],
    [parcels, { route: "surrogate", surrogate: { dir: tmpdir(), trainingParcels: 0 } }, RangeError, /surrogate\.trainingParcels/],
  ] as const)("%#", async (ps, options, type, message) => {
    const p = rankParcels(ps as never, options as never);
    await expect(p).rejects.toThrow(type);
    await expect(rankParcels(ps as never, options as never)).rejects.toThrow(message);
  });
  it("a parcels argument that is not an array is a TypeError", async () => {
    await expect(rankParcels("parcels" as never, { route: "exact" })).rejects.toThrow(/rankParcels: parcels must be an array/);
  });
});
